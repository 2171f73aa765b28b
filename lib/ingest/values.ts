import { z } from "zod";

/** Cells a field sheet uses for "nothing recorded here" (a lost plot or quadrat). */
const missingMarkers = new Set(["", "na", "n/a", "-", ".", "missing", "lost"]);

export type CellReading =
  | { kind: "number"; value: number }
  | { kind: "missing" }
  | { kind: "decimal-comma" }
  | { kind: "text" };

const numberSchema = z
  .string()
  .regex(/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i)
  .transform(Number)
  .pipe(z.number().refine(Number.isFinite));

export function readNumberCell(raw: string | undefined): CellReading {
  const cell = (raw ?? "").trim();
  if (missingMarkers.has(cell.toLowerCase())) return { kind: "missing" };
  const parsed = numberSchema.safeParse(cell);
  if (parsed.success) return { kind: "number", value: parsed.data };
  if (/^[+-]?\d+,\d+$/.test(cell)) return { kind: "decimal-comma" };
  return { kind: "text" };
}

const wholeNumberSchema = z.string().trim().regex(/^\d{1,6}$/).transform(Number);

export function readWholeNumber(raw: string | undefined): number | null {
  const parsed = wholeNumberSchema.safeParse(raw ?? "");
  return parsed.success ? parsed.data : null;
}

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

/**
 * Field sheets repeat the same few cells (counts 0 to 40, quadrats 1 to 10, plot numbers)
 * thousands of times; each distinct cell goes through its zod schema once, and the answer is
 * reused for the rest of the file. Bounded, so a file of all-different cells cannot grow it.
 */
class CellMemo<T> {
  private readonly known = new Map<string, T>();
  constructor(
    private readonly read: (raw: string) => T,
    private readonly limit = 20_000,
  ) {}

  get(raw: string): T {
    let reading = this.known.get(raw);
    if (reading === undefined) {
      reading = this.read(raw);
      if (this.known.size < this.limit) this.known.set(raw, reading);
    }
    return reading;
  }
}

function readNumberCellOnce(raw: string): CellReading {
  const cell = raw.trim();
  if (missingMarkers.has(cell.toLowerCase())) return { kind: "missing" };
  const parsed = numberSchema.safeParse(cell);
  if (parsed.success) return { kind: "number", value: parsed.data };
  if (/^[+-]?\d+,\d+$/.test(cell)) return { kind: "decimal-comma" };
  return { kind: "text" };
}

const numberCells = new CellMemo(readNumberCellOnce);

/** The readings are shared between rows: read them, never change them. */
export function readNumberCell(raw: string | undefined): Readonly<CellReading> {
  return numberCells.get(raw ?? "");
}

const wholeNumberSchema = z.string().trim().regex(/^\d{1,6}$/).transform(Number);

const wholeNumberCells = new CellMemo((raw: string) => {
  const parsed = wholeNumberSchema.safeParse(raw);
  return parsed.success ? parsed.data : null;
});

export function readWholeNumber(raw: string | undefined): number | null {
  return wholeNumberCells.get(raw ?? "");
}

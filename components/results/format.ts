/** Numbers the way weed-science tables print them. */
export function num(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  const size = Math.abs(value);
  if (size >= 1000) return value.toFixed(0);
  if (size >= 100) return value.toFixed(1);
  if (size >= 1 || size === 0) return value.toFixed(digits - 1);
  return value.toPrecision(digits);
}

export function pValue(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return "";
  if (p < 0.0001) return "<0.0001";
  return p.toFixed(4);
}

export const sourceLabels: Record<string, string> = {
  block: "Block (replicate)",
  treatment: "Treatment",
  residual: "Error",
  row: "Row",
  column: "Column",
  site: "Site",
  "block(site)": "Block within site",
  "site:treatment": "Site × treatment",
};

/** "p = 0.0123" or "p < 0.0001", for sentences. */
export function pText(p: number | null | undefined): string {
  const text = pValue(p);
  return text.startsWith("<") ? `p ${text.replace("<", "< ")}` : `p = ${text || "–"}`;
}

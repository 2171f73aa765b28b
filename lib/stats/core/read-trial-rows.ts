import { StatsInputError } from "../errors";

/** A plot as read from a table: named columns with text or numbers. */
export type TrialRow = Record<string, unknown>;

/** Plots that have a response: labels per requested column and the response as given. */
export interface TrialPlots {
  labels: Record<string, string[]>;
  responses: Array<string | number>;
  rawValues: Float64Array;
  dropped: number;
}

/**
 * Picks the analysed plots out of table rows: labels stay text, an empty or
 * "NA" response is a lost plot and is dropped, anything else must be a number.
 *
 * Why responses are kept as given: decimal text is centred exactly later
 * (centreDecimalValues), which rounding to double here would spoil.
 *
 * Reference: contract analysis-cli.md (input rules).
 *
 * @example
 * readTrialRows([{ t: "A", y: "1.5" }, { t: "B", y: "NA" }], "y", ["t"])
 * // { labels: { t: ["A"] }, responses: ["1.5"], rawValues: Float64Array [1.5], dropped: 1 }
 */
export function readTrialRows(rows: ReadonlyArray<TrialRow>, response: string, labelColumns: string[]): TrialPlots {
  if (rows.length === 0) throw new StatsInputError("analysis requires at least one data row");
  const known = new Set<string>();
  for (const row of rows) for (const key of Object.keys(row)) known.add(key);
  for (const column of [response, ...labelColumns]) {
    if (!known.has(column)) {
      throw new StatsInputError(`analysis requires column "${column}", which is not in the data (columns: ${Array.from(known).join(", ")})`);
    }
  }
  const labels: Record<string, string[]> = {};
  for (const column of labelColumns) labels[column] = [];
  const responses: Array<string | number> = [];
  const raw: number[] = [];
  let dropped = 0;
  rows.forEach((row, index) => {
    const value = row[response];
    const text = typeof value === "string" ? value.trim() : value;
    if (text === undefined || text === null || text === "" || text === "NA" || (typeof text === "number" && Number.isNaN(text))) {
      dropped++;
      return;
    }
    const number = typeof text === "number" ? text : typeof text === "string" && isNumeric(text) ? Number(text) : Number.NaN;
    if (!Number.isFinite(number)) {
      throw new StatsInputError(`analysis requires a numeric response: "${String(value)}" in column "${response}" at row ${index + 1}`);
    }
    for (const column of labelColumns) {
      const label = row[column];
      const labelText = label === undefined || label === null ? "" : String(label).trim();
      if (labelText === "") throw new StatsInputError(`analysis requires a ${column} label at row ${index + 1}`);
      labels[column].push(labelText);
    }
    responses.push(text as string | number);
    raw.push(number);
  });
  return { labels, responses, rawValues: Float64Array.from(raw), dropped };
}

function isNumeric(text: string): boolean {
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text);
}

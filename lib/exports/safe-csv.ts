import Papa from "papaparse";

/**
 * A spreadsheet runs a cell starting with =, +, - or @ (or a tab or carriage return) as a
 * formula; a leading apostrophe makes it plain text. Numbers are written as numbers.
 */
export function neutraliseCell(cell: string | number | null | undefined): string | number {
  if (cell === null || cell === undefined) return "";
  if (typeof cell === "number") return cell;
  return /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
}

export function toSafeCsv(header: string[], rows: (string | number | null)[][]): string {
  return Papa.unparse({ fields: header, data: rows.map((row) => row.map(neutraliseCell)) }, { newline: "\r\n" });
}

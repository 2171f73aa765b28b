/**
 * One CSV field per RFC 4180: quoted when it holds a comma, quote, CR or LF, with quotes
 * doubled. Text that a spreadsheet would run as a formula (starting with =, +, -, @, tab or
 * CR) gets a leading apostrophe, as the OWASP guidance on CSV injection suggests; the
 * template's own cells are plot numbers and blanks, so only user-named codes can trigger it.
 */
export function csvField(value: string | number): string {
  let text = String(value);
  if (typeof value === "string" && /^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(fields: (string | number)[]): string {
  return fields.map(csvField).join(",");
}

import type { IngestProblem } from "./types";

const signatures: { bytes: number[]; name: string }[] = [
  { bytes: [0x50, 0x4b, 0x03, 0x04], name: "a spreadsheet workbook or ZIP archive (for example .xlsx)" },
  { bytes: [0xd0, 0xcf, 0x11, 0xe0], name: "an old-style spreadsheet workbook (.xls)" },
  { bytes: [0x25, 0x50, 0x44, 0x46], name: "a PDF document" },
  { bytes: [0x89, 0x50, 0x4e, 0x47], name: "a PNG image" },
  { bytes: [0xff, 0xd8, 0xff], name: "a JPEG photo" },
  { bytes: [0x7b, 0x5c, 0x72, 0x74, 0x66], name: "a rich-text document (.rtf)" },
];

const startsWith = (head: Uint8Array, bytes: number[]) => bytes.every((byte, index) => head[index] === byte);

/**
 * Looks at the first bytes of a file to tell a CSV from something else before parsing, so
 * that a workbook or a UTF-16 export gets a message that says what to do, not a list of
 * nonsense rows.
 */
export function sniffFile(head: Uint8Array): IngestProblem | null {
  if (head.length === 0) {
    return { severity: "error", code: "empty-file", message: "The file is empty. Fill in the data sheet and upload it again." };
  }
  for (const signature of signatures) {
    if (startsWith(head, signature.bytes)) {
      return {
        severity: "error",
        code: "not-csv",
        message: `This file is ${signature.name}, not a CSV file. In your spreadsheet, choose "Save as" → "CSV (comma-separated)" and upload that.`,
      };
    }
  }
  if (startsWith(head, [0xff, 0xfe]) || startsWith(head, [0xfe, 0xff])) {
    return {
      severity: "error",
      code: "encoding",
      message: 'The file is saved as UTF-16 text. Save it as "CSV UTF-8 (comma-separated)" and upload it again.',
    };
  }
  if (head.includes(0)) {
    return { severity: "error", code: "not-csv", message: "The file contains binary data, so it is not a CSV file. Upload the CSV export of the data sheet." };
  }
  return null;
}

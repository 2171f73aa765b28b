/**
 * The name an upload is remembered by, only so people recognise it later. Browsers send a bare
 * name, but a hand-made request can send a path, control characters or anything else, so only
 * the last path segment is kept, with every character outside a plain set replaced and no
 * leading dots (no hidden or parent-directory names). Storage keys never use it.
 */
export function safeOriginalName(name: string): string {
  const lastSegment = name.split(/[\\/]/).pop() ?? "";
  const cleaned = lastSegment.replace(/[^\w .()-]/g, "_").replace(/^[.\s]+/, "").slice(0, 200);
  return cleaned === "" ? "upload.csv" : cleaned;
}

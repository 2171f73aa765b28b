import { AppError } from "@/lib/errors";

/**
 * The most a JSON request body may hold. Files never pass through the app (data files and
 * photos go to object storage by presigned PUT), and the largest form (40 treatments with
 * their descriptions, or a 20,000-character summary with the text it was based on) stays
 * well under a few hundred kilobytes, so 1 MB leaves room without letting one request
 * hold a worker's memory.
 */
export const MAX_JSON_BODY_BYTES = 1024 * 1024;

export const bodyTooLarge = () =>
  new AppError("PAYLOAD_TOO_LARGE", "The request is larger than 1 MB, the most this app accepts in one request. Nothing was saved.");

/**
 * The body as text, refusing it before reading when its declared length is over the limit
 * and as soon as it grows past the limit when it declares none (chunked transfer), so a
 * client cannot make the server buffer more than the limit.
 */
export async function readBodyText(request: Request, limit = MAX_JSON_BODY_BYTES): Promise<string> {
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > limit) throw bodyTooLarge();
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > limit) {
      // Cancelling tells the server to stop reading the rest from the socket.
      await reader.cancel().catch(() => {});
      throw bodyTooLarge();
    }
    chunks.push(value);
  }
  // As request.text() decodes: UTF-8, bad bytes replaced rather than refused.
  return new TextDecoder().decode(Buffer.concat(chunks));
}

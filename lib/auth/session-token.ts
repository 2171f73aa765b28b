import { decode, type JWT, type JWTDecodeParams } from "next-auth/jwt";
import { LruCache } from "@/lib/lru-cache";
import { sessionSecondsLeft } from "./session-age";

/*
 * Decrypting a session cookie (key derivation plus AES-GCM) was a large share of every
 * request's time under load, and the proxy and the page each did it. A token never changes
 * once issued, so its payload is kept under the exact token string until the token's own
 * expiry; a forged or altered token never matches an entry and fails decryption as before.
 */
const decodedTokens = new LruCache<JWT>(5000);

/** next-auth's decode, remembered per token; null for a token that is missing, invalid or expired. */
export async function decodeSessionToken({ token, secret }: JWTDecodeParams): Promise<JWT | null> {
  if (!token) return null;
  let payload = decodedTokens.get(token);
  if (!payload) {
    try {
      payload = (await decode({ token, secret })) ?? undefined;
    } catch {
      return null;
    }
    if (!payload) return null;
    decodedTokens.set(token, payload);
  }
  // Both the token's own expiry and the session's absolute end, so no re-issued token outlives it.
  const now = Date.now();
  return typeof payload.exp === "number" && payload.exp * 1000 > now && sessionSecondsLeft(payload.signedInAt, now) > 0 ? payload : null;
}

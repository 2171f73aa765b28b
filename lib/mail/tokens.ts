import { createHash, randomBytes } from "node:crypto";

/** A link token: 32 random bytes for the link, and the only thing stored, its SHA-256. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

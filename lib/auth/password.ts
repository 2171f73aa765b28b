import bcrypt from "bcrypt";

// Cost 10 stays within common guidance. The native module hashes on libuv's thread pool, so a
// sign-in no longer holds the event loop (and every other request) for its 60 ms.
const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

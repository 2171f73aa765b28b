import bcrypt from "bcryptjs";

// Cost 10 keeps sign-in near 60 ms on a small server while staying within common guidance.
const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

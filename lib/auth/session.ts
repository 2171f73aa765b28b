import "server-only";
import { cookies } from "next/headers";
import { decode, getToken } from "next-auth/jwt";
import { LruCache } from "@/lib/lru-cache";
import { config } from "@/lib/config";
import { notSignedIn } from "@/lib/errors";
import type { Role } from "./roles";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

interface DecodedSession {
  user: SessionUser;
  expiresAtMs: number;
}

/*
 * Decrypting the session cookie (key derivation plus AES-GCM) was a large share of every
 * request's time under load. A token never changes once issued, so its decoded form is kept
 * under the exact token string until the token's own expiry; a forged or altered token can
 * never match an entry, it fails decryption as before.
 */
const decodedSessions = new LruCache<DecodedSession>(5000);

async function sessionToken(): Promise<string | null> {
  const jar = await cookies();
  const cookieValues = Object.fromEntries(jar.getAll().map((cookie) => [cookie.name, cookie.value]));
  // No headers: the session comes from its cookie only, never from an Authorization header.
  const token = await getToken({ req: { cookies: cookieValues, headers: {} } as never, raw: true, secret: config().NEXTAUTH_SECRET });
  return typeof token === "string" && token.length > 0 ? token : null;
}

async function decodeSession(token: string): Promise<DecodedSession | null> {
  try {
    const payload = await decode({ token, secret: config().NEXTAUTH_SECRET });
    if (!payload?.userId || typeof payload.exp !== "number") return null;
    // The same shape the session callback in ./options gives next-auth's own session endpoint.
    return { user: { id: payload.userId, email: payload.email ?? "", name: payload.name ?? "", role: payload.role }, expiresAtMs: payload.exp * 1000 };
  } catch {
    return null;
  }
}

/**
 * The signed-in user from the session cookie, or null. Sessions last SESSION_MAX_AGE_SECONDS
 * from sign-in: reading one does not extend it.
 */
export async function currentUser(): Promise<SessionUser | null> {
  const token = await sessionToken();
  if (!token) return null;
  let session = decodedSessions.get(token);
  if (!session) {
    const decoded = await decodeSession(token);
    if (!decoded) return null;
    session = decoded;
    decodedSessions.set(token, session);
  }
  return session.expiresAtMs > Date.now() ? session.user : null;
}

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw notSignedIn();
  return user;
}

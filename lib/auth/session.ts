import "server-only";
import { cookies } from "next/headers";
import { getToken } from "next-auth/jwt";
import { config } from "@/lib/config";
import { notSignedIn } from "@/lib/errors";
import type { Role } from "./roles";
import { decodeSessionToken } from "./session-token";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

async function sessionToken(): Promise<string | null> {
  const jar = await cookies();
  const cookieValues = Object.fromEntries(jar.getAll().map((cookie) => [cookie.name, cookie.value]));
  // No headers: the session comes from its cookie only, never from an Authorization header.
  const token = await getToken({ req: { cookies: cookieValues, headers: {} } as never, raw: true });
  return typeof token === "string" && token.length > 0 ? token : null;
}

/**
 * The signed-in user from the session cookie, or null. Sessions last SESSION_MAX_AGE_SECONDS
 * from sign-in: reading one does not extend it.
 */
export async function currentUser(): Promise<SessionUser | null> {
  const token = await sessionToken();
  const payload = token ? await decodeSessionToken({ token, secret: config().NEXTAUTH_SECRET }) : null;
  if (!payload?.userId) return null;
  // The same shape the session callback in ./options gives next-auth's own session endpoint.
  return { id: payload.userId, email: payload.email ?? "", name: payload.name ?? "", role: payload.role };
}

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw notSignedIn();
  return user;
}

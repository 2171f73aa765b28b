import "server-only";
import { getServerSession } from "next-auth";
import { authOptions } from "./options";
import type { Role } from "./roles";
import { notSignedIn } from "@/lib/errors";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export async function currentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  return session?.user?.id ? session.user : null;
}

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw notSignedIn();
  return user;
}

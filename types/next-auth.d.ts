import type { Role } from "@/lib/auth/roles";

declare module "next-auth" {
  interface Session {
    user: { id: string; email: string; name: string; role: Role };
  }
  interface User {
    id: string;
    email: string;
    name: string;
    role: Role;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    userId: string;
    role: Role;
    name: string;
    /** Seconds since the epoch at sign-in; the session ends SESSION_MAX_AGE_SECONDS later, however often it is read. */
    signedInAt: number;
  }
}

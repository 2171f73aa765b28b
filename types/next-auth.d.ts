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
  }
}

import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { signInSchema } from "@/lib/validations/auth";
import { findUserForSignIn } from "@/lib/data/users";
import { verifyPassword } from "./password";
import { assertSignInAllowed, clientAddressOf, recordFailedSignIn } from "./sign-in-throttle";

// A hash of a random password, so an unknown e-mail costs as much time as a wrong password.
const DUMMY_HASH = "$2b$10$CwTycUXWue0Thq9StjUM0uJ8.pkaSIuiuUe0yzDxdxYZBnNVvyVwe";

export const SESSION_MAX_AGE_SECONDS = 8 * 60 * 60;

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, request) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) return null;
        const clientAddress = clientAddressOf(request?.headers);
        // Both before the hash comparison, at once: a refused attempt never reaches it.
        const [, user] = await Promise.all([assertSignInAllowed(parsed.data.email, clientAddress), findUserForSignIn(parsed.data.email)]);
        const passwordMatches = await verifyPassword(parsed.data.password, user?.passwordHash ?? DUMMY_HASH);
        if (!user || !user.active || !passwordMatches) {
          await recordFailedSignIn(parsed.data.email, clientAddress);
          return null;
        }
        return { id: user.id, email: user.email, name: user.name, role: user.role };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.userId = user.id;
        token.role = user.role;
        token.name = user.name;
      }
      return token;
    },
    session({ session, token }) {
      session.user = { id: token.userId, email: token.email ?? "", name: token.name, role: token.role };
      return session;
    },
  },
};

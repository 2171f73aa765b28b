import type { NextAuthOptions } from "next-auth";
import { encode } from "next-auth/jwt";
import CredentialsProvider from "next-auth/providers/credentials";
import { signInSchema } from "@/lib/validations/auth";
import { findUserForSignIn } from "@/lib/data/users";
import { verifyPassword } from "./password";
import { SESSION_MAX_AGE_SECONDS, sessionSecondsLeft } from "./session-age";
import { decodeSessionToken } from "./session-token";
import { assertSignInAllowed, clientAddressOf, recordFailedSignIn } from "./sign-in-throttle";

// A hash of a random password, so an unknown e-mail costs as much time as a wrong password.
const DUMMY_HASH = "$2b$10$CwTycUXWue0Thq9StjUM0uJ8.pkaSIuiuUe0yzDxdxYZBnNVvyVwe";

export { SESSION_MAX_AGE_SECONDS };

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  jwt: {
    // next-auth re-issues the cookie on every session read with a fresh maxAge; the token's
    // expiry stays where sign-in put it instead, so a session cannot be kept alive forever.
    async encode(params) {
      const signedInAt = params.token?.signedInAt ?? Math.floor(Date.now() / 1000);
      return encode({ ...params, maxAge: sessionSecondsLeft(signedInAt) });
    },
    decode: decodeSessionToken,
  },
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
        token.signedInAt = Math.floor(Date.now() / 1000);
      }
      return token;
    },
    session({ session, token }) {
      session.user = { id: token.userId, email: token.email ?? "", name: token.name, role: token.role };
      return session;
    },
  },
};

import { decode, encode } from "next-auth/jwt";
import { describe, expect, it } from "vitest";
import { SESSION_MAX_AGE_SECONDS, sessionSecondsLeft } from "@/lib/auth/session-age";
import { User } from "@/models";
import { testDatabase } from "../support/database";
import { testEnvironment } from "../support/environment";
import { signInSetCookie } from "../support/http";

const COOKIE = "next-auth.session-token";
const secret = () => process.env.NEXTAUTH_SECRET!;
const url = (path: string) => new URL(path, testEnvironment().baseUrl);

function sessionCookieIn(response: Response): string | null {
  const header = response.headers.getSetCookie().find((cookie) => cookie.startsWith(`${COOKIE}=`));
  return header ? header.slice(COOKIE.length + 1).split(";")[0] : null;
}

async function signIn(email: string): Promise<string> {
  const setCookie = await signInSetCookie(email);
  if (!setCookie) throw new Error(`could not sign in as ${email}`);
  return setCookie.slice(COOKIE.length + 1).split(";")[0];
}

const withToken = (token: string) => ({ headers: { cookie: `${COOKIE}=${token}` }, redirect: "manual" as const });

describe("sessions", () => {
  it("counts the seconds left from sign-in, never below zero", () => {
    const signedInAt = 1_800_000_000;
    expect(sessionSecondsLeft(signedInAt, signedInAt * 1000)).toBe(8 * 60 * 60);
    expect(sessionSecondsLeft(signedInAt, (signedInAt + 3600) * 1000)).toBe(7 * 60 * 60);
    expect(sessionSecondsLeft(signedInAt, (signedInAt + 9 * 3600) * 1000)).toBe(0);
    expect(sessionSecondsLeft(undefined)).toBe(0);
  });

  it("end 8 hours after sign-in: reading the session re-issues the cookie with the same end", async () => {
    const first = await signIn("reviewer@hoebench.test");
    const signedIn = (await decode({ token: first, secret: secret() }))!;
    const expiresAt = Number(signedIn.exp);
    expect(expiresAt - signedIn.signedInAt).toBeGreaterThanOrEqual(SESSION_MAX_AGE_SECONDS - 1);
    expect(expiresAt - signedIn.signedInAt).toBeLessThanOrEqual(SESSION_MAX_AGE_SECONDS);

    await new Promise((resolve) => setTimeout(resolve, 1100));
    const read = await fetch(url("/api/auth/session"), withToken(first));
    expect(read.status).toBe(200);
    const reissued = sessionCookieIn(read);
    expect(reissued).not.toBeNull();
    const after = (await decode({ token: reissued!, secret: secret() }))!;
    expect(after.signedInAt).toBe(signedIn.signedInAt);
    expect(Math.abs(Number(after.exp) - expiresAt)).toBeLessThanOrEqual(1);
  });

  it("refuse a token whose sign-in lies more than 8 hours back, even one whose own expiry is still ahead", async () => {
    testDatabase();
    const reviewer = (await User.findOne({ where: { email: "reviewer@hoebench.test" } }))!;
    const now = Math.floor(Date.now() / 1000);
    const tokenSignedInAt = (signedInAt: number) =>
      encode({ token: { userId: reviewer.id, role: reviewer.role, name: reviewer.name, email: reviewer.email, signedInAt }, secret: secret(), maxAge: 3600 });

    const recent = await tokenSignedInAt(now - SESSION_MAX_AGE_SECONDS + 120);
    expect((await fetch(url("/api/trials"), withToken(recent))).status).toBe(200);

    const stale = await tokenSignedInAt(now - SESSION_MAX_AGE_SECONDS - 60);
    expect((await fetch(url("/api/trials"), withToken(stale))).status).toBe(401);
    const page = await fetch(url("/"), withToken(stale));
    expect(page.status).toBe(307);
    expect(page.headers.get("location")).toMatch(/\/signin/);
    const session = await (await fetch(url("/api/auth/session"), withToken(stale))).json();
    expect(session).toEqual({});
  });
});

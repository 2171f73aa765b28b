import { describe, expect, it } from "vitest";
import { signInSetCookie } from "../support/http";

const EIGHT_HOURS_MS = 8 * 60 * 60 * 1000;

function attributesOf(setCookie: string): Map<string, string> {
  const [, ...parts] = setCookie.split(";");
  return new Map(
    parts.map((part) => {
      const index = part.indexOf("=");
      return index < 0 ? [part.trim().toLowerCase(), ""] : [part.slice(0, index).trim().toLowerCase(), part.slice(index + 1).trim()];
    }),
  );
}

describe("the session cookie set at sign-in", () => {
  it("is HttpOnly, SameSite=Lax, for the whole site, and lasts at most 8 hours", async () => {
    const before = Date.now();
    const setCookie = await signInSetCookie("technician@hoebench.test");
    expect(setCookie, "sign-in sets a session cookie").toBeDefined();
    const attributes = attributesOf(setCookie!);
    expect(attributes.has("httponly")).toBe(true);
    expect(attributes.get("samesite")?.toLowerCase()).toBe("lax");
    expect(attributes.get("path")).toBe("/");
    // No Domain: the cookie goes back to this host only, never to sibling subdomains.
    expect(attributes.has("domain")).toBe(false);

    // A cookie without Expires or Max-Age would live as long as the browser; one of them must bound it.
    const expires = attributes.get("expires");
    const maxAge = attributes.get("max-age");
    expect(expires ?? maxAge, "the cookie has a lifetime").toBeDefined();
    if (expires !== undefined) {
      const lifetime = Date.parse(expires) - before;
      expect(lifetime).toBeGreaterThan(0);
      // Expires has whole seconds, and the clock read above came before the server's.
      expect(lifetime).toBeLessThanOrEqual(EIGHT_HOURS_MS + 2000);
    }
    if (maxAge !== undefined) {
      expect(Number(maxAge)).toBeGreaterThan(0);
      expect(Number(maxAge)).toBeLessThanOrEqual(EIGHT_HOURS_MS / 1000);
    }
  });
});

import { describe, expect, it } from "vitest";
import { testEnvironment } from "../support/environment";

describe("responses from the running app", () => {
  // A page, an API answer and an error: the headers come from next.config.ts for every path.
  for (const pathname of ["/signin", "/api/library", "/api/trials"]) {
    it(`carry the security headers: ${pathname}`, async () => {
      const response = await fetch(new URL(pathname, testEnvironment().baseUrl), { redirect: "manual" });
      expect(response.headers.get("strict-transport-security")).toBe("max-age=31536000; includeSubDomains");
      expect(response.headers.get("x-frame-options")).toBe("DENY");
      expect(response.headers.get("x-content-type-options")).toBe("nosniff");
      expect(response.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
      expect(response.headers.get("content-security-policy")).not.toContain("unsafe-inline' 'unsafe");
    });
  }

  it("give each page its own nonce, and the page's scripts carry it", async () => {
    const nonces: string[] = [];
    for (let visit = 0; visit < 2; visit += 1) {
      const response = await fetch(new URL("/signin", testEnvironment().baseUrl));
      const policy = response.headers.get("content-security-policy")!;
      const nonce = /'nonce-([^']+)'/.exec(policy)?.[1];
      expect(nonce).toBeTruthy();
      expect(policy).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'(;|$)/);
      const html = await response.text();
      const scripts = html.match(/<script\b[^>]*>/g) ?? [];
      expect(scripts.length).toBeGreaterThan(0);
      for (const script of scripts) expect(script).toContain(`nonce="${nonce}"`);
      nonces.push(nonce!);
    }
    expect(nonces[0]).not.toBe(nonces[1]);
  });
});

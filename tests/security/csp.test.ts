import { describe, expect, it } from "vitest";
import { contentSecurityPolicy } from "@/lib/security/content-security-policy";
import { securityHeaders } from "@/lib/security/headers";

describe("content security policy", () => {
  it("allows this origin and object storage, and nothing else", () => {
    const policy = contentSecurityPolicy({ storageEndpoint: "http://127.0.0.1:4569", development: false });
    expect(policy).toContain("default-src 'self'");
    expect(policy).toContain("connect-src 'self' http://127.0.0.1:4569");
    expect(policy).toContain("frame-ancestors 'none'");
    expect(policy).toContain("object-src 'none'");
    expect(policy).not.toContain("unsafe-eval");
  });

  const scriptSources = (policy: string) => policy.split("; ").find((part) => part.startsWith("script-src"));

  it("runs a page's inline scripts only with its nonce, and no inline script anywhere else", () => {
    expect(scriptSources(contentSecurityPolicy({ development: false, nonce: "bm9uY2U=" }))).toBe("script-src 'self' 'nonce-bm9uY2U=' 'strict-dynamic'");
    expect(scriptSources(contentSecurityPolicy({ development: false }))).toBe("script-src 'self'");
    expect(contentSecurityPolicy({ development: false, nonce: "bm9uY2U=" })).not.toMatch(/script-src[^;]*unsafe-inline/);
  });

  it("lets the development server evaluate its hot-reload code, and only there", () => {
    expect(scriptSources(contentSecurityPolicy({ development: true, nonce: "bm9uY2U=" }))).toBe("script-src 'self' 'nonce-bm9uY2U=' 'strict-dynamic' 'unsafe-eval'");
  });
});

describe("security headers", () => {
  const headers = new Map(securityHeaders().map(({ key, value }) => [key, value]));

  it("tell browsers to keep to HTTPS for a year, subdomains included", () => {
    expect(headers.get("Strict-Transport-Security")).toBe("max-age=31536000; includeSubDomains");
  });

  it("carry frame and sniffing refusals and the referrer policy, and leave the policy to each page", () => {
    expect(headers.has("Content-Security-Policy")).toBe(false);
    expect(headers.get("X-Frame-Options")).toBe("DENY");
    expect(headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(headers.get("Referrer-Policy")).toBe("strict-origin-when-cross-origin");
  });
});

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

  it("lets the development server evaluate its hot-reload code, and only there", () => {
    expect(contentSecurityPolicy({ development: true }).split("; ").find((part) => part.startsWith("script-src"))).toBe("script-src 'self' 'unsafe-inline' 'unsafe-eval'");
  });
});

describe("security headers", () => {
  const headers = new Map(securityHeaders({ storageEndpoint: "http://127.0.0.1:4569", development: false }).map(({ key, value }) => [key, value]));

  it("tell browsers to keep to HTTPS for a year, subdomains included", () => {
    expect(headers.get("Strict-Transport-Security")).toBe("max-age=31536000; includeSubDomains");
  });

  it("carry the policy above, frame and sniffing refusals and the referrer policy", () => {
    expect(headers.get("Content-Security-Policy")).toBe(contentSecurityPolicy({ storageEndpoint: "http://127.0.0.1:4569", development: false }));
    expect(headers.get("X-Frame-Options")).toBe("DENY");
    expect(headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(headers.get("Referrer-Policy")).toBe("strict-origin-when-cross-origin");
  });
});

import { describe, expect, it } from "vitest";
import { contentSecurityPolicy } from "@/lib/security/content-security-policy";

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

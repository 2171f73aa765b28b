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
    });
  }
});

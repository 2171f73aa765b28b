import { describe, expect, it } from "vitest";
import { parseConfig } from "@/lib/config";

describe("configuration", () => {
  it("fills in the loopback defaults of a development machine", () => {
    const settings = parseConfig({});
    expect(settings.DATABASE_URL).toBe("postgres://postgres@127.0.0.1:54329/hoebench");
    expect(settings.S3_FORCE_PATH_STYLE).toBe(true);
    expect(settings.SMTP_PORT).toBe(2525);
    expect(settings.MAIL_CATCHER_URL).toBeUndefined();
  });

  it("names each bad setting", () => {
    expect(() => parseConfig({ DATABASE_URL: "nowhere", SMTP_PORT: "99999" })).toThrow(/DATABASE_URL[\s\S]*SMTP_PORT/);
  });

  it("refuses to run in production on the development secret or base address", () => {
    expect(() => parseConfig({ NODE_ENV: "production" })).toThrow(/NEXTAUTH_SECRET[\s\S]*must be set in production[\s\S]*APP_BASE_URL/);
    expect(() => parseConfig({ NODE_ENV: "production", NEXTAUTH_SECRET: "hoebench-local-development-secret", APP_BASE_URL: "http://127.0.0.1:3000" })).toThrow(
      "invalid configuration: NEXTAUTH_SECRET: must be set in production",
    );
    const settings = parseConfig({ NODE_ENV: "production", NEXTAUTH_SECRET: "a".repeat(32), APP_BASE_URL: "https://trials.example.org" });
    expect(settings.TRUSTED_PROXY_HOPS).toBe(0);
    // npm start serves a production build on loopback, naming its address.
    expect(parseConfig({ NODE_ENV: "production", NEXTAUTH_SECRET: "b".repeat(32), APP_BASE_URL: "http://127.0.0.1:3000" }).APP_BASE_URL).toBe("http://127.0.0.1:3000");
    expect(() => parseConfig({ TRUSTED_PROXY_HOPS: "-1" })).toThrow(/TRUSTED_PROXY_HOPS/);
  });
});

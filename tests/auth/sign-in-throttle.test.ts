import { afterAll, describe, expect, it } from "vitest";
import { hashPassword } from "@/lib/auth/password";
import { signInLimits } from "@/lib/auth/sign-in-throttle";
import { User } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";

const stamp = Date.now();
const emails = [`throttle-a-${stamp}@hoebench.test`, `throttle-b-${stamp}@hoebench.test`];
const PASSWORD = "a-password-for-throttling";

describe("sign-in attempts are limited", () => {
  it("per account: after the limit even the right password is refused, from any address, with the same plain answer", async () => {
    testDatabase();
    for (const email of emails) await User.create({ email, name: "Throttle Test", role: "grower", passwordHash: await hashPassword(PASSWORD) });
    const client = new TestClient({ "x-forwarded-for": `198.51.100.${stamp % 200}` });
    for (let attempt = 0; attempt < signInLimits.perAccount; attempt += 1) {
      expect(await client.signIn(emails[0], "wrong-password")).toBe(false);
      expect(client.lastSignInBody).not.toContain("TooManyAttempts");
    }
    expect(await client.signIn(emails[0], PASSWORD)).toBe(false);
    expect(client.lastSignInBody).toContain("TooManyAttempts");

    const elsewhere = new TestClient({ "x-forwarded-for": "192.0.2.44" });
    expect(await elsewhere.signIn(emails[0], PASSWORD)).toBe(false);

    // The other account, from the same address, is not affected.
    expect(await client.signIn(emails[1], PASSWORD)).toBe(true);
  });

  it("gives an unknown address the same answer as a wrong password", async () => {
    const client = new TestClient({ "x-forwarded-for": "192.0.2.200" });
    expect(await client.signIn(`nobody-${stamp}@hoebench.test`, "whatever-it-is")).toBe(false);
    const unknown = client.lastSignInBody;
    expect(await client.signIn(emails[1], "wrong-password")).toBe(false);
    expect(unknown.replace(/nobody-\d+%40/, "")).toEqual(client.lastSignInBody.replace(/throttle-b-\d+%40/, ""));
  });
});

afterAll(async () => {
  await User.destroy({ where: { email: emails } });
  await testDatabase().close();
});

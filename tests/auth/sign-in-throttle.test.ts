import { afterAll, describe, expect, it } from "vitest";
import { hashPassword } from "@/lib/auth/password";
import { signInLimits } from "@/lib/auth/sign-in-throttle";
import { User } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";

const stamp = Date.now();
const emails = [`throttle-a-${stamp}@hoebench.test`, `throttle-b-${stamp}@hoebench.test`];
// One more than the per-address limit: every one but the last takes a failed attempt.
const crowd = Array.from({ length: signInLimits.perClient + 2 }, (_, index) => `throttle-crowd-${index}-${stamp}@hoebench.test`);
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

  it("per client address: after the limit every account is refused from that address with the same plain answer, and other addresses still get in", async () => {
    const passwordHash = await hashPassword(PASSWORD);
    await User.bulkCreate(crowd.map((email) => ({ email, name: "Throttle Test", role: "grower" as const, passwordHash })));
    // The test server trusts one proxy hop, so the last X-Forwarded-For entry is the client's address.
    const crowdedAddress = `203.0.113.${stamp % 200}`;
    const crowded = new TestClient({ "x-forwarded-for": crowdedAddress });
    const fresh = crowd.slice(signInLimits.perClient);
    for (const email of crowd.slice(0, signInLimits.perClient)) {
      expect(await crowded.signIn(email, "wrong-password"), email).toBe(false);
      expect(crowded.lastSignInBody, email).toContain("CredentialsSignin");
      expect(crowded.lastSignInBody, email).not.toContain("TooManyAttempts");
    }

    // Accounts with no failed attempt of their own, with the right password: refused, and alike.
    expect(await crowded.signIn(fresh[0], PASSWORD)).toBe(false);
    const refused = crowded.lastSignInBody;
    expect(refused).toContain("TooManyAttempts");
    expect(refused).not.toContain("throttle-crowd");
    expect(await crowded.signIn(fresh[1], PASSWORD)).toBe(false);
    expect(crowded.lastSignInBody).toEqual(refused);

    // Writing another address in front of the one the proxy added changes nothing.
    const disguised = new TestClient({ "x-forwarded-for": `192.0.2.9, ${crowdedAddress}` });
    expect(await disguised.signIn(fresh[0], PASSWORD)).toBe(false);
    expect(disguised.lastSignInBody).toEqual(refused);

    const elsewhere = new TestClient({ "x-forwarded-for": `198.51.100.${(stamp % 200) + 1}` });
    expect(await elsewhere.signIn(fresh[0], PASSWORD)).toBe(true);
  }, 120_000);

  it("gives an unknown address the same answer as a wrong password", async () => {
    const client = new TestClient({ "x-forwarded-for": "192.0.2.200" });
    expect(await client.signIn(`nobody-${stamp}@hoebench.test`, "whatever-it-is")).toBe(false);
    const unknown = client.lastSignInBody;
    expect(await client.signIn(emails[1], "wrong-password")).toBe(false);
    expect(unknown.replace(/nobody-\d+%40/, "")).toEqual(client.lastSignInBody.replace(/throttle-b-\d+%40/, ""));
  });
});

afterAll(async () => {
  await User.destroy({ where: { email: [...emails, ...crowd] } });
  await testDatabase().close();
});

import { afterAll, describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { registrationLimits, tooManyRegistrations } from "@/lib/auth/registration-throttle";
import { User } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";

const stamp = Date.now();
const prefix = `register-limit-${stamp}`;
const emailFor = (label: string | number) => `${prefix}-${label}@hoebench.test`;
const form = (email: string) => ({ name: "Sign-up Test", email, password: "a-long-enough-password", confirmPassword: "a-long-enough-password" });

describe("self-registration is limited per client address", () => {
  it("refuses sign-ups past the limit with 429 and a plain message, creating nothing, while other addresses still register", async () => {
    testDatabase();
    // The test server trusts one proxy hop, so the last X-Forwarded-For entry is the client's address.
    const busy = new TestClient({ "x-forwarded-for": `198.18.${stamp % 200}.7` });

    const first = await busy.request("/api/register", { method: "POST", json: form(emailFor(0)) });
    expect(first.status).toBe(201);
    // An existing account keeps its own message (the sign-up form shows it) and still counts.
    const existing = await busy.request("/api/register", { method: "POST", json: form(emailFor(0)) });
    expect(existing.status).toBe(409);
    expect((await existing.json()).error.message).toBe("An account with that e-mail address already exists.");
    for (let index = 2; index < registrationLimits.perClient; index += 1) {
      const response = await busy.request("/api/register", { method: "POST", json: form(emailFor(index)) });
      expect(response.status, `sign-up ${index + 1}`).toBe(201);
    }

    const over = await busy.request("/api/register", { method: "POST", json: form(emailFor("over")) });
    expect(over.status).toBe(429);
    expect(await over.json()).toEqual({ error: { code: "RATE_LIMITED", message: tooManyRegistrations } });
    expect(await User.count({ where: { email: emailFor("over") } })).toBe(0);
    // Past the limit an existing address gets the very same answer: nothing to learn from it.
    const probe = await busy.request("/api/register", { method: "POST", json: form(emailFor(0)) });
    expect(probe.status).toBe(429);
    expect(await probe.json()).toEqual({ error: { code: "RATE_LIMITED", message: tooManyRegistrations } });

    const elsewhere = new TestClient({ "x-forwarded-for": `198.18.${stamp % 200}.8` });
    const other = await elsewhere.request("/api/register", { method: "POST", json: form(emailFor("elsewhere")) });
    expect(other.status).toBe(201);
    // Every attempt from the busy address but the existing-account one made an account, and one came from elsewhere.
    const madeFromBusy = registrationLimits.perClient - 1;
    expect(await User.count({ where: { email: { [Op.like]: `${prefix}-%` } } })).toBe(madeFromBusy + 1);
  }, 120_000);
});

afterAll(async () => {
  await User.destroy({ where: { email: { [Op.like]: `${prefix}-%` } } });
  await testDatabase().close();
});

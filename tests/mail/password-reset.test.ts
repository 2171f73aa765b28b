import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PasswordResetToken } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";
import { createPerson, PERSON_PASSWORD, removePeople } from "./people";
import { caught, linkIn, mailTo, uniqueAddress, waitForMail } from "./support";

let clientNumber = 0;
/** Each test asks from its own (forwarded) client address, so the per-client limit stays apart. */
function fromClient(): (email: string) => Promise<Response> {
  clientNumber += 1;
  const address = `198.51.100.${clientNumber}`;
  const client = new TestClient();
  return (email) => client.request("/api/password-reset", { method: "POST", json: { email }, headers: { "x-forwarded-for": address } });
}

async function resetToken(email: string, after = 0): Promise<string> {
  const mail = await waitForMail((candidate) => mailTo(email, "new Hoebench password")(candidate) && Date.parse(candidate.receivedAt) > after);
  return linkIn(mail, "/reset-password/").pathname.split("/")[2];
}

const confirm = (token: string, password: string) =>
  new TestClient().request("/api/password-reset/confirm", { method: "POST", json: { token, password, confirmPassword: password } });

beforeAll(() => {
  testDatabase();
});

afterAll(async () => {
  await removePeople();
});

describe("password reset", () => {
  it("mails a single-use link that sets a new password", async () => {
    const person = await createPerson("technician", "forgetful");
    const ask = fromClient();
    const response = await ask(person.email);
    expect(response.status).toBe(202);
    const token = await resetToken(person.email);
    const stored = await PasswordResetToken.findOne({ where: { userId: person.id } });
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const page = await new TestClient().request(`/reset-password/${token}`);
    expect(await page.text()).toContain("Choose a new password");

    const done = await confirm(token, "new-hoe-handle-7");
    expect(done.status).toBe(200);
    expect(await new TestClient().signIn(person.email, "new-hoe-handle-7")).toBe(true);
    expect(await new TestClient().signIn(person.email, PERSON_PASSWORD)).toBe(false);

    const reused = await confirm(token, "third-password-9");
    expect(reused.status).toBe(409);
    expect((await reused.json()).error.message).toContain("already been used");
    expect(await (await new TestClient().request(`/reset-password/${token}`)).text()).toContain("already been used");
  });

  it("refuses an expired link with a clear message", async () => {
    const person = await createPerson("reviewer", "slow");
    await fromClient()(person.email);
    const token = await resetToken(person.email);
    await PasswordResetToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: person.id } });
    const response = await confirm(token, "too-late-password");
    expect(response.status).toBe(409);
    expect((await response.json()).error.message).toContain("expired");
    expect(await new TestClient().signIn(person.email, PERSON_PASSWORD)).toBe(true);
  });

  it("answers the same, in similar time, whether or not the address has an account", async () => {
    const person = await createPerson("grower", "known");
    const nobody = uniqueAddress("nobody");
    const ask = fromClient();
    const timed = async (email: string) => {
      const started = performance.now();
      const response = await ask(email);
      return { status: response.status, body: await response.text(), ms: performance.now() - started };
    };
    const known = await timed(person.email);
    const unknown = await timed(nobody);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toBe(known.body);
    expect(Math.abs(known.ms - unknown.ms)).toBeLessThan(250);
    await resetToken(person.email);
    expect((await caught()).filter(mailTo(nobody))).toHaveLength(0);
  });

  it("allows three requests an hour per address, whatever the client", async () => {
    const person = await createPerson("grower", "limited");
    const statuses = [];
    for (let index = 0; index < 4; index += 1) statuses.push((await fromClient()(person.email)).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    const unknown = uniqueAddress("limitedunknown");
    const unknownStatuses = [];
    for (let index = 0; index < 4; index += 1) unknownStatuses.push((await fromClient()(unknown)).status);
    expect(unknownStatuses).toEqual([202, 202, 202, 429]);
  });

  it("allows twenty requests an hour per client address", async () => {
    const ask = fromClient();
    const statuses = [];
    for (let index = 0; index < 21; index += 1) statuses.push((await ask(uniqueAddress("spray"))).status);
    expect(statuses.slice(0, 20).every((status) => status === 202)).toBe(true);
    expect(statuses[20]).toBe(429);
  });
});

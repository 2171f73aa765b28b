import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Invitation, Membership, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";
import { createPerson, PERSON_PASSWORD, rememberAddress, removePeople } from "./people";
import { linkIn, mailTo, uniqueAddress, waitForMail } from "./support";

let fixture: TrialFixture;
let researcher: TestClient;

async function invite(email: string, role = "technician") {
  return researcher.request("/api/invitations", { method: "POST", json: { trialId: fixture.trial.id, email, role } });
}

/** The token in the newest invitation mail to `email` (sent by the app's mail worker). */
async function invitationToken(email: string, notToken?: string): Promise<string> {
  const mail = await waitForMail((candidate) => mailTo(email, "invites you")(candidate) && (!notToken || !candidate.text.includes(notToken)));
  expect(mail.html).toContain(fixture.trial.title);
  return linkIn(mail, "/invite/").pathname.split("/")[2];
}

const accept = (client: TestClient, json: Record<string, unknown>) => client.request("/api/invitations/accept", { method: "POST", json });

beforeAll(async () => {
  testDatabase();
  const owner = await createPerson("researcher", "owner");
  fixture = await createTrialFixture({ ownerEmail: owner.email });
  researcher = new TestClient();
  expect(await researcher.signIn(owner.email, PERSON_PASSWORD)).toBe(true);
});

afterAll(async () => {
  await removeTrialFixtures();
  await removePeople();
});

describe("inviting a new person by e-mail", () => {
  it("sends a link that creates the account and joins the trial, once", async () => {
    const email = uniqueAddress("newtech");
    rememberAddress(email);
    const created = await invite(email);
    expect(created.status).toBe(201);
    expect(await created.json()).toMatchObject({ email, role: "technician", state: "pending" });

    const token = await invitationToken(email);
    const stored = await Invitation.findOne({ where: { email } });
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored!.tokenHash).not.toContain(token);

    const page = await new TestClient().request(`/invite/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Create account and join");

    const visitor = new TestClient();
    const accepted = await accept(visitor, { token, name: "Nadia Fieldhand", password: "weeds-in-rows-1", confirmPassword: "weeds-in-rows-1" });
    expect(accepted.status).toBe(201);
    expect(await accepted.json()).toMatchObject({ trialId: fixture.trial.id, email, createdAccount: true });
    const user = await User.findOne({ where: { email } });
    expect(user?.role).toBe("technician");
    expect(await Membership.count({ where: { trialId: fixture.trial.id, userId: user!.id, role: "technician" } })).toBe(1);

    const member = new TestClient();
    expect(await member.signIn(email, "weeds-in-rows-1")).toBe(true);
    expect((await member.request(`/api/trials/${fixture.trial.id}`)).status).toBe(200);

    const again = await accept(new TestClient(), { token, name: "Someone Else", password: "another-pass-1", confirmPassword: "another-pass-1" });
    expect(again.status).toBe(409);
    expect((await again.json()).error.message).toContain("already been used");
    expect(await (await new TestClient().request(`/invite/${token}`)).text()).toContain("already been used");
  });

  it("refuses an expired link with a clear message", async () => {
    const email = uniqueAddress("late");
    expect((await invite(email)).status).toBe(201);
    const token = await invitationToken(email);
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const response = await accept(new TestClient(), { token, name: "Late Person", password: "weeds-in-rows-1", confirmPassword: "weeds-in-rows-1" });
    expect(response.status).toBe(409);
    expect((await response.json()).error.message).toMatch(/expired.*send it again/);
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it("resends with a new link (the old one stops working) and withdraws", async () => {
    const email = uniqueAddress("resend");
    const created = await (await invite(email, "reviewer")).json();
    const firstToken = await invitationToken(email);
    expect((await invite(email, "reviewer")).status).toBe(409);

    const resent = await researcher.request(`/api/invitations/${created.id}/resend`, { method: "POST" });
    expect(resent.status).toBe(200);
    expect((await resent.json()).sentCount).toBe(2);
    const secondToken = await invitationToken(email, firstToken);
    expect(secondToken).not.toBe(firstToken);
    const old = await accept(new TestClient(), { token: firstToken, name: "Old Link", password: "weeds-in-rows-1", confirmPassword: "weeds-in-rows-1" });
    expect(old.status).toBe(404);
    expect((await old.json()).error.message).toContain("not valid");

    const revoked = await researcher.request(`/api/invitations/${created.id}`, { method: "DELETE" });
    expect((await revoked.json()).state).toBe("revoked");
    const refused = await accept(new TestClient(), { token: secondToken, name: "New Link", password: "weeds-in-rows-1", confirmPassword: "weeds-in-rows-1" });
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.message).toContain("withdrawn");

    const list = await (await researcher.request(`/api/invitations?trialId=${fixture.trial.id}`)).json();
    expect(list.invitations.find((entry: { id: string }) => entry.id === created.id).state).toBe("revoked");
  });
});

describe("inviting someone who has an account", () => {
  it("asks them to sign in, refuses another signed-in person, and joins them when signed in", async () => {
    const reviewer = await createPerson("reviewer", "existingrev");
    expect((await invite(reviewer.email, "reviewer")).status).toBe(201);
    const token = await invitationToken(reviewer.email);

    expect(await (await new TestClient().request(`/invite/${token}`)).text()).toContain("Sign in to accept");
    const anonymous = await accept(new TestClient(), { token });
    expect(anonymous.status).toBe(401);

    const stranger = new TestClient();
    const other = await createPerson("reviewer", "stranger");
    await stranger.signIn(other.email, PERSON_PASSWORD);
    const wrong = await accept(stranger, { token });
    expect(wrong.status).toBe(403);
    expect((await wrong.json()).error.message).toContain(`signed in as ${other.email}`);

    const client = new TestClient();
    await client.signIn(reviewer.email, PERSON_PASSWORD);
    const joined = await accept(client, { token });
    expect(joined.status).toBe(201);
    expect(await joined.json()).toMatchObject({ createdAccount: false });
    expect(await Membership.count({ where: { trialId: fixture.trial.id, userId: reviewer.id } })).toBe(1);
  });

  it("refuses an address whose account has another role, and people who may not manage the team", async () => {
    const grower = await createPerson("grower", "grower");
    const response = await invite(grower.email, "technician");
    expect(response.status).toBe(409);
    expect((await response.json()).error.message).toContain("grower account");

    const technician = await createPerson("technician", "notowner");
    const client = new TestClient();
    await client.signIn(technician.email, PERSON_PASSWORD);
    const forbidden = await client.request("/api/invitations", { method: "POST", json: { trialId: fixture.trial.id, email: uniqueAddress("x"), role: "technician" } });
    expect([403, 404]).toContain(forbidden.status);
  });
});

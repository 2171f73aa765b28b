import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { MailMessage, User } from "@/models";
import { testDatabase } from "../support/database";
import { signedInAs, TestClient } from "../support/http";

/*
 * Server actions are reached the way a browser reaches them: a POST to their page naming the
 * action's id (from the build's server-reference manifest) with the arguments as JSON. The
 * answer is React's flight stream; the action's own result appears in it as JSON.
 */
const manifest = JSON.parse(readFileSync(path.join(process.cwd(), process.env.NEXT_DIST_DIR ?? ".next", "server/server-reference-manifest.json"), "utf8")) as {
  node: Record<string, { exportedName: string }>;
};
const actionId = (name: string) => Object.entries(manifest.node).find(([, entry]) => entry.exportedName === name)![0];

const actions = {
  createUserAction: { page: "/admin/users", id: actionId("createUserAction") },
  retryMail: { page: "/admin/mail-queue", id: actionId("retryMail") },
} as const;

async function call(client: TestClient, name: keyof typeof actions, input: unknown): Promise<{ status: number; text: string }> {
  const { page, id } = actions[name];
  const response = await client.request(page, {
    method: "POST",
    headers: { "next-action": id, "content-type": "text/plain;charset=UTF-8", accept: "text/x-component" },
    body: JSON.stringify([input]),
  });
  return { status: response.status, text: await response.text() };
}

const refusedWith = (text: string, code: string) => text.includes('"ok":false') && text.includes(`"code":"${code}"`);

const hostileUsers: unknown[] = [
  null,
  "admin",
  [],
  {},
  { name: "Mallory", email: "mallory@example.test", role: "admin" },
  { name: "Mallory", email: "mallory@example.test", password: "long-enough-pass", role: "superuser" },
  { name: "Mallory", email: "not-an-address", password: "long-enough-pass", role: "grower" },
  { name: "x".repeat(100_000), email: "mallory@example.test", password: "long-enough-pass", role: "grower" },
  { name: "Mallory", email: "mallory@example.test", password: 12345678901, role: "grower" },
  { name: "Mallory", email: "mallory@example.test", password: "long-enough-pass", role: "grower", active: false, id: "00000000-0000-0000-0000-000000000000" },
  { name: "Robert'); DROP TABLE users;--", email: "' OR 1=1 --@example.test", password: "long-enough-pass", role: "grower" },
];

describe("server actions", () => {
  it("refuse hostile input with INVALID_INPUT and create nobody", async () => {
    testDatabase();
    const admin = await signedInAs("admin@hoebench.test");
    const before = await User.count();
    for (const input of hostileUsers) {
      const answer = await call(admin, "createUserAction", input);
      expect(answer.status, JSON.stringify(input)?.slice(0, 80)).toBe(200);
      expect(refusedWith(answer.text, "INVALID_INPUT"), `${JSON.stringify(input)?.slice(0, 80)} → ${answer.text.slice(0, 300)}`).toBe(true);
    }
    for (const input of [null, {}, { id: "../../etc/passwd" }, { id: "00000000-0000-0000-0000-000000000000", extra: 1 }, { id: 42 }]) {
      const answer = await call(admin, "retryMail", input);
      expect(refusedWith(answer.text, "INVALID_INPUT"), `${JSON.stringify(input)} → ${answer.text.slice(0, 300)}`).toBe(true);
    }
    expect(await User.count()).toBe(before);

    // The same call with good input does reach the action and create the account.
    const email = `checked-${Date.now()}@example.test`;
    const created = await call(admin, "createUserAction", { name: "Checked Newcomer", email, password: "long-enough-pass", role: "technician" });
    expect(created.text).toContain('"ok":true');
    expect((await User.findOne({ where: { email } }))?.role).toBe("technician");
    await User.destroy({ where: { email } });
  });

  it("check the permission themselves: other roles are refused, signed-out callers never reach them", async () => {
    testDatabase();
    const before = await User.count();
    const valid = { name: "Quiet Newcomer", email: `newcomer-${Date.now()}@example.test`, password: "long-enough-pass", role: "admin" };
    for (const email of ["researcher@hoebench.test", "technician@hoebench.test", "reviewer@hoebench.test", "grower@hoebench.test"]) {
      const client = await signedInAs(email);
      expect(refusedWith((await call(client, "createUserAction", valid)).text, "FORBIDDEN"), email).toBe(true);
      expect(refusedWith((await call(client, "retryMail", { id: "00000000-0000-0000-0000-000000000000" })).text, "FORBIDDEN"), email).toBe(true);
    }
    const signedOut = await call(new TestClient(), "createUserAction", valid);
    expect(signedOut.text.includes('"ok":true')).toBe(false);
    expect(await User.count()).toBe(before);
    expect(await MailMessage.count({ where: { toAddress: valid.email } })).toBe(0);
  });
});

afterAll(async () => {
  await testDatabase().close();
});

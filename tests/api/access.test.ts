import { afterAll, describe, expect, it } from "vitest";
import { Membership, Trial, User } from "@/models";
import { TestClient, signedInAs } from "../support/http";
import { testDatabase } from "../support/database";

const protectedEndpoints = [
  { method: "GET", path: "/api/me" },
  { method: "GET", path: "/api/trials" },
  { method: "GET", path: "/api/users" },
  { method: "POST", path: "/api/users" },
];

describe("signed-out requests", () => {
  for (const endpoint of protectedEndpoints) {
    it(`${endpoint.method} ${endpoint.path} answers 401 with a JSON error`, async () => {
      const response = await new TestClient().request(endpoint.path, { method: endpoint.method, json: endpoint.method === "POST" ? {} : undefined });
      expect(response.status).toBe(401);
      expect(await response.json()).toEqual({ error: { code: "UNAUTHENTICATED", message: "Please sign in to continue." } });
    });
  }

  it("are sent from a signed-in page to the sign-in page", async () => {
    const response = await new TestClient().request("/admin/users");
    expect([302, 307]).toContain(response.status);
    expect(response.headers.get("location")).toContain("/signin");
  });
});

describe("role checks at the API", () => {
  it("lets each role read who it is", async () => {
    for (const [email, role] of [["grower@hoebench.test", "grower"], ["technician@hoebench.test", "technician"]] as const) {
      const client = await signedInAs(email);
      const response = await client.request("/api/me");
      expect(response.status).toBe(200);
      expect(await response.json()).toMatchObject({ email, role });
    }
  });

  it("refuses the user list to everyone but admins", async () => {
    for (const email of ["researcher@hoebench.test", "technician@hoebench.test", "reviewer@hoebench.test", "grower@hoebench.test"]) {
      const response = await (await signedInAs(email)).request("/api/users");
      expect(response.status, email).toBe(403);
      expect((await response.json()).error.code).toBe("FORBIDDEN");
    }
    const admin = await signedInAs("admin@hoebench.test");
    const response = await admin.request("/api/users");
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.users.map((user: { email: string }) => user.email)).toContain("grower@hoebench.test");
    expect(JSON.stringify(body)).not.toContain("passwordHash");
  });

  it("refuses the trial list to growers, who read only published results", async () => {
    const response = await (await signedInAs("grower@hoebench.test")).request("/api/trials");
    expect(response.status).toBe(403);
  });

  it("shows a technician only the trials of their team", async () => {
    testDatabase();
    const technician = await User.findOne({ where: { email: "technician@hoebench.test" } });
    const memberTrialIds = (await Membership.findAll({ where: { userId: technician!.id, role: "technician" } })).map((row) => row.trialId);
    const visible = await Trial.findAll({ where: { id: memberTrialIds, status: ["draft", "active"] } });
    const response = await (await signedInAs("technician@hoebench.test")).request("/api/trials");
    const body = await response.json();
    expect(body.trials.map((trial: { id: string }) => trial.id).sort()).toEqual(visible.map((trial) => trial.id).sort());
    expect(visible.length).toBeGreaterThan(0);
  });

  it("validates an admin's new user and reports each field", async () => {
    const admin = await signedInAs("admin@hoebench.test");
    const response = await admin.request("/api/users", { method: "POST", json: { name: "X", email: "not-an-address", role: "wizard", password: "short" } });
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.fields.map((field: { path: string }) => field.path).sort()).toEqual(["email", "name", "password", "role"]);
  });
});

afterAll(async () => {
  await testDatabase().close();
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { AuditEvent, Membership, Trial, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { signedInAs, type TestClient } from "../support/http";

let fixture: TrialFixture;
let researcher: TestClient;
let reviewer: TestClient;
let technician: TestClient;

beforeAll(async () => {
  fixture = await createTrialFixture({ quadratsPerPlot: 1 });
  for (const role of ["reviewer", "technician"] as const) {
    const user = await User.findOne({ where: { email: `${role}@hoebench.test` } });
    await Membership.create({ trialId: fixture.trial.id, userId: user!.id, role });
  }
  [researcher, reviewer, technician] = await Promise.all(["researcher", "reviewer", "technician"].map((role) => signedInAs(`${role}@hoebench.test`)));
  const values = fixture.plots.map((plot) => ({ quadrat: 1, species: "", value: plot.position * 10 + (plot.block % 3) }));
  for (const plot of fixture.plots) {
    const saved = await technician.request("/api/plot-entries", { method: "POST", json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: plot.number, values: [values[fixture.plots.indexOf(plot)]] } });
    expect(saved.status).toBe(201);
  }
});

afterAll(removeTrialFixtures);

const base = () => `/api/reviews/${fixture.trial.id}`;

describe("review and sign-off", () => {
  it("lets only the owner ask for review, once", async () => {
    expect((await reviewer.request(`${base()}/request`, { method: "POST", json: {} })).status).toBe(403);
    expect((await reviewer.request(`${base()}/approve`, { method: "POST", json: {} })).status).toBe(409);
    const asked = await researcher.request(`${base()}/request`, { method: "POST", json: { message: "Density and yield are in." } });
    expect(asked.status).toBe(201);
    expect((await researcher.request(`${base()}/request`, { method: "POST", json: {} })).status).toBe(409);
  });

  it("lets the owner withdraw an open request, audited, and ask again", async () => {
    expect((await reviewer.request(`${base()}/request`, { method: "DELETE" })).status).toBe(403);
    const withdrawn = await researcher.request(`${base()}/request`, { method: "DELETE" });
    expect(withdrawn.status).toBe(200);
    expect((await withdrawn.json()).status).toBe("withdrawn");
    expect((await researcher.request(`${base()}/request`, { method: "DELETE" })).status).toBe(409);
    // Nothing open: the reviewer cannot approve a withdrawn request.
    expect((await reviewer.request(`${base()}/approve`, { method: "POST", json: {} })).status).toBe(409);
    const audit = await AuditEvent.findOne({ where: { trialId: fixture.trial.id, summary: "Review request withdrawn" } });
    expect(audit?.newValue).toEqual({ status: "withdrawn" });
    expect((await researcher.request(`${base()}/request`, { method: "POST", json: { message: "Now with the yield sheet." } })).status).toBe(201);
  });

  it("keeps threaded comments per assessment that can be resolved", async () => {
    const first = await reviewer.request(`${base()}/comments`, { method: "POST", json: { body: "Block 3 looks high; check the sheet.", assessmentId: fixture.assessment.id } });
    expect(first.status).toBe(201);
    const comment = await first.json();
    const reply = await researcher.request(`${base()}/comments`, { method: "POST", json: { body: "Checked; the values match the sheet.", parentId: comment.id } });
    const replied = await reply.json();
    expect(replied).toMatchObject({ parentId: comment.id, assessmentId: fixture.assessment.id });
    const nested = await (await reviewer.request(`${base()}/comments`, { method: "POST", json: { body: "Thanks.", parentId: replied.id } })).json();
    expect(nested.parentId).toBe(comment.id);
    const resolved = await reviewer.request(`${base()}/comments/${comment.id}`, { method: "PATCH", json: { resolved: true } });
    expect((await resolved.json()).resolvedAt).not.toBeNull();
    expect((await technician.request(`${base()}/comments`, { method: "POST", json: { body: "Me too" } })).status).toBe(403);
    expect((await reviewer.request(`${base()}/comments`, { method: "POST", json: { body: "  " } })).status).toBe(422);
  });

  it("locks the trial on approval; later edits need a reason and are audited as after the lock", async () => {
    expect((await researcher.request(`${base()}/approve`, { method: "POST", json: {} })).status).toBe(403);
    const approved = await reviewer.request(`${base()}/approve`, { method: "POST", json: { note: "Analyses read; approved." } });
    expect(approved.status).toBe(200);
    expect((await Trial.findByPk(fixture.trial.id))!.status).toBe("locked");
    expect((await reviewer.request(`${base()}/approve`, { method: "POST", json: {} })).status).toBe(409);

    const entry = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: fixture.plots[0].number, values: [{ quadrat: 1, species: "", value: 12 }] };
    const refused = await technician.request("/api/plot-entries", { method: "POST", json: entry });
    expect(refused.status).toBe(422);
    const allowed = await technician.request("/api/plot-entries", { method: "POST", json: { ...entry, reason: "Transcription error on the field sheet." } });
    expect(allowed.status).toBe(201);
    const audit = await AuditEvent.findOne({ where: { trialId: fixture.trial.id, afterLock: true } });
    expect(audit?.reason).toBe("Transcription error on the field sheet.");
  });

  it("renders the report, its PDF and the exports", async () => {
    const page = await researcher.request(`/trials/${fixture.trial.id}/report`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Technical report");
    expect(html).toContain("Approved by");
    expect(html).toContain("Fisher&#x27;s protected least significant difference");
    const pdf = await researcher.request(`/api/reports/${fixture.trial.id}/pdf?method=tukey`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    const bytes = Buffer.from(await pdf.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    expect(bytes.length).toBeGreaterThan(3000);
    const json = await (await researcher.request(`/api/reports/${fixture.trial.id}/export?format=json`)).json();
    expect(json.assessments[0].means).toHaveLength(3);
    expect(json.review.status).toBe("approved");
    const csv = await (await researcher.request(`/api/reports/${fixture.trial.id}/export?format=csv`)).text();
    expect(csv.split("\n")[0]).toContain("assessment,table");
    const grower = await signedInAs("grower@hoebench.test");
    expect((await grower.request(`/api/reports/${fixture.trial.id}/pdf`)).status).toBe(404);
  });
});

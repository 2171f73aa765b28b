import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomizeLayout } from "@/lib/layout/randomize";
import { Site, Trial } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient, signedInAs } from "../support/http";

// HTTP-level checks against the running test server (the full `npm test` starts it).
let lettuceId: string;
let siteId: string;
const created: string[] = [];

beforeAll(async () => {
  testDatabase();
  lettuceId = (await Trial.findOne({ where: { randomSeed: 20260512 } }))!.id;
  siteId = (await Site.findOne({ order: [["name", "ASC"]] }))!.id;
});

afterAll(async () => {
  await Trial.destroy({ where: { id: created } });
  await testDatabase().close();
});

const basics = () => ({ title: `API trial ${Date.now()}`, crop: "Spinach", season: "2031", siteId, objective: "", plantingDate: "2031-04-01" });
const treatment = (code: string, name: string, category: string, checkType: string | null = null) => ({ code, name, category, checkType, labourHoursPerHa: 10, materialCostPerHa: null });

describe("who may create and change trials", () => {
  it("answers 401 to a signed-out create", async () => {
    expect((await new TestClient().request("/api/trials", { method: "POST", json: basics() })).status).toBe(401);
  });

  it("refuses technicians and growers a new trial (403)", async () => {
    for (const email of ["technician@hoebench.test", "grower@hoebench.test", "reviewer@hoebench.test"]) {
      const response = await (await signedInAs(email)).request("/api/trials", { method: "POST", json: basics() });
      expect(response.status, email).toBe(403);
      expect((await response.json()).error.code).toBe("FORBIDDEN");
    }
  });

  it("lets a technician on the team read the plan but not re-randomize or edit it (403)", async () => {
    const technician = await signedInAs("technician@hoebench.test");
    expect((await technician.request(`/api/trials/${lettuceId}/plots`)).status).toBe(200);
    expect((await technician.request(`/api/trials/${lettuceId}/randomize`, { method: "POST", json: { newSeed: true } })).status).toBe(403);
    expect((await technician.request(`/api/trials/${lettuceId}/treatments`, { method: "PUT", json: { treatments: [treatment("A", "Aa", "hand")] } })).status).toBe(403);
  });

  it("hides another researcher's trial (404), whatever is asked of it", async () => {
    const other = await signedInAs("researcher2@hoebench.test");
    for (const [path, method, json] of [
      [`/api/trials/${lettuceId}`, "GET", undefined],
      [`/api/trials/${lettuceId}/treatments`, "PUT", { treatments: [treatment("A", "Aa", "hand")] }],
      [`/api/trials/${lettuceId}/randomize`, "POST", { newSeed: true }],
      [`/api/trials/${lettuceId}/status`, "POST", { status: "active" }],
      [`/api/trials/${lettuceId}/map`, "GET", undefined],
    ] as const) {
      const response = await other.request(path, { method, json });
      expect(response.status, `${method} ${path}`).toBe(404);
    }
  });

  it("refuses structure edits on an active trial with the reason (409)", async () => {
    const owner = await signedInAs("researcher@hoebench.test");
    const response = await owner.request(`/api/trials/${lettuceId}/treatments`, { method: "PUT", json: { treatments: [treatment("A", "Aa", "hand"), treatment("B", "Bb", "mulch")] } });
    expect(response.status).toBe(409);
    expect((await response.json()).error.message).toBe("This trial is active: its treatments, design and plots are in the field and can no longer change.");
    const randomize = await owner.request(`/api/trials/${lettuceId}/randomize`, { method: "POST", json: { newSeed: true } });
    expect(randomize.status).toBe(409);
    expect((await randomize.json()).error.message).toMatch(/Only a draft trial can be re-randomized/);
  });
});

describe("a researcher's plan through the API", () => {
  it("reports each invalid field (422)", async () => {
    const owner = await signedInAs("researcher@hoebench.test");
    const response = await owner.request("/api/trials", { method: "POST", json: { title: "", crop: "", season: "soon", siteId: "nope" } });
    expect(response.status).toBe(422);
    const fields = (await response.json()).error.fields.map((field: { path: string }) => field.path).sort();
    expect(fields).toEqual(["crop", "season", "siteId", "title"]);
  });

  it("creates a draft, lays it out from the stored seed, prints it and starts it", async () => {
    const owner = await signedInAs("researcher@hoebench.test");
    const createdResponse = await owner.request("/api/trials", { method: "POST", json: basics() });
    expect(createdResponse.status).toBe(201);
    const trial = await createdResponse.json();
    created.push(trial.id);
    expect(trial.status).toBe("draft");

    const treatments = [treatment("WC", "Weedy check", "check", "weedy"), treatment("HH", "Hand hoeing", "hand"), treatment("FL", "Flame weeding", "thermal")];
    expect((await owner.request(`/api/trials/${trial.id}/treatments`, { method: "PUT", json: { treatments } })).status).toBe(200);
    const design = { design: "rcbd", blocks: 4, plotLengthM: 5, plotWidthM: 1.5, harvestAreaM2: 3, quadratAreaM2: 0.25, serpentine: true, randomSeed: 424242 };
    const designed = await owner.request(`/api/trials/${trial.id}/design`, { method: "PUT", json: design });
    expect(designed.status).toBe(200);
    expect((await designed.json()).plots).toBe(12);

    const { seed, plots } = await (await owner.request(`/api/trials/${trial.id}/plots`)).json();
    expect(seed).toBe(424242);
    const planned = randomizeLayout({ design: "rcbd", treatmentCount: 3, blocks: 4, seed: 424242, serpentine: true });
    const byPosition = (await (await owner.request(`/api/trials/${trial.id}/treatments`)).json()).treatments.map((row: { id: string }) => row.id);
    expect(plots.map((plot: { number: number; treatmentId: string }) => [plot.number, plot.treatmentId])).toEqual(
      [...planned].sort((a, b) => a.number - b.number).map((plot) => [plot.number, byPosition[plot.treatmentIndex]]),
    );

    const pdf = await owner.request(`/api/trials/${trial.id}/map`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect(Buffer.from(await pdf.arrayBuffer()).subarray(0, 5).toString()).toBe("%PDF-");

    const early = await owner.request(`/api/trials/${trial.id}/status`, { method: "POST", json: { status: "active" } });
    expect(early.status).toBe(409);
    expect((await early.json()).error.message).toMatch(/Plan at least one assessment/);

    const assessments = [{ name: "Weed density", variable: "weed-density", unit: "plants per quadrat", timingDays: 21, timingReference: "planting", quadratsPerPlot: 3 }];
    const saved = await (await owner.request(`/api/trials/${trial.id}/assessments`, { method: "PUT", json: { assessments } })).json();
    const assessmentId = saved.assessments[0].id;
    const long = await owner.request(`/api/trials/${trial.id}/assessments/${assessmentId}/sheet?format=long`);
    expect(long.headers.get("content-type")).toMatch(/^text\/csv/);
    expect((await long.text()).trim().split(/\r?\n/)).toHaveLength(1 + 12 * 3);
    const wide = await owner.request(`/api/trials/${trial.id}/assessments/${assessmentId}/sheet?format=wide`);
    expect((await wide.text()).trim().split(/\r?\n/)).toHaveLength(1 + 12);

    const started = await owner.request(`/api/trials/${trial.id}/status`, { method: "POST", json: { status: "active" } });
    expect(started.status).toBe(200);
    expect(await started.json()).toEqual({ status: "active", warnings: [] });
  });

  it("keeps a locked trial read-only over the API", async () => {
    const owner = await signedInAs("researcher@hoebench.test");
    const trial = await (await owner.request("/api/trials", { method: "POST", json: basics() })).json();
    created.push(trial.id);
    await Trial.update({ status: "locked" }, { where: { id: trial.id } });
    const response = await owner.request(`/api/trials/${trial.id}`, { method: "PATCH", json: { ...basics(), title: "Changed" } });
    expect(response.status).toBe(409);
    expect((await response.json()).error.message).toBe("This trial is locked after review and is read-only.");
    const team = await owner.request(`/api/trials/${trial.id}/team`, { method: "PUT", json: { members: [] } });
    expect(team.status).toBe(409);
  });

  it("filters the list by crop, season and status", async () => {
    const owner = await signedInAs("researcher@hoebench.test");
    const lettuce = await (await owner.request("/api/trials?crop=lettuce&status=active")).json();
    expect(lettuce.trials.length).toBe(2);
    expect(lettuce.trials.every((trial: { crop: string; status: string }) => trial.crop === "Lettuce" && trial.status === "active")).toBe(true);
    const onion = await (await owner.request("/api/trials?season=2025")).json();
    expect(onion.trials.map((trial: { crop: string }) => trial.crop)).toEqual(["Onion"]);
    expect((await owner.request("/api/trials?status=someday")).status).toBe(422);
  });
});

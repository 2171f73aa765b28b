import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { commitVersion } from "@/lib/observations/commit-version";
import { Assessment, Follow, Trial, TrialSummary, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { TestClient, signedInAs } from "../support/http";

// HTTP-level checks against the running test server (npm test -- tests/library --server).
let locked: TrialFixture;
let draft: TrialFixture;
let publishedDemoId: string;

/** Weed counts per quadrat by treatment (T1 weedy check, T2 and T3 methods), two quadrats per plot. */
const counts: Record<number, number[]> = { 1: [40, 48, 44, 52], 2: [4, 6, 5, 3], 3: [20, 26, 18, 30] };

beforeAll(async () => {
  const sequelize = testDatabase();
  locked = await createTrialFixture({ status: "active", treatments: 3, blocks: 4 });
  const values = locked.plots.flatMap((plot) =>
    [1, 2].map((quadrat) => ({ plotNumber: plot.number, quadrat, species: "all", value: counts[plot.position][plot.block - 1] + quadrat - 1 })),
  );
  await commitVersion(sequelize, { trialId: locked.trial.id, assessmentId: locked.assessment.id, userId: locked.owner.id, source: "manual", values });
  await locked.trial.update({ status: "locked" });
  draft = await createTrialFixture({ status: "active" });
  publishedDemoId = (await Trial.findOne({ where: { status: "published", crop: "Onion" } }))!.id;
});

afterAll(async () => {
  const grower = await User.findOne({ where: { email: "grower@hoebench.test" } });
  await Follow.destroy({ where: { userId: grower!.id } });
  await removeTrialFixtures();
});

describe("the public library", () => {
  it("lists published trials to signed-out visitors, and never an unpublished one", async () => {
    const response = await new TestClient().request("/api/library");
    expect(response.status).toBe(200);
    const { trials } = (await response.json()) as { trials: Array<{ id: string }> };
    expect(trials.map((trial) => trial.id)).toContain(publishedDemoId);
    expect(trials.map((trial) => trial.id)).not.toContain(draft.trial.id);
    expect(trials.map((trial) => trial.id)).not.toContain(locked.trial.id);
  });

  it("filters by crop and method", async () => {
    const visitor = new TestClient();
    const onion = (await (await visitor.request("/api/library?crop=onion")).json()) as { trials: Array<{ id: string }> };
    expect(onion.trials.map((trial) => trial.id)).toEqual([publishedDemoId]);
    const robotic = (await (await visitor.request("/api/library?method=robotic")).json()) as { trials: unknown[] };
    expect(robotic.trials).toEqual([]);
    expect((await visitor.request("/api/library?method=magic")).status).toBe(422);
  });

  it("serves a published trial's data as CSV to anyone", async () => {
    const response = await new TestClient().request(`/api/library/${publishedDemoId}/data`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/text\/csv/);
    expect((await response.text()).split("\n")[0]).toMatch(/^"?trial"?,"?assessment"?,"?plot"?/);
  });

  it("answers 404 for an unpublished trial's page and data, to everyone outside it and even to its owner", async () => {
    const clients = [new TestClient(), await signedInAs("grower@hoebench.test"), await signedInAs("researcher2@hoebench.test"), await signedInAs("researcher@hoebench.test")];
    for (const client of clients) {
      for (const path of [`/library/${draft.trial.id}`, `/api/library/${draft.trial.id}/data`, `/library/${locked.trial.id}`, "/library/not-a-uuid", "/api/library/00000000-0000-4000-8000-000000000000/data"]) {
        expect((await client.request(path)).status, path).toBe(404);
      }
    }
  });

  it("shows the published summary page to signed-out visitors with the cautions and links", async () => {
    const response = await new TestClient().request(`/library/${publishedDemoId}`);
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toContain("one trial at one site");
    expect(html).toContain(`/api/library/${publishedDemoId}/data`);
    expect(html).toContain("The product label and local regulations govern");
    // The seed published it through the app's path, so the page reads the stored summary and its date.
    const record = (await TrialSummary.findOne({ where: { trialId: publishedDemoId } }))!;
    expect(html).toContain(`published ${record.publishedAt!.toISOString().slice(0, 10)}`);
  });

  it("links each library entry to its summary, technical report and data", async () => {
    const html = await (await new TestClient().request("/library?crop=onion")).text();
    for (const link of [`/library/${publishedDemoId}`, `/api/library/${publishedDemoId}/report`, `/api/library/${publishedDemoId}/data`]) expect(html).toContain(`href="${link}"`);
  });
});

describe("editing and publishing a summary", () => {
  it("lets the owner edit, refuses others, publishes once, and the edited text is what growers see", async () => {
    const researcher = await signedInAs("researcher@hoebench.test");
    const state = await researcher.request(`/api/summaries/${locked.trial.id}`);
    expect(state.status).toBe(200);
    const generated = ((await state.json()) as { generatedText: string }).generatedText;
    expect(generated).toContain("reduced weeds by about");
    expect(generated).toContain("This is one trial at one site");

    const edited = `${generated}\n\nA note from the researcher: the mulch plots dried out in June.`;
    expect((await researcher.request(`/api/summaries/${locked.trial.id}`, { method: "PUT", json: { text: edited } })).status).toBe(200);
    expect((await researcher.request(`/api/summaries/${locked.trial.id}`, { method: "PUT", json: { text: "" } })).status).toBe(422);

    // Outside the trial, a grower or another researcher learns nothing of it: 404, as for any trial they cannot see.
    expect((await (await signedInAs("grower@hoebench.test")).request(`/api/summaries/${locked.trial.id}/publish`, { method: "POST", json: {} })).status).toBe(404);
    expect((await (await signedInAs("researcher2@hoebench.test")).request(`/api/summaries/${locked.trial.id}/publish`, { method: "POST", json: {} })).status).toBe(404);
    expect((await new TestClient().request(`/api/summaries/${locked.trial.id}/publish`, { method: "POST", json: {} })).status).toBe(401);
    expect((await researcher.request(`/api/summaries/${draft.trial.id}/publish`, { method: "POST", json: {} })).status).toBe(409);
    expect((await researcher.request(`/api/summaries/${locked.trial.id}/publish`, { method: "POST", json: [] })).status).toBe(422);

    const published = await researcher.request(`/api/summaries/${locked.trial.id}/publish`, { method: "POST", json: {} });
    expect(published.status).toBe(200);
    expect((await researcher.request(`/api/summaries/${locked.trial.id}/publish`, { method: "POST", json: {} })).status).toBe(409);
    expect((await researcher.request(`/api/summaries/${locked.trial.id}`, { method: "PUT", json: { text: "changed" } })).status).toBe(409);

    await locked.trial.reload();
    expect(locked.trial.status).toBe("published");
    const record = (await TrialSummary.findOne({ where: { trialId: locked.trial.id } }))!;
    expect(record.publishedText).toBe(edited);
    expect(record.generatedText).toBe(generated);
    const numbers = record.numbers as { input: { weeds: { checkCode: string; results: Array<{ code: string; percentControl: number }> } } };
    expect(numbers.input.weeds.checkCode).toBe("T1");
    // T2 averages (4+6+5+3)/4 + 0.5 = 5 plants per quadrat against (40+48+44+52)/4 + 0.5 = 46.5 in the weedy check: 100 × (1 − 5/46.5)
    expect(numbers.input.weeds.results.find((result) => result.code === "T2")!.percentControl).toBeCloseTo(100 * (1 - 5 / 46.5), 9);

    const page = await (await new TestClient().request(`/library/${locked.trial.id}`)).text();
    expect(page).toContain("the mulch plots dried out in June");
    expect((await new TestClient().request(`/api/library/${locked.trial.id}/data`)).status).toBe(200);
    const assessment = await Assessment.findByPk(locked.assessment.id);
    expect(assessment).not.toBeNull();
  });
});

describe("following crops and methods", () => {
  it("a grower follows a crop and a method once each, sees them, and removes one; others cannot touch them", async () => {
    const grower = await signedInAs("grower@hoebench.test");
    expect((await new TestClient().request("/api/follows", { method: "POST", json: { kind: "crop", value: "Onion" } })).status).toBe(401);
    const first = await grower.request("/api/follows", { method: "POST", json: { kind: "crop", value: " Onion " } });
    expect(first.status).toBe(201);
    const again = await grower.request("/api/follows", { method: "POST", json: { kind: "crop", value: "onion" } });
    expect(((await again.json()) as { id: string }).id).toBe(((await first.json()) as { id: string }).id);
    expect((await grower.request("/api/follows", { method: "POST", json: { kind: "method", value: "robotic" } })).status).toBe(201);
    expect((await grower.request("/api/follows", { method: "POST", json: { kind: "method", value: "check" } })).status).toBe(422);
    const list = (await (await grower.request("/api/follows")).json()) as { follows: Array<{ id: string; kind: string; value: string }> };
    expect(list.follows.map((follow) => `${follow.kind}:${follow.value}`)).toEqual(["crop:onion", "method:robotic"]);
    const robot = list.follows.find((follow) => follow.kind === "method")!;
    expect((await (await signedInAs("researcher2@hoebench.test")).request(`/api/follows/${robot.id}`, { method: "DELETE" })).status).toBe(404);
    expect((await (await signedInAs("technician@hoebench.test")).request("/api/follows")).status).toBe(403);
    expect((await grower.request(`/api/follows/${robot.id}`, { method: "DELETE" })).status).toBe(200);
  });
});

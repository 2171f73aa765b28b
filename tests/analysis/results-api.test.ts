import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { commitVersion } from "@/lib/observations/commit-version";
import { analyzeTrial, type TreatmentMean } from "@/lib/stats";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { signedInAs, type TestClient } from "../support/http";

let researcher: TestClient;
let demo: { trialId: string; assessmentId: string };

/** Plot values straight from the database, independently of the app's code: quadrat totals averaged, per m² (0.25 m² quadrats). */
async function demoPlotRows(trialId: string, assessmentId: string) {
  return testDatabase().query<{ treatment: string; block: string; response: number | string }>(
    `SELECT t.code AS treatment, p.block::text AS block, COALESCE((
        SELECT avg(q.total) / 0.25 FROM (SELECT sum(o.value) AS total FROM current_observations o
          WHERE o.plot_id = p.id AND o.assessment_id = :assessmentId GROUP BY o.quadrat) q)::text, 'NA') AS response
       FROM plots p JOIN treatments t ON t.id = p.treatment_id WHERE p.trial_id = :trialId ORDER BY p.number`,
    { replacements: { trialId, assessmentId }, type: QueryTypes.SELECT },
  );
}

beforeAll(async () => {
  researcher = await signedInAs("researcher@hoebench.test");
  // The demo density count with a lost plot: the unbalanced case.
  const [row] = await testDatabase().query<{ trialId: string; assessmentId: string }>(
    `SELECT a.trial_id AS "trialId", a.id AS "assessmentId" FROM assessments a JOIN trials t ON t.id = a.trial_id
      WHERE a.variable = 'weed-density' AND t.status = 'active'
        AND (SELECT count(DISTINCT o.plot_id) FROM observations o WHERE o.assessment_id = a.id) < (SELECT count(*) FROM plots p WHERE p.trial_id = t.id)
      LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  demo = row;
});

afterAll(removeTrialFixtures);

describe("the analysis API", () => {
  it("answers the engine's numbers for the current plot values (consistency with analyzeTrial)", async () => {
    expect(demo).toBeDefined();
    for (const transform of ["none", "sqrt"] as const) {
      const response = await researcher.request(`/api/analysis/${demo.trialId}/${demo.assessmentId}?transform=${transform}&method=tukey`);
      expect(response.status).toBe(200);
      const body = await response.json();
      const engine = analyzeTrial(await demoPlotRows(demo.trialId, demo.assessmentId), { design: "rcbd", response: "response", treatment: "treatment", block: "block", transform });
      expect(body.anova).toHaveLength(engine.anova!.length);
      body.anova.forEach((row: { ss: number; df: number; p?: number }, index: number) => {
        expect(row.df).toBe(engine.anova![index].df);
        expect(row.ss).toBeCloseTo(engine.anova![index].ss, 8);
        if (row.p !== undefined) expect(row.p).toBeCloseTo(engine.anova![index].p!, 10);
      });
      expect(body.cvPercent).toBeCloseTo(engine.cvPercent!, 8);
      expect(body.lostPlots.length).toBe(engine.dropped);
      for (const mean of engine.means as TreatmentMean[]) {
        const line = body.means.find((entry: { treatment: string }) => entry.treatment === mean.treatment);
        expect(line.letters).toBe(mean.group);
        expect(line.se).toBeCloseTo(mean.se, 8);
        expect(transform === "none" ? line.mean : line.transformedMean).toBeCloseTo(mean.lsmean, 8);
      }
      expect(body.warnings.join(" ")).toMatch(/lost plots/);
    }
  });

  it("recomputes when options change and serves repeats from the cache", async () => {
    const url = `/api/analysis/${demo.trialId}/${demo.assessmentId}?transform=log1p&alpha=0.1&method=lsd`;
    const first = await researcher.request(url);
    const again = await researcher.request(url);
    expect(again.headers.get("x-analysis-cache")).toBe("hit");
    const other = await researcher.request(url.replace("alpha=0.1", "alpha=0.01"));
    expect(other.headers.get("x-analysis-cache")).toBe("miss");
    const [a, b] = [await first.json(), await other.json()];
    expect(a.options.alpha).toBe(0.1);
    expect(b.options.alpha).toBe(0.01);
    expect(b.lettersNote).toContain("0.01");
  });

  it("recomputes when the data change (new version)", async () => {
    const fixture: TrialFixture = await createTrialFixture({ treatments: 3, blocks: 4, quadratsPerPlot: 1 });
    const commit = (values: (plotNumber: number, position: number) => number) =>
      commitVersion(testDatabase(), {
        trialId: fixture.trial.id,
        assessmentId: fixture.assessment.id,
        userId: fixture.owner.id,
        source: "manual",
        values: fixture.plots.map((plot) => ({ plotNumber: plot.number, quadrat: 1, species: "", value: values(plot.number, plot.position) })),
      });
    const url = `/api/analysis/${fixture.trial.id}/${fixture.assessment.id}?method=lsd`;
    expect((await (await researcher.request(url)).json()).empty).toBe(true);

    // Noise whose treatment totals are equal: F = 0, so Fisher's protected LSD must not separate means.
    const noise: Record<number, number> = { 101: 3, 102: 5, 103: 4, 201: 5, 202: 4, 203: 3, 301: 4, 302: 3, 303: 5, 401: 4, 402: 4, 403: 4 };
    await commit((number) => 10 + noise[number]);
    const flat = await (await researcher.request(url)).json();
    expect(flat.dataVersion).toBe(1);
    expect(flat.treatmentTest.significant).toBe(false);
    expect(flat.means.every((mean: { letters: string | null }) => mean.letters === null)).toBe(true);
    expect(flat.lettersNote).toContain("not significant");

    await commit((number, position) => position * 30 + noise[number]);
    const changed = await researcher.request(url);
    expect(changed.headers.get("x-analysis-cache")).toBe("miss");
    const body = await changed.json();
    expect(body.dataVersion).toBe(2);
    expect(body.treatmentTest.significant).toBe(true);
    expect(new Set(body.means.map((mean: { letters: string }) => mean.letters)).size).toBe(3);

    // A treatment renamed after the results were cached: the next answer carries the new name.
    expect((await researcher.request(url)).headers.get("x-analysis-cache")).toBe("hit");
    await fixture.treatments[0].update({ name: "Renamed hoeing" });
    const renamed = await researcher.request(url);
    expect(renamed.headers.get("x-analysis-cache")).toBe("miss");
    expect((await renamed.json()).means.map((mean: { name: string }) => mean.name)).toContain("Renamed hoeing");
  });

  it("answers 404 to a grower and to a reviewer of another trial, 422 to bad options", async () => {
    const grower = await signedInAs("grower@hoebench.test");
    expect((await grower.request(`/api/analysis/${demo.trialId}/${demo.assessmentId}`)).status).toBe(404);
    const fixture = await createTrialFixture();
    const reviewer = await signedInAs("reviewer@hoebench.test");
    expect((await reviewer.request(`/api/analysis/${fixture.trial.id}/${fixture.assessment.id}`)).status).toBe(404);
    expect((await researcher.request(`/api/analysis/${demo.trialId}/${demo.assessmentId}?transform=cube`)).status).toBe(422);
    expect((await researcher.request(`/api/analysis/${demo.trialId}/${demo.assessmentId}?reference=HH`)).status).toBe(422);
  });

  it("gives the equivalence view with its interval and a careful sentence", async () => {
    const body = await (await researcher.request(`/api/analysis/${demo.trialId}/${demo.assessmentId}?reference=HH&margin=20`)).json();
    expect(body.equivalence.reference).toBe("HH");
    for (const line of body.equivalence.results) expect(line.ci90[0]).toBeLessThanOrEqual(line.ci90[1]);
    expect(body.equivalence.conclusion).not.toMatch(/\bthe same as\b/);
  });
});

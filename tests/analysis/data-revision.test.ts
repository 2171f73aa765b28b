import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { commitVersion } from "@/lib/observations/commit-version";
import { Assessment, Plot, Treatment } from "@/models";
import { createTrialFixture, removeTrialFixtures } from "../factories/trials";
import { testDatabase } from "../support/database";

/*
 * Cached results are keyed by a trial's data revision (lib/analysis/assessment-results.ts), so
 * every change an analysis reads must move it, and a bulk statement must move it once.
 */
async function revisionOf(trialId: string): Promise<number> {
  const [row] = await testDatabase().query<{ revision: number }>("SELECT data_revision AS revision FROM trials WHERE id = :trialId", {
    replacements: { trialId },
    type: QueryTypes.SELECT,
  });
  return row.revision;
}

describe("a trial's data revision", () => {
  afterAll(removeTrialFixtures);

  it("moves once per statement for versions, treatments, plots and assessments, and not for other trials", async () => {
    const fixture = await createTrialFixture({ treatments: 3, blocks: 4, quadratsPerPlot: 1 });
    const bystander = await createTrialFixture({ treatments: 2, blocks: 2 });
    const bystanderStart = await revisionOf(bystander.trial.id);
    let expected = await revisionOf(fixture.trial.id);

    await commitVersion(testDatabase(), {
      trialId: fixture.trial.id,
      assessmentId: fixture.assessment.id,
      userId: fixture.owner.id,
      source: "manual",
      values: fixture.plots.map((plot) => ({ plotNumber: plot.number, quadrat: 1, species: "", value: plot.number })),
    });
    expect(await revisionOf(fixture.trial.id)).toBeGreaterThan(expected);
    expected = await revisionOf(fixture.trial.id);

    await Treatment.update({ name: "Renamed method" }, { where: { id: fixture.treatments[1].id } });
    expect(await revisionOf(fixture.trial.id)).toBe(expected + 1);

    // Twelve plots in one statement: one step, not twelve.
    await Plot.update({ walkOrder: 99 }, { where: { trialId: fixture.trial.id } });
    expect(await revisionOf(fixture.trial.id)).toBe(expected + 2);

    await Assessment.update({ unit: "plants per m²" }, { where: { id: fixture.assessment.id } });
    expect(await revisionOf(fixture.trial.id)).toBe(expected + 3);

    await Assessment.destroy({ where: { id: fixture.assessment.id } });
    expect(await revisionOf(fixture.trial.id)).toBeGreaterThan(expected + 3);

    expect(await revisionOf(bystander.trial.id)).toBe(bystanderStart);
  });
});

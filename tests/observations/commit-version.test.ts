import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { commitVersion, type NewValue } from "@/lib/observations/commit-version";
import { AppError } from "@/lib/errors";
import { changesIn } from "@/lib/data/observations";
import { AuditEvent, DatasetVersion } from "@/models";
import { createSequelize } from "@/lib/db/sequelize";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { testEnvironment } from "../support/environment";

function valuesFor(fixture: TrialFixture, value: (plotNumber: number, quadrat: number) => number): NewValue[] {
  return fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => ({ plotNumber: plot.number, quadrat, species: "", value: value(plot.number, quadrat) })));
}

async function currentValues(assessmentId: string) {
  return testDatabase().query<{ plotId: string; quadrat: number; species: string; value: number; addedInVersionId: string }>(
    `SELECT plot_id AS "plotId", quadrat, species, value, added_in_version_id AS "addedInVersionId"
       FROM current_observations WHERE assessment_id = :assessmentId ORDER BY plot_id, position`,
    { replacements: { assessmentId }, type: QueryTypes.SELECT },
  );
}

/** Every value ever recorded for the assessment, current or replaced. */
async function valueCount(assessmentId: string): Promise<number> {
  const [{ count }] = await testDatabase().query<{ count: number }>("SELECT count(*)::int AS count FROM observations WHERE assessment_id = :assessmentId", {
    replacements: { assessmentId },
    type: QueryTypes.SELECT,
  });
  return count;
}

describe("committing a version of an assessment's data", () => {
  it("writes version 1 with every value, then version 2 replaces it without overwriting", async () => {
    const fixture = await createTrialFixture();
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "upload" as const };
    const first = await commitVersion(testDatabase(), { ...request, values: valuesFor(fixture, () => 5) });
    expect(first).toMatchObject({ number: 1, rowsAdded: 24, rowsReplaced: 0 });
    const second = await commitVersion(testDatabase(), { ...request, values: valuesFor(fixture, (plot) => plot % 10) });
    expect(second).toMatchObject({ number: 2, rowsAdded: 24, rowsReplaced: 24 });

    const current = await currentValues(fixture.assessment.id);
    expect(current).toHaveLength(24);
    expect(current.every((row) => row.addedInVersionId === second.id)).toBe(true);
    const all = await valueCount(fixture.assessment.id);
    expect(all).toBe(48);
    const audit = await AuditEvent.findAll({ where: { trialId: fixture.trial.id }, order: [["id", "ASC"]] });
    expect(audit.map((event) => event.summary)).toEqual([
      "Version 1: 24 values for the whole assessment (0 replaced)",
      "Version 2: 24 values for the whole assessment (24 replaced)",
    ]);
  });

  it("replaces only the named plot for a per-plot entry", async () => {
    const fixture = await createTrialFixture();
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id };
    await commitVersion(testDatabase(), { ...request, source: "upload", values: valuesFor(fixture, () => 5) });
    const manual = await commitVersion(testDatabase(), {
      ...request,
      source: "manual",
      replacePlotNumbers: [102],
      values: [{ plotNumber: 102, quadrat: 1, species: "", value: 9 }, { plotNumber: 102, quadrat: 2, species: "", value: 11 }],
    });
    expect(manual).toMatchObject({ number: 2, rowsAdded: 2, rowsReplaced: 2 });
    const current = await currentValues(fixture.assessment.id);
    expect(current).toHaveLength(24);
    expect(current.filter((row) => row.value !== 5).map((row) => row.value).sort()).toEqual([11, 9]);
  });

  it("shows what a version changed against the values it replaced", async () => {
    const fixture = await createTrialFixture();
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id };
    await commitVersion(testDatabase(), { ...request, source: "upload", values: valuesFor(fixture, () => 5) });
    const manual = await commitVersion(testDatabase(), {
      ...request,
      source: "manual",
      replacePlotNumbers: [102],
      values: [{ plotNumber: 102, quadrat: 1, species: "", value: 5 }],
    });
    expect(await changesIn(manual.id)).toEqual([{ plotNumber: 102, quadrat: 2, species: "", before: 5, after: null }]);
    const upload = await commitVersion(testDatabase(), { ...request, source: "upload", values: valuesFor(fixture, (plot, quadrat) => (plot === 101 && quadrat === 2 ? 7 : 5)) });
    expect(upload.rowsReplaced).toBe(23);
    expect(await changesIn(upload.id)).toEqual([
      { plotNumber: 101, quadrat: 2, species: "", before: 5, after: 7 },
      { plotNumber: 102, quadrat: 2, species: "", before: null, after: 5 },
    ]);
  });

  it("replaces only the plots it names: an entry naming none leaves every value in place", async () => {
    const fixture = await createTrialFixture();
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id };
    await commitVersion(testDatabase(), { ...request, source: "upload", values: valuesFor(fixture, () => 5) });
    const before = await currentValues(fixture.assessment.id);
    const none = await commitVersion(testDatabase(), { ...request, source: "manual", replacePlotNumbers: [], values: [] });
    expect(none).toMatchObject({ number: 2, rowsAdded: 0, rowsReplaced: 0 });
    expect(await currentValues(fixture.assessment.id)).toEqual(before);
    const one = await commitVersion(testDatabase(), { ...request, source: "manual", replacePlotNumbers: [101], values: [{ plotNumber: 101, quadrat: 1, species: "", value: 9 }] });
    expect(one).toMatchObject({ number: 3, rowsAdded: 1, rowsReplaced: 2 });
    expect(await currentValues(fixture.assessment.id)).toHaveLength(before.length - 1);
  });

  it("gives back each value's species as written, in the order the values came, through each plot's list of names", async () => {
    const fixture = await createTrialFixture();
    const [first, second] = fixture.plots;
    const values: NewValue[] = [
      { plotNumber: first.number, quadrat: 1, species: "Pigweed", value: 4 },
      { plotNumber: first.number, quadrat: 1, species: "", value: 1 },
      { plotNumber: second.number, quadrat: 2, species: "purslane", value: 2 },
      { plotNumber: first.number, quadrat: 2, species: "Pigweed", value: 6 },
      { plotNumber: second.number, quadrat: 1, species: "Pigweed", value: 0 },
    ];
    await commitVersion(testDatabase(), { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "upload", values });
    const byPlot = (plotId: string) => currentValues(fixture.assessment.id).then((rows) => rows.filter((row) => row.plotId === plotId).map(({ quadrat, species, value }) => ({ quadrat, species, value })));
    expect(await byPlot(first.id)).toEqual([
      { quadrat: 1, species: "Pigweed", value: 4 },
      { quadrat: 1, species: "", value: 1 },
      { quadrat: 2, species: "Pigweed", value: 6 },
    ]);
    expect(await byPlot(second.id)).toEqual([
      { quadrat: 2, species: "purslane", value: 2 },
      { quadrat: 1, species: "Pigweed", value: 0 },
    ]);
    const stored = await testDatabase().query<{ names: string[]; numbers: number[] }>(
      "SELECT species_names AS names, species_numbers AS numbers FROM observation_values WHERE plot_id = :plotId",
      { replacements: { plotId: first.id }, type: QueryTypes.SELECT },
    );
    expect(stored).toEqual([{ names: ["Pigweed", ""], numbers: [1, 2, 1] }]);
  });

  it("refuses a value twice in one version, or outside its version's plots, and removes values with their assessment", async () => {
    const fixture = await createTrialFixture();
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id };
    const twice = [{ plotNumber: 101, quadrat: 1, species: "", value: 3 }, { plotNumber: 101, quadrat: 1, species: "", value: 4 }];
    await expect(commitVersion(testDatabase(), { ...request, source: "manual", replacePlotNumbers: [101], values: twice })).rejects.toMatchObject({
      code: "INVALID_INPUT",
      message: "Plot 101, quadrat 1 has more than one value.",
    });
    const manual = await commitVersion(testDatabase(), { ...request, source: "manual", replacePlotNumbers: [101], values: [{ plotNumber: 101, quadrat: 1, species: "", value: 3 }] });
    // Straight SQL, as a seed or a repair script would write.
    const insert = (plotId: string, quadrats: number[], values: number[], speciesNumbers?: number[]) =>
      testDatabase().query(
        `INSERT INTO observation_values (version_id, plot_id, quadrats, species_names, species_numbers, "values")
         VALUES (:versionId, :plotId, :quadrats::int[], '{""}', :speciesNumbers::int[], :values::float8[])`,
        {
          replacements: {
            versionId: manual.id,
            plotId,
            quadrats: `{${quadrats.join(",")}}`,
            speciesNumbers: `{${(speciesNumbers ?? quadrats.map(() => 1)).join(",")}}`,
            values: `{${values.join(",")}}`,
          },
        },
      );
    const plot = (number: number) => fixture.plots.find((candidate) => candidate.number === number)!.id;
    await expect(insert(plot(102), [1], [1])).rejects.toThrow(/observation_values_version_id_plot_id_fkey/);
    await expect(insert(plot(101), [2], [1])).rejects.toMatchObject({ parent: { constraint: "observation_values_pkey" } });
    await testDatabase().query("DELETE FROM observation_values WHERE version_id = :versionId", { replacements: { versionId: manual.id } });
    await expect(insert(plot(101), [1, 2], [1])).rejects.toThrow(/observation_values_aligned/);
    await expect(insert(plot(101), [0], [1])).rejects.toThrow(/observation_values_aligned/);
    await expect(insert(plot(101), [], [])).rejects.toThrow(/observation_values_aligned/);
    // A species number must name an entry of the plot's list of names (here one name).
    await expect(insert(plot(101), [1], [1], [2])).rejects.toThrow(/observation_values_aligned/);
    await expect(insert(plot(101), [1], [1], [0])).rejects.toThrow(/observation_values_aligned/);
    await insert(plot(101), [1, 2], [3, 4]);
    expect(await currentValues(fixture.assessment.id)).toMatchObject([
      { quadrat: 1, value: 3 },
      { quadrat: 2, value: 4 },
    ]);
    await fixture.assessment.destroy();
    expect(await valueCount(fixture.assessment.id)).toBe(0);
  });

  it("asks for a reason once the trial is locked, and marks the change for the reviewer", async () => {
    const fixture = await createTrialFixture({ status: "locked" });
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "manual" as const, values: valuesFor(fixture, () => 1) };
    await expect(commitVersion(testDatabase(), request)).rejects.toMatchObject({ code: "INVALID_INPUT", message: expect.stringContaining("say why the data change") });
    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(0);
    await commitVersion(testDatabase(), { ...request, reason: "Quadrat 2 of plot 101 was keyed as 1; field sheet says 7." });
    const [event] = await AuditEvent.findAll({ where: { trialId: fixture.trial.id } });
    expect(event.afterLock).toBe(true);
    expect(event.reason).toBe("Quadrat 2 of plot 101 was keyed as 1; field sheet says 7.");
  });

  it("refuses any change to a published trial and writes nothing", async () => {
    const fixture = await createTrialFixture({ status: "published" });
    const attempt = commitVersion(testDatabase(), { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "manual", values: valuesFor(fixture, () => 1), reason: "x" });
    await expect(attempt).rejects.toBeInstanceOf(AppError);
    await expect(attempt).rejects.toMatchObject({ code: "CONFLICT" });
    expect(await valueCount(fixture.assessment.id)).toBe(0);
  });

  it("turns two commits at once into two ordered versions, never a mix", async () => {
    const fixture = await createTrialFixture();
    const request = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "upload" as const };
    const second = createSequelize(testEnvironment().databaseUrl, 2, { bindModels: false });
    try {
      const [a, b] = await Promise.all([
        commitVersion(testDatabase(), { ...request, values: valuesFor(fixture, () => 1) }),
        commitVersion(second, { ...request, values: valuesFor(fixture, () => 2) }),
      ]);
      expect([a.number, b.number].sort()).toEqual([1, 2]);
      const last = a.number === 2 ? a : b;
      const current = await currentValues(fixture.assessment.id);
      expect(current).toHaveLength(24);
      expect(new Set(current.map((row) => row.addedInVersionId))).toEqual(new Set([last.id]));
      expect(new Set(current.map((row) => row.value)).size).toBe(1);
    } finally {
      await second.close();
    }
  });

  it("leaves nothing behind when the connection dies in the middle of a commit", async () => {
    const fixture = await createTrialFixture({ treatments: 10, blocks: 10, quadratsPerPlot: 50 });
    const victim = createSequelize(testEnvironment().databaseUrl, 1, { bindModels: false });
    const many: NewValue[] = [];
    for (const plot of fixture.plots) for (let quadrat = 1; quadrat <= 50; quadrat += 1) for (const species of ["a", "b", "c", "d", "e", "f", "g", "h"]) many.push({ plotNumber: plot.number, quadrat, species, value: quadrat });
    // The killer holds the audit table, so the commit stops at its audit entry with its values already written.
    const killer = createSequelize(testEnvironment().databaseUrl, 1, { bindModels: false });
    const blocking = await killer.transaction();
    await killer.query("LOCK TABLE audit_events IN EXCLUSIVE MODE", { transaction: blocking });
    const failure = commitVersion(victim, { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "upload", values: many }).then(
      () => null,
      (error: unknown) => error,
    );
    let killed = 0;
    for (let attempt = 0; attempt < 400 && killed === 0; attempt += 1) {
      const rows = await testDatabase().query<{ killed: boolean }>(
        `SELECT pg_terminate_backend(pid) AS killed FROM pg_stat_activity
          WHERE wait_event_type = 'Lock' AND query LIKE 'INSERT INTO "audit_events"%' AND pid <> pg_backend_pid()`,
        { type: QueryTypes.SELECT },
      );
      killed = rows.filter((row) => row.killed).length;
      if (!killed) await new Promise((resolve) => setTimeout(resolve, 5));
    }
    await blocking.rollback();
    await killer.close();
    expect(killed).toBe(1);
    expect(await failure).toBeInstanceOf(Error);
    await victim.close().catch(() => {});
    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(0);
    expect(await valueCount(fixture.assessment.id)).toBe(0);
    expect(await AuditEvent.count({ where: { trialId: fixture.trial.id } })).toBe(0);
  }, 60_000);
});

afterAll(async () => {
  await removeTrialFixtures();
  await testDatabase().close();
});

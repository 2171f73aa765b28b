import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { SessionUser } from "@/lib/auth/session";
import { summaryOf } from "@/lib/data/summaries";
import { AppError } from "@/lib/errors";
import { commitVersion } from "@/lib/observations/commit-version";
import { publishTrial, saveSummaryEdit } from "@/lib/summaries/publish";
import type { SummaryNumbers } from "@/lib/summaries/numbers";
import { TrialSummary } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";

// The lib functions reach the database through db(); point it at the test connection.
const globalForDb = globalThis as unknown as { hoebenchSequelize?: unknown };
let fixture: TrialFixture;
let researcher: SessionUser;

/** Weed counts per quadrat by treatment (T1 weedy check, T2 and T3 hand methods) and block; quadrat 2 counts one more. */
const counts: Record<number, number[]> = { 1: [40, 48, 44, 52], 2: [4, 6, 5, 3], 3: [20, 26, 18, 30] };
const valuesOf = (plots: TrialFixture["plots"], table: Record<number, number[]>) =>
  plots.flatMap((plot) => [1, 2].map((quadrat) => ({ plotNumber: plot.number, quadrat, species: "all", value: table[plot.position][plot.block - 1] + quadrat - 1 })));
const controlOf = (numbers: SummaryNumbers, code: string) => numbers.input.weeds!.results.find((result) => result.code === code)!.percentControl;

beforeAll(async () => {
  const sequelize = testDatabase();
  globalForDb.hoebenchSequelize = sequelize;
  fixture = await createTrialFixture({ status: "active", treatments: 3, blocks: 4 });
  await commitVersion(sequelize, { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, userId: fixture.owner.id, source: "manual", values: valuesOf(fixture.plots, counts) });
  await fixture.trial.update({ status: "locked" });
  researcher = { id: fixture.owner.id, email: fixture.owner.email, name: fixture.owner.name, role: fixture.owner.role };
});

afterAll(async () => {
  await removeTrialFixtures();
  delete globalForDb.hoebenchSequelize;
  await testDatabase().close();
});

describe("an edited summary whose results changed after the edit", () => {
  it("is flagged, cannot be published until the researcher checks it, then publishes with the new numbers", async () => {
    const before = await summaryOf(fixture.trial);
    // T3 averages (20+26+18+30)/4 + 0.5 = 24 weeds per quadrat against (40+48+44+52)/4 + 0.5 = 46.5 in the weedy check: 100 × (1 − 24/46.5)
    expect(controlOf(before.numbers, "T3")).toBeCloseTo(100 * (1 - 24 / 46.5), 9);
    const edited = `${before.generated.text}\n\nA note from the researcher: the plots were hoed late.`;
    await saveSummaryEdit(researcher, fixture.trial, edited, before.generated.text);
    expect((await summaryOf(fixture.trial)).generatedChangedSinceEdit).toBe(false);

    // A correction after sign-off: T3's counts were entered for the wrong plots.
    const corrected = { ...counts, 3: [8, 10, 12, 14] };
    await commitVersion(testDatabase(), {
      trialId: fixture.trial.id,
      assessmentId: fixture.assessment.id,
      userId: fixture.owner.id,
      source: "manual",
      replacePlotNumbers: fixture.plots.filter((plot) => plot.position === 3).map((plot) => plot.number),
      values: valuesOf(fixture.plots.filter((plot) => plot.position === 3), corrected),
      reason: "Counts entered against the wrong plots",
    });
    await fixture.trial.reload();

    const after = await summaryOf(fixture.trial);
    // (8+10+12+14)/4 + 0.5 = 11.5 against 46.5: 100 × (1 − 11.5/46.5) ≈ 75.3%, where the edit says about 48%.
    expect(controlOf(after.numbers, "T3")).toBeCloseTo(100 * (1 - 11.5 / 46.5), 9);
    expect(after.generatedChangedSinceEdit).toBe(true);
    expect(after.text).toBe(edited);
    expect(after.generated.text).not.toBe(before.generated.text);
    expect(after.generated.text).toContain("Method 3 reduced weeds by about 75%");

    const refused = await publishTrial(researcher, fixture.trial.id).catch((error: unknown) => error);
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).code).toBe("CONFLICT");
    expect((refused as AppError).message).toContain("The results changed after the summary text was edited");
    await fixture.trial.reload();
    expect(fixture.trial.status).toBe("locked");

    // Saving again without saying what it was checked against keeps the old starting text: still flagged.
    await saveSummaryEdit(researcher, fixture.trial, `${edited} Checked.`);
    expect((await summaryOf(fixture.trial)).generatedChangedSinceEdit).toBe(true);

    const rewritten = `${after.generated.text}\n\nA note from the researcher: the plots were hoed late.`;
    await saveSummaryEdit(researcher, fixture.trial, rewritten, after.generated.text);
    expect((await summaryOf(fixture.trial)).generatedChangedSinceEdit).toBe(false);
    await publishTrial(researcher, fixture.trial.id);

    const record = (await TrialSummary.findOne({ where: { trialId: fixture.trial.id } }))!;
    expect(record.publishedText).toBe(rewritten);
    expect(record.generatedText).toBe(after.generated.text);
    expect(controlOf(record.numbers as SummaryNumbers, "T3")).toBeCloseTo(100 * (1 - 11.5 / 46.5), 9);
  });
});

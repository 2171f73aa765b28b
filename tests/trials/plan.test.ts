import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { randomizeLayout } from "@/lib/layout/randomize";
import { assertRandomizable } from "@/lib/trials/guard";
import { createTrial, rerandomize, saveAssessments, saveBasics, saveDesign, saveTeam, saveTreatments } from "@/lib/trials/plan";
import { changeStatus } from "@/lib/trials/readiness";
import { trialAssessmentsSchema, trialBasicsSchema, trialDesignSchema, trialTreatmentsSchema } from "@/lib/validations/trial";
import { Assessment, Plot, Site, Treatment, Trial, User } from "@/models";
import { testDatabase } from "../support/database";
import { writeRawValues } from "@/lib/observations/write-raw-values";

// The lib functions reach the database through db(); point it at the test connection.
const globalForDb = globalThis as unknown as { hoebenchSequelize?: unknown };
const created: string[] = [];
let ownerId: string;
let siteId: string;

beforeAll(async () => {
  globalForDb.hoebenchSequelize = testDatabase();
  ownerId = (await User.findOne({ where: { email: "researcher@hoebench.test" } }))!.id;
  siteId = (await Site.findOne({ order: [["name", "ASC"]] }))!.id;
});

afterAll(async () => {
  await Trial.destroy({ where: { id: created } });
  delete globalForDb.hoebenchSequelize;
  await testDatabase().close();
});

/** The stored plots, in the shape randomizeLayout returns them. */
async function storedLayout(trial: Trial) {
  const treatments = await Treatment.findAll({ where: { trialId: trial.id }, order: [["position", "ASC"]] });
  const indexOf = new Map(treatments.map((treatment, index) => [treatment.id, index]));
  const plots = await Plot.findAll({ where: { trialId: trial.id }, order: [["number", "ASC"]] });
  return plots.map((plot) => ({
    number: plot.number,
    block: plot.block,
    position: plot.position,
    row: plot.row,
    column: plot.column,
    walkOrder: plot.walkOrder,
    treatmentIndex: indexOf.get(plot.treatmentId),
  }));
}

function expected(trial: Trial, treatmentCount: number) {
  const layout = randomizeLayout({ design: trial.design, treatmentCount, blocks: trial.blocks, seed: trial.randomSeed, serpentine: trial.serpentine });
  return [...layout].sort((a, b) => a.number - b.number);
}

const treatment = (code: string, name: string, category: string, checkType = "") => ({
  code, name, category, checkType, description: "", timing: "", rateOrSettings: "", labourHoursPerHa: "", materialCostPerHa: "",
});
const fourTreatments = trialTreatmentsSchema.parse({
  treatments: [treatment("WC", "Weedy check", "check", "weedy"), treatment("HH", "Hand hoeing", "hand"), treatment("SM", "Straw mulch", "mulch"), treatment("FL", "Flame weeding", "thermal")],
});
const oneAssessment = trialAssessmentsSchema.parse({
  assessments: [{ name: "Weed density", variable: "weed-density", unit: "plants per quadrat", plannedDate: "", timingDays: "21", timingReference: "planting", quadratsPerPlot: "4", notes: "" }],
});

async function newTrial(title: string): Promise<Trial> {
  const trial = await createTrial(ownerId, trialBasicsSchema.parse({ title, crop: "Test crop", season: "2031", siteId, objective: "", plantingDate: "2031-05-01" }));
  created.push(trial.id);
  return trial;
}

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => null, (thrown: unknown) => thrown);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

describe("randomization wiring", () => {
  it("stores the demo lettuce layout exactly as randomizeLayout draws it from the stored seed", async () => {
    const trial = (await Trial.findOne({ where: { randomSeed: 20260512 } }))!;
    const stored = await storedLayout(trial);
    expect(stored).toHaveLength(32);
    expect(stored).toEqual(expected(trial, 8));
  });

  it("lays a new trial out from its stored seed, again after a design change, and again after re-randomizing", async () => {
    const trial = await newTrial("Layout wiring check");
    await saveTreatments(trial, fourTreatments);
    await trial.reload();
    expect(await storedLayout(trial)).toEqual(expected(trial, 4));

    await saveDesign(trial, trialDesignSchema.parse({ design: "rcbd", blocks: 3, plotLengthM: 5, plotWidthM: 2, harvestAreaM2: 4, quadratAreaM2: 0.25, serpentine: false, randomSeed: 12345 }));
    await trial.reload();
    expect(trial.randomSeed).toBe(12345);
    const first = await storedLayout(trial);
    expect(first).toEqual(expected(trial, 4));
    expect(first.map((plot) => plot.number)).toEqual([101, 102, 103, 104, 201, 202, 203, 204, 301, 302, 303, 304]);

    const again = await rerandomize(trial, { newSeed: false });
    expect(again.seed).toBe(12345);
    expect(await storedLayout(trial)).toEqual(first);

    const redrawn = await rerandomize(trial, { newSeed: true });
    await trial.reload();
    expect(redrawn.seed).not.toBe(12345);
    expect(trial.randomSeed).toBe(redrawn.seed);
    expect(await storedLayout(trial)).toEqual(expected(trial, 4));
  });

  it("lays a Latin square out with as many rows as treatments", async () => {
    const trial = await newTrial("Latin square check");
    await saveTreatments(trial, fourTreatments);
    await saveDesign(trial, trialDesignSchema.parse({ design: "latin", blocks: 2, plotLengthM: 5, plotWidthM: 2, harvestAreaM2: 4, quadratAreaM2: 0.25, serpentine: true, randomSeed: 777 }));
    await trial.reload();
    expect(trial.blocks).toBe(4);
    expect(await storedLayout(trial)).toEqual(expected(trial, 4));
  });
});

describe("status and edit rules against the database", () => {
  it("activates only a complete plan, then refuses structure edits with the reason but keeps details and team open", async () => {
    const trial = await newTrial("Activation check");
    expect((await refusal(changeStatus(trial, "active"))).message).toMatch(/Add at least two treatments/);
    await saveTreatments(trial, fourTreatments);
    expect((await refusal(changeStatus(trial, "active"))).message).toMatch(/Plan at least one assessment/);
    await saveAssessments(trial, oneAssessment);
    expect(await changeStatus(trial, "active")).toEqual({ status: "active", warnings: [] });

    const refused = await refusal(saveTreatments(trial, fourTreatments));
    expect(refused.code).toBe("CONFLICT");
    expect(refused.message).toBe("This trial is active: its treatments, design and plots are in the field and can no longer change.");
    expect((await refusal(saveDesign(trial, trialDesignSchema.parse({ design: "rcbd", blocks: 5, plotLengthM: 5, plotWidthM: 2, harvestAreaM2: 4, quadratAreaM2: 0.25, serpentine: false, randomSeed: 9 })))).code).toBe("CONFLICT");
    expect((await refusal(assertRandomizable(trial))).message).toMatch(/Only a draft trial can be re-randomized/);

    await saveBasics(trial, trialBasicsSchema.parse({ title: "Activation check, renamed", crop: "Test crop", season: "2031", siteId, objective: "Still editable", plantingDate: "2031-05-01" }));
    expect((await Trial.findByPk(trial.id))!.title).toBe("Activation check, renamed");
    await saveTeam(trial, { members: [] });
  });

  it("refuses to delete or change an assessment that has observations", async () => {
    const trial = await newTrial("Observation pin check");
    await saveTreatments(trial, fourTreatments);
    await saveAssessments(trial, oneAssessment);
    await changeStatus(trial, "active");
    const sequelize = testDatabase();
    const assessment = (await Assessment.findOne({ where: { trialId: trial.id } }))!;
    const plot = (await Plot.findOne({ where: { trialId: trial.id } }))!;
    const versionId = randomUUID();
    await sequelize.query(
      `INSERT INTO dataset_versions (id, assessment_id, trial_id, number, source, created_by_id, rows_added, rows_replaced, created_at)
       VALUES (:versionId, :assessmentId, :trialId, 1, 'manual', :ownerId, 1, 0, now())`,
      { replacements: { versionId, assessmentId: assessment.id, trialId: trial.id, ownerId } },
    );
    await writeRawValues(sequelize, versionId, [{ plotId: plot.id, quadrat: 1, value: 12 }]);
    await trial.reload();
    const basics = { title: trial.title, crop: trial.crop, season: trial.season, siteId: trial.siteId, objective: trial.objective, plantingDate: trial.plantingDate ?? "" };
    expect((await refusal(saveBasics(trial, trialBasicsSchema.parse({ ...basics, plantingDate: "2031-04-02", crop: "Another crop" })))).message).toBe(
      "Observations have been recorded in this trial, and its crop, season and planting date say what they mean; the crop and planting date can no longer change.",
    );
    await saveBasics(trial, trialBasicsSchema.parse({ ...basics, title: "Observation pin check, renamed", objective: "Still open" }));
    expect((await Trial.findByPk(trial.id))!.title).toBe("Observation pin check, renamed");
    expect((await refusal(saveAssessments(trial, { assessments: [] }))).message).toMatch(/Observations have been recorded for "Weed density"; it cannot be deleted/);
    const changedUnit = { assessments: [{ ...oneAssessment.assessments[0], id: String(assessment.id), unit: "plants per m²" }] };
    expect((await refusal(saveAssessments(trial, changedUnit))).message).toMatch(/unit and quadrats can no longer change/);
    const renamed = { assessments: [{ ...oneAssessment.assessments[0], id: String(assessment.id), name: "Weed density, 21 days" }] };
    await saveAssessments(trial, renamed);
  });

  it("keeps a locked trial read-only", async () => {
    const trial = await newTrial("Locked check");
    await saveTreatments(trial, fourTreatments);
    await trial.update({ status: "locked" });
    const basics = trialBasicsSchema.parse({ title: "Changed after lock", crop: "Test crop", season: "2031", siteId, objective: "", plantingDate: null });
    const attempts = [
      () => saveBasics(trial, basics),
      () => saveTreatments(trial, fourTreatments),
      () => saveAssessments(trial, oneAssessment),
      () => saveTeam(trial, { members: [] }),
      () => assertRandomizable(trial),
    ];
    for (const attempt of attempts) {
      const refused = await refusal(attempt());
      expect(refused.code).toBe("CONFLICT");
      expect(refused.message).toBe("This trial is locked after review and is read-only.");
    }
    expect((await Trial.findByPk(trial.id))!.title).toBe("Locked check");
  });
});

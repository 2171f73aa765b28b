import { randomUUID } from "node:crypto";
import { Assessment, Plot, Site, Treatment, Trial, User } from "@/models";
import type { TrialStatus } from "@/models/Trial";
import { testDatabase } from "../support/database";

const created: { trialId: string; siteId: string }[] = [];

/** Removes every trial (and its site) the factory made, so other suites see only the demo. */
export async function removeTrialFixtures(): Promise<void> {
  const sequelize = testDatabase();
  for (const { trialId, siteId } of created.splice(0)) {
    await sequelize.query("DELETE FROM trials WHERE id = :trialId", { replacements: { trialId } });
    await sequelize.query("DELETE FROM sites WHERE id = :siteId", { replacements: { siteId } });
  }
}

export interface TrialFixture {
  trial: Trial;
  treatments: Treatment[];
  plots: Plot[];
  assessment: Assessment;
  owner: User;
}

/**
 * A small RCBD trial with plots numbered block × 100 + position in treatment order (no
 * randomization needed for data tests), owned by the given researcher.
 */
export async function createTrialFixture(options: {
  ownerEmail?: string;
  status?: TrialStatus;
  treatments?: number;
  blocks?: number;
  quadratsPerPlot?: number;
  variable?: Assessment["variable"];
  unit?: string;
} = {}): Promise<TrialFixture> {
  testDatabase();
  const owner = (await User.findOne({ where: { email: options.ownerEmail ?? "researcher@hoebench.test" } }))!;
  const site = await Site.create({ name: `Fixture site ${randomUUID().slice(0, 6)}`, location: "Bed 1", region: "Test region", latitude: null, longitude: null, createdById: owner.id });
  const trial = await Trial.create({
    title: `Fixture trial ${randomUUID().slice(0, 8)}`,
    crop: "Lettuce",
    season: "2026",
    siteId: site.id,
    design: "rcbd",
    blocks: options.blocks ?? 4,
    plotLengthM: 6,
    plotWidthM: 1.5,
    harvestAreaM2: 4.5,
    quadratAreaM2: 0.25,
    plantingDate: "2026-05-01",
    randomSeed: 1,
    status: options.status ?? "active",
    ownerId: owner.id,
  });
  created.push({ trialId: trial.id, siteId: site.id });
  const treatmentCount = options.treatments ?? 3;
  const treatments: Treatment[] = [];
  for (let index = 0; index < treatmentCount; index += 1) {
    treatments.push(
      await Treatment.create({
        trialId: trial.id,
        position: index + 1,
        code: `T${index + 1}`,
        name: index === 0 ? "Weedy check" : `Method ${index + 1}`,
        category: index === 0 ? "check" : "hand",
        checkType: index === 0 ? "weedy" : null,
        labourHoursPerHa: null,
        materialCostPerHa: null,
        equipmentCost: null,
        equipmentLifeYears: null,
        equipmentHaPerYear: null,
      }),
    );
  }
  const plots: Plot[] = [];
  for (let block = 1; block <= (options.blocks ?? 4); block += 1) {
    for (let position = 1; position <= treatmentCount; position += 1) {
      plots.push(
        await Plot.create({
          trialId: trial.id,
          number: block * 100 + position,
          block,
          position,
          row: block,
          column: position,
          walkOrder: (block - 1) * treatmentCount + position,
          treatmentId: treatments[position - 1].id,
        }),
      );
    }
  }
  const assessment = await Assessment.create({
    trialId: trial.id,
    position: 1,
    name: "Weed density 28 days after planting",
    variable: options.variable ?? "weed-density",
    unit: options.unit ?? "plants per quadrat",
    plannedDate: "2026-05-29",
    timingDays: 28,
    timingReference: "planting",
    quadratsPerPlot: options.quadratsPerPlot ?? 2,
    plausibleMin: 0,
    plausibleMax: 500,
  });
  return { trial, treatments, plots, assessment, owner };
}

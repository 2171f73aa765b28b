import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { mulberry32, type RandomSource } from "@/lib/layout/prng";
import { writeRawValues } from "@/lib/observations/write-raw-values";

/**
 * Invented raw values for the demo's active lettuce trials and the published onion trial, so
 * the results, review and report screens have something to show. Every number is made up from
 * a seeded generator (reproducible), shaped only to look like a weed-control trial: the weedy
 * check high, the weed-free check near zero, the other methods in between, count variance
 * rising with the mean. Demo data are never expected values of a check.
 */
const DEMO_TRIALS: Record<string, { seed: number; siteFactor: number }> = {
  "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot": { seed: 61, siteFactor: 1 },
  "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot (second site)": { seed: 62, siteFactor: 0.7 },
  "Onion weed control: hand hoeing, straw mulch and finger cultivation": { seed: 63, siteFactor: 1.2 },
};

/** Share of the weedy check's weeds that survive each method (invented). */
const survival: Record<string, number> = { WC: 1, WF: 0.02, HH: 0.22, SM: 0.35, BF: 0.12, FL: 0.45, FT: 0.38, SR: 0.25, FC: 0.4 };
/** Hours per plot spent weeding (invented; plots are 9 m²). */
const labourPerPlot: Record<string, number> = { WC: 0, WF: 2.1, HH: 0.8, SM: 0.45, BF: 0.2, FL: 0.08, FT: 0.05, SR: 0.04, FC: 0.07 };

function uniform(random: RandomSource): number {
  return (random.nextUint32() + 0.5) / 4294967296;
}

function normal(random: RandomSource): number {
  return Math.sqrt(-2 * Math.log(uniform(random))) * Math.cos(2 * Math.PI * uniform(random));
}

/** A negative-binomial-like count: gamma-ish multiplicative noise around the mean, then Poisson. */
function weedCount(random: RandomSource, mean: number): number {
  const lambda = Math.max(0, mean * Math.exp(0.35 * normal(random) - 0.06));
  if (lambda > 30) return Math.max(0, Math.round(lambda + Math.sqrt(lambda) * normal(random)));
  const limit = Math.exp(-lambda);
  let product = uniform(random);
  let count = 0;
  while (product > limit) {
    product *= uniform(random);
    count += 1;
  }
  return count;
}

interface DemoPlot {
  id: string;
  number: number;
  block: number;
  code: string;
}

interface DemoAssessment {
  id: string;
  variable: string;
  quadratsPerPlot: number;
  timingDays: number | null;
  position: number;
}

function valuesFor(random: RandomSource, assessment: DemoAssessment, plot: DemoPlot, siteFactor: number, densityIndex: number): number[] {
  const blockEffect = 1 + 0.12 * (plot.block - 2.5);
  const share = survival[plot.code] ?? 0.5;
  const quadrats = Array.from({ length: assessment.quadratsPerPlot }, (_, index) => index);
  switch (assessment.variable) {
    case "weed-density": {
      // Weeds come up over the season: 14 days fewer, 42 days most.
      const checkMean = [18, 34, 41][densityIndex] ?? 30;
      return quadrats.map(() => weedCount(random, checkMean * siteFactor * blockEffect * share));
    }
    case "weed-biomass":
      return quadrats.map(() => Math.max(0, Math.round(10 * (95 * siteFactor * blockEffect * share * Math.exp(0.3 * normal(random)))) / 10));
    case "crop-yield": {
      // Up to 24 kg per 4.5 m² harvest area; weeds take a share of it.
      const loss = 0.55 * share;
      return quadrats.map(() => Math.max(0, Math.round(100 * (24 * (1 - loss) * (1 + 0.06 * (plot.block - 2.5)) + 1.4 * normal(random))) / 100));
    }
    case "labour-time":
      return quadrats.map(() => Math.max(0, Math.round(100 * (labourPerPlot[plot.code] ?? 0.3) * (1 + 0.12 * normal(random))) / 100));
    default:
      return quadrats.map(() => Math.round(10 * (50 + 10 * normal(random))) / 10);
  }
}

async function seedTrial(sequelize: Sequelize, transaction: Transaction | undefined, trialId: string, settings: { seed: number; siteFactor: number }, technicianId: string) {
  const plots = await sequelize.query<DemoPlot>(
    `SELECT p.id, p.number, p.block, t.code FROM plots p JOIN treatments t ON t.id = p.treatment_id WHERE p.trial_id = :trialId ORDER BY p.number`,
    { replacements: { trialId }, type: QueryTypes.SELECT, transaction },
  );
  const assessments = await sequelize.query<DemoAssessment>(
    `SELECT id, variable, quadrats_per_plot AS "quadratsPerPlot", timing_days AS "timingDays", position FROM assessments WHERE trial_id = :trialId ORDER BY position`,
    { replacements: { trialId }, type: QueryTypes.SELECT, transaction },
  );
  const random = mulberry32(settings.seed);
  let densityIndex = 0;
  for (const assessment of assessments) {
    // One lost plot, in the second density count of the first lettuce site, to show an unbalanced analysis.
    const lostPlot = settings.seed === 61 && assessment.variable === "weed-density" && densityIndex === 1 ? plots[5]?.number : undefined;
    const rows: { plotId: string; quadrat: number; value: number }[] = [];
    for (const plot of plots) {
      const values = valuesFor(random, assessment, plot, settings.siteFactor, densityIndex);
      if (plot.number === lostPlot) continue;
      values.forEach((value, index) => rows.push({ plotId: plot.id, quadrat: index + 1, value }));
    }
    if (assessment.variable === "weed-density") densityIndex += 1;
    const [version] = await sequelize.query<{ id: string }>(
      `INSERT INTO dataset_versions (id, assessment_id, trial_id, number, source, upload_id, created_by_id, reason, rows_added, rows_replaced, created_at)
       VALUES (gen_random_uuid(), :assessmentId, :trialId, 1, 'manual', NULL, :userId, NULL, :rows, 0, now()) RETURNING id`,
      { replacements: { assessmentId: assessment.id, trialId, userId: technicianId, rows: rows.length }, type: QueryTypes.SELECT, transaction },
    );
    await writeRawValues(sequelize, version.id, rows, transaction);
    // The audit trail has to account for every version, the demo's first one too, in the very
    // shape commitVersion gives the app's own versions. Not after the lock even in the trial
    // that starts locked: the story is that its data came in before the sign-off.
    await sequelize.query(
      `INSERT INTO audit_events (trial_id, user_id, entity_type, entity_id, action, summary, old_value, new_value, source, reason, after_lock, created_at)
       VALUES (:trialId, :userId, 'assessment-data', :assessmentId, 'create', :summary, NULL, CAST(:newValue AS jsonb), 'demo seed', NULL, false, now())`,
      {
        replacements: {
          trialId,
          userId: technicianId,
          assessmentId: assessment.id,
          summary: `Version 1: ${rows.length} value${rows.length === 1 ? "" : "s"} for the whole assessment (0 replaced)`,
          newValue: JSON.stringify({ version: 1, rowsAdded: rows.length, rowsReplaced: 0 }),
        },
        transaction,
      },
    );
  }
}

/** Writes version 1 of every assessment of the demo trials that collect data, each with its audit event. */
export async function seedDemoObservations(sequelize: Sequelize, transaction?: Transaction): Promise<void> {
  const [technician] = await sequelize.query<{ id: string }>("SELECT id FROM users WHERE email = 'technician@hoebench.test'", { type: QueryTypes.SELECT, transaction });
  if (!technician) return;
  for (const [title, settings] of Object.entries(DEMO_TRIALS)) {
    const [trial] = await sequelize.query<{ id: string }>("SELECT id FROM trials WHERE title = :title", { replacements: { title }, type: QueryTypes.SELECT, transaction });
    if (trial) await seedTrial(sequelize, transaction, trial.id, settings, technician.id);
  }
}

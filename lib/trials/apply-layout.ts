import "server-only";
import { randomInt } from "node:crypto";
import type { Transaction } from "sequelize";
import { randomizeLayout } from "@/lib/layout/randomize";
import { AppError } from "@/lib/errors";
import { db } from "@/lib/db/sequelize";
import { Plot, Treatment, Trial } from "@/models";
import { MAX_SEED } from "@/lib/validations/trial";

/** A fresh seed for "re-randomize"; it is stored, so the new layout is as reproducible as the first. */
export function newSeed(): number {
  return randomInt(1, MAX_SEED);
}

export function layoutProblem(design: Trial["design"], blocks: number, treatmentCount: number): string | null {
  if (treatmentCount < 2) return "Add at least two treatments before randomizing.";
  if (design === "latin" && blocks !== treatmentCount) return `A Latin square needs as many rows and columns as treatments (${treatmentCount}).`;
  return null;
}

/**
 * Lays the trial out from its stored seed: treatments in list order go into randomizeLayout, and
 * its plots replace the old ones. The same seed, design and treatments always give the same plots.
 */
export async function applyLayout(trial: Trial, transaction?: Transaction): Promise<number> {
  const sequelize = db();
  const run = async (t: Transaction) => {
    const treatments = await Treatment.findAll({ where: { trialId: trial.id }, order: [["position", "ASC"]], transaction: t });
    const problem = layoutProblem(trial.design, trial.blocks, treatments.length);
    if (problem) throw new AppError("CONFLICT", problem);
    const planned = randomizeLayout({
      design: trial.design,
      treatmentCount: treatments.length,
      blocks: trial.blocks,
      seed: trial.randomSeed,
      serpentine: trial.serpentine,
    });
    await Plot.destroy({ where: { trialId: trial.id }, transaction: t });
    await Plot.bulkCreate(
      planned.map((plot) => ({
        trialId: trial.id,
        number: plot.number,
        block: plot.block,
        position: plot.position,
        row: plot.row,
        column: plot.column,
        walkOrder: plot.walkOrder,
        treatmentId: treatments[plot.treatmentIndex].id,
      })),
      { transaction: t },
    );
    return planned.length;
  };
  return transaction ? run(transaction) : sequelize.transaction(run);
}

/** A structure change in a draft makes the old layout wrong; it goes, and the plan asks for a new one. */
export async function clearLayout(trialId: string, transaction: Transaction): Promise<void> {
  await Plot.destroy({ where: { trialId }, transaction });
}

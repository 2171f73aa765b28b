import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { notFound } from "@/lib/errors";
import type { Trial } from "@/models";
import { assessmentResultsSchema, type AnalysisOptions, type AssessmentResults } from "@/lib/validations/analysis";
import { assessmentRows, type AssessmentRows } from "./analyze-assessment";
import { buildResults } from "./build-results";
import { LruCache } from "@/lib/lru-cache";

interface AssessmentStamp {
  id: string;
  name: string;
  variable: string;
  unit: string;
  timingDays: number | null;
  version: number;
  treatmentsAt: Date | null;
}

export interface TreatmentLine {
  code: string;
  name: string;
  checkType: string | null;
}

/*
 * Results are cached per process under the trial's data revision: a new version of any of its
 * data, or a change to the trial, its treatments, assessments or plots, gives a new key, so
 * stale results are never served. Plot rows are cached separately by the assessment's own
 * version, so changing options, or a change elsewhere in the trial, only reruns the engine.
 */
const resultCache = new LruCache<{ results: AssessmentResults; body: Uint8Array }>(1000);
const rowCache = new LruCache<{ data: AssessmentRows; treatments: TreatmentLine[] }>(200);

export type CacheOutcome = "hit" | "miss";

async function stampOf(trialId: string, assessmentId: string): Promise<AssessmentStamp> {
  const [stamp] = await db().query<AssessmentStamp>(
    `SELECT a.id, a.name, a.variable, a.unit, a.timing_days AS "timingDays",
            COALESCE((SELECT max(v.number) FROM dataset_versions v WHERE v.assessment_id = a.id), 0)::int AS version,
            (SELECT max(t.updated_at) FROM treatments t WHERE t.trial_id = a.trial_id) AS "treatmentsAt"
       FROM assessments a WHERE a.id = :assessmentId AND a.trial_id = :trialId`,
    { replacements: { assessmentId, trialId }, type: QueryTypes.SELECT },
  );
  if (!stamp) throw notFound("assessment");
  return stamp;
}

export async function treatmentsOf(trialId: string): Promise<TreatmentLine[]> {
  return db().query<TreatmentLine>(
    `SELECT code, name, check_type AS "checkType" FROM treatments WHERE trial_id = :trialId ORDER BY position`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
}

/** The weedy check's code, the default control for percent control. */
export function defaultControl(treatments: TreatmentLine[]): string | undefined {
  return treatments.find((treatment) => treatment.checkType === "weedy")?.code;
}

/** An assessment's results under the given options, from the cache when its data have not changed. */
export async function assessmentResults(trial: Trial, assessmentId: string, options: AnalysisOptions): Promise<{ results: AssessmentResults; body: Uint8Array; cache: CacheOutcome }> {
  // The trial's data revision moves with any version, treatment, assessment or plot change
  // (database triggers), so a hit needs no query beyond the trial row already loaded.
  const trialKey = [trial.id, trial.dataRevision, trial.design, trial.updatedAt?.getTime?.() ?? 0].join("|");
  const optionsKey = [options.transform, options.method, options.alpha, options.control ?? "", options.reference ?? "", options.margin ?? ""].join("|");
  const key = `${trialKey}|${assessmentId}|${optionsKey}`;
  const cached = resultCache.get(key);
  if (cached) return { ...cached, cache: "hit" };

  const stamp = await stampOf(trial.id, assessmentId);
  const dataKey = [assessmentId, stamp.version, trial.design, trial.updatedAt?.getTime?.() ?? 0, stamp.treatmentsAt ? new Date(stamp.treatmentsAt).getTime() : 0].join("|");
  let loaded = rowCache.get(dataKey);
  if (!loaded) {
    const [data, treatments] = await Promise.all([
      assessmentRows(trial, { id: stamp.id, variable: stamp.variable as never, unit: stamp.unit }),
      treatmentsOf(trial.id),
    ]);
    loaded = { data, treatments };
    rowCache.set(dataKey, loaded);
  }
  const results = buildResults({
    trial: { id: trial.id, design: trial.design, status: trial.status },
    assessment: { id: stamp.id, name: stamp.name, variable: stamp.variable, unit: loaded.data.unit, timingDays: stamp.timingDays },
    dataVersion: stamp.version,
    rows: loaded.data.rows,
    treatments: loaded.treatments,
    options,
  });
  // Shaped by the response schema and encoded once, when computed; a cache hit sends the same bytes again.
  const body = Buffer.from(JSON.stringify(assessmentResultsSchema.parse(results)));
  resultCache.set(key, { results, body });
  return { results, body, cache: "miss" };
}

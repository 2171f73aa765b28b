import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import type { SessionUser } from "@/lib/auth/session";
import { listTrials } from "@/lib/data/trials";
import { analyzeTrial, StatsInputError, type AnovaRow, type TreatmentMean } from "@/lib/stats";
import { Trial } from "@/models";
import { assessmentRows } from "./analyze-assessment";

export interface CombinedGroup {
  key: string;
  treatments: string[];
  trials: Array<{ id: string; title: string; site: string; season: string }>;
  assessments: string[];
}

export interface CombinedResult {
  assessment: string;
  unit: string;
  anova: AnovaRow[];
  siteByTreatment: { f: number; p: number } | null;
  means: Array<{ treatment: string; mean: number; se: number; group: string }>;
  perSite: Array<{ site: string; means: Record<string, number> }>;
  warnings: string[];
  advice: string[];
  error: string | null;
}

/**
 * Trials that can be analysed together: the same treatment codes (the same protocol at
 * several sites or years) and assessments of the same name and variable in each.
 */
export async function combinedGroups(user: SessionUser): Promise<CombinedGroup[]> {
  const visible = (await listTrials(user, {})).filter((trial) => trial.status !== "draft");
  if (visible.length < 2) return [];
  const ids = visible.map((trial) => trial.id);
  const [treatments, assessments] = await Promise.all([
    db().query<{ trialId: string; codes: string }>(
      `SELECT trial_id AS "trialId", string_agg(code, ',' ORDER BY code) AS codes FROM treatments WHERE trial_id IN (:ids) GROUP BY trial_id`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    ),
    db().query<{ trialId: string; name: string }>(
      `SELECT a.trial_id AS "trialId", a.variable || ':' || a.name AS name FROM assessments a
        WHERE a.trial_id IN (:ids) AND EXISTS (SELECT 1 FROM dataset_versions v WHERE v.assessment_id = a.id)`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    ),
  ]);
  const byCodes = new Map<string, string[]>();
  for (const row of treatments) byCodes.set(row.codes, [...(byCodes.get(row.codes) ?? []), row.trialId]);
  const groups: CombinedGroup[] = [];
  for (const [codes, trialIds] of byCodes) {
    if (trialIds.length < 2) continue;
    const sets = trialIds.map((id) => new Set(assessments.filter((row) => row.trialId === id).map((row) => row.name)));
    const shared = [...sets[0]].filter((name) => sets.every((set) => set.has(name))).sort();
    if (shared.length === 0) continue;
    groups.push({
      key: codes,
      treatments: codes.split(","),
      trials: visible.filter((trial) => trialIds.includes(trial.id)).map((trial) => ({ id: trial.id, title: trial.title, site: trial.siteName, season: trial.season })),
      assessments: shared.map((name) => name.slice(name.indexOf(":") + 1)),
    });
  }
  return groups;
}

/** Combined RCBD over sites (blocks within sites, site × treatment as the error for treatments) through analyzeTrial. */
export async function combinedAnalysis(group: CombinedGroup, assessmentName: string): Promise<CombinedResult> {
  const trials = await Trial.findAll({ where: { id: group.trials.map((trial) => trial.id) } });
  const rows: Array<Record<string, string | number>> = [];
  const perSite: CombinedResult["perSite"] = [];
  let unit = "";
  for (const trial of trials) {
    const summary = group.trials.find((entry) => entry.id === trial.id)!;
    const site = `${summary.site} ${summary.season}`;
    const [assessment] = await db().query<{ id: string; variable: never; unit: string }>(
      "SELECT id, variable, unit FROM assessments WHERE trial_id = :trialId AND name = :name LIMIT 1",
      { replacements: { trialId: trial.id, name: assessmentName }, type: QueryTypes.SELECT },
    );
    if (!assessment) continue;
    const loaded = await assessmentRows(trial, assessment);
    unit = loaded.unit;
    const sums = new Map<string, { sum: number; n: number }>();
    for (const row of loaded.rows) {
      rows.push({ site, block: `${site} / ${row.block}`, treatment: row.treatment, response: row.response });
      if (row.response !== "NA") {
        const entry = sums.get(row.treatment) ?? { sum: 0, n: 0 };
        sums.set(row.treatment, { sum: entry.sum + row.response, n: entry.n + 1 });
      }
    }
    perSite.push({ site, means: Object.fromEntries([...sums].map(([code, { sum, n }]) => [code, sum / n])) });
  }
  const empty = { assessment: assessmentName, unit, anova: [], siteByTreatment: null, means: [], perSite, warnings: [], advice: [] };
  try {
    const analysis = analyzeTrial(rows, { design: "rcbd", response: "response", treatment: "treatment", block: "block", site: "site" });
    const interaction = analysis.anova?.find((row) => row.source === "site:treatment");
    return {
      ...empty,
      anova: analysis.anova ?? [],
      siteByTreatment: interaction?.f !== undefined && interaction.p !== undefined ? { f: interaction.f, p: interaction.p } : null,
      means: (analysis.means as TreatmentMean[]).map((mean) => ({ treatment: mean.treatment, mean: mean.lsmean, se: mean.se, group: mean.group })),
      warnings: analysis.warnings ?? [],
      advice: analysis.advice ?? [],
      error: null,
    };
  } catch (error) {
    if (!(error instanceof StatsInputError)) throw error;
    return { ...empty, error: `The combined analysis could not be run: ${error.message}.` };
  }
}

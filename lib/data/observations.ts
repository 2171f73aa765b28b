import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import type { RawValue } from "@/lib/observations/plot-values";

export async function currentRawValues(assessmentId: string): Promise<RawValue[]> {
  return db().query<RawValue>(
    `SELECT p.number AS "plotNumber", o.quadrat, o.species, o.value
       FROM current_observations o JOIN plots p ON p.id = o.plot_id
      WHERE o.assessment_id = :assessmentId
      ORDER BY p.number, o.quadrat, o.species`,
    { replacements: { assessmentId }, type: QueryTypes.SELECT },
  );
}

export interface VersionRow {
  id: string;
  number: number;
  source: "upload" | "manual";
  createdAt: Date;
  createdBy: string;
  reason: string | null;
  rowsAdded: number;
  rowsReplaced: number;
  fileName: string | null;
  sha256: string | null;
  sizeBytes: number | null;
}

export async function versionsOf(assessmentId: string): Promise<VersionRow[]> {
  return db().query<VersionRow>(
    `SELECT v.id, v.number, v.source, v.created_at AS "createdAt", u.name AS "createdBy", v.reason,
            v.rows_added AS "rowsAdded", v.rows_replaced AS "rowsReplaced",
            up.original_name AS "fileName", up.sha256, up.size_bytes::float8 AS "sizeBytes"
       FROM dataset_versions v
       JOIN users u ON u.id = v.created_by_id
       LEFT JOIN uploads up ON up.id = v.upload_id
      WHERE v.assessment_id = :assessmentId
      ORDER BY v.number DESC`,
    { replacements: { assessmentId }, type: QueryTypes.SELECT },
  );
}

export interface ValueChange {
  plotNumber: number;
  quadrat: number;
  species: string;
  before: number | null;
  after: number | null;
}

/** What one version changed against the values it replaced; unchanged values are left out. */
export async function changesIn(versionId: string): Promise<ValueChange[]> {
  return db().query<ValueChange>(
    `WITH added AS (SELECT plot_id, quadrat, species, value FROM observations WHERE added_in_version_id = :versionId),
          replaced AS (SELECT plot_id, quadrat, species, value FROM observations WHERE replaced_in_version_id = :versionId)
     SELECT p.number AS "plotNumber", COALESCE(a.quadrat, r.quadrat) AS quadrat, COALESCE(a.species, r.species) AS species,
            r.value AS before, a.value AS after
       FROM added a FULL OUTER JOIN replaced r ON a.plot_id = r.plot_id AND a.quadrat = r.quadrat AND a.species = r.species
       JOIN plots p ON p.id = COALESCE(a.plot_id, r.plot_id)
      WHERE a.value IS DISTINCT FROM r.value
      ORDER BY p.number, quadrat, species`,
    { replacements: { versionId }, type: QueryTypes.SELECT },
  );
}

export interface PlotAssessmentValues {
  assessmentId: string;
  values: { quadrat: number; species: string; value: number }[];
}

/** The current values of one plot in every assessment, for its data-entry page. */
export async function currentValuesOfPlot(trialId: string, plotNumber: number): Promise<PlotAssessmentValues[]> {
  const rows = await db().query<{ assessmentId: string; quadrat: number; species: string; value: number }>(
    `SELECT o.assessment_id AS "assessmentId", o.quadrat, o.species, o.value
       FROM current_observations o JOIN plots p ON p.id = o.plot_id
      WHERE p.trial_id = :trialId AND p.number = :plotNumber
      ORDER BY o.quadrat, o.species`,
    { replacements: { trialId, plotNumber }, type: QueryTypes.SELECT },
  );
  const byAssessment = new Map<string, PlotAssessmentValues>();
  for (const row of rows) {
    if (!byAssessment.has(row.assessmentId)) byAssessment.set(row.assessmentId, { assessmentId: row.assessmentId, values: [] });
    byAssessment.get(row.assessmentId)!.values.push({ quadrat: row.quadrat, species: row.species, value: row.value });
  }
  return [...byAssessment.values()];
}

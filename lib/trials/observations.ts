import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";

/*
 * Whether observations were recorded for a trial (or one of its assessments): the one place
 * the edit rules learn about recorded data. Replaced rows count too: they are part of the record.
 */

export async function hasObservations(trialId: string, assessmentId?: string): Promise<boolean> {
  const [row] = await db().query<{ found: boolean }>(
    `SELECT EXISTS (
       SELECT 1 FROM observation_values v
         JOIN observation_sets s ON s.version_id = v.version_id AND s.plot_id = v.plot_id
         JOIN assessments a ON a.id = s.assessment_id
        WHERE a.trial_id = :trialId ${assessmentId ? "AND a.id = :assessmentId" : ""}
     ) AS found`,
    { type: QueryTypes.SELECT, replacements: { trialId, assessmentId: assessmentId ?? null } },
  );
  return Boolean(row?.found);
}

/** The assessments of a trial that have observations, which pins them. */
export async function assessmentsWithObservations(trialId: string): Promise<Set<string>> {
  const rows = await db().query<{ assessment_id: string }>(
    `SELECT DISTINCT s.assessment_id FROM observation_values v
       JOIN observation_sets s ON s.version_id = v.version_id AND s.plot_id = v.plot_id
       JOIN assessments a ON a.id = s.assessment_id
      WHERE a.trial_id = :trialId`,
    { type: QueryTypes.SELECT, replacements: { trialId } },
  );
  return new Set(rows.map((row) => row.assessment_id));
}

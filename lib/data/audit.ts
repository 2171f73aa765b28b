import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";

export interface AuditRow {
  id: number;
  createdAt: Date;
  userName: string;
  entityType: string;
  entityId: string;
  action: string;
  summary: string;
  source: string;
  reason: string | null;
  afterLock: boolean;
  assessmentName: string | null;
  versionNumber: number | null;
}

export async function auditTrailOf(trialId: string, limit = 500): Promise<AuditRow[]> {
  return db().query<AuditRow>(
    `SELECT e.id, e.created_at AS "createdAt", u.name AS "userName", e.entity_type AS "entityType", e.entity_id AS "entityId",
            e.action, e.summary, e.source, e.reason, e.after_lock AS "afterLock",
            a.name AS "assessmentName", (e.new_value->>'version')::int AS "versionNumber"
       FROM audit_events e
       JOIN users u ON u.id = e.user_id
       LEFT JOIN assessments a ON e.entity_type = 'assessment-data' AND a.id::text = e.entity_id
      WHERE e.trial_id = :trialId
      ORDER BY e.created_at DESC, e.id DESC
      LIMIT :limit`,
    { replacements: { trialId, limit }, type: QueryTypes.SELECT },
  );
}

export interface VersionAudit {
  source: string;
  afterLock: boolean;
}

/** The audit event of one data version: the source as recorded (a demo seed, say) and whether it came after the lock. */
export async function versionAuditOf(trialId: string, assessmentId: string, versionNumber: number): Promise<VersionAudit | null> {
  const [row] = await db().query<VersionAudit>(
    `SELECT e.source, e.after_lock AS "afterLock"
       FROM audit_events e
      WHERE e.trial_id = :trialId AND e.entity_type = 'assessment-data' AND e.entity_id = :assessmentId
        AND (e.new_value->>'version')::int = :versionNumber
      ORDER BY e.id
      LIMIT 1`,
    { replacements: { trialId, assessmentId, versionNumber }, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

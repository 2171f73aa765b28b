import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";

export interface ReviewState {
  id: string;
  status: "requested" | "approved" | "withdrawn";
  message: string;
  requestedBy: string;
  createdAt: Date;
  decidedBy: string | null;
  decidedAt: Date | null;
  decisionNote: string | null;
}

export interface ReviewCommentView {
  id: string;
  assessmentId: string | null;
  parentId: string | null;
  author: string;
  authorRole: string;
  body: string;
  createdAt: Date;
  resolvedAt: Date | null;
  resolvedBy: string | null;
}

/** The trial's newest review request (its review status), or null when none was made. */
export async function reviewStateOf(trialId: string): Promise<ReviewState | null> {
  const [row] = await db().query<ReviewState>(
    `SELECT r.id, r.status, r.message, u.name AS "requestedBy", r.created_at AS "createdAt", d.name AS "decidedBy", r.decided_at AS "decidedAt", r.decision_note AS "decisionNote"
       FROM review_requests r JOIN users u ON u.id = r.requested_by_id LEFT JOIN users d ON d.id = r.decided_by_id
      WHERE r.trial_id = :trialId ORDER BY r.created_at DESC LIMIT 1`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

export async function commentsOf(trialId: string): Promise<ReviewCommentView[]> {
  return db().query<ReviewCommentView>(
    `SELECT c.id, c.assessment_id AS "assessmentId", c.parent_id AS "parentId", u.name AS author, u.role AS "authorRole", c.body,
            c.created_at AS "createdAt", c.resolved_at AS "resolvedAt", r.name AS "resolvedBy"
       FROM review_comments c JOIN users u ON u.id = c.author_id LEFT JOIN users r ON r.id = c.resolved_by_id
      WHERE c.trial_id = :trialId ORDER BY c.created_at`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
}

/** Review status per trial for lists (the reviewer's home page): the newest request's status. */
export async function reviewStatusByTrial(trialIds: string[]): Promise<Map<string, ReviewState["status"]>> {
  if (trialIds.length === 0) return new Map();
  const rows = await db().query<{ trialId: string; status: ReviewState["status"] }>(
    `SELECT DISTINCT ON (trial_id) trial_id AS "trialId", status FROM review_requests WHERE trial_id IN (:trialIds) ORDER BY trial_id, created_at DESC`,
    { replacements: { trialIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((row) => [row.trialId, row.status]));
}

export const reviewStatusText: Record<ReviewState["status"] | "none", string> = {
  none: "Not sent for review",
  requested: "Review requested",
  approved: "Approved by reviewer",
  withdrawn: "Review withdrawn",
};

export interface ChangeAfterLock {
  id: string;
  createdAt: Date;
  changedBy: string;
  assessmentId: string;
  assessmentName: string;
  versionNumber: number;
  source: "upload" | "manual" | null;
  fileName: string | null;
  summary: string;
  reason: string | null;
}

/**
 * Data versions committed after the trial was locked, newest first, for the reviewer who
 * signed off on the data as they were. Read from the audit trail, where commitVersion marks
 * such changes under the assessment's lock.
 */
export async function changesAfterLockOf(trialId: string): Promise<ChangeAfterLock[]> {
  return db().query<ChangeAfterLock>(
    `SELECT e.id::text AS id, e.created_at AS "createdAt", u.name AS "changedBy", a.id AS "assessmentId", a.name AS "assessmentName",
            (e.new_value->>'version')::int AS "versionNumber", v.source, up.original_name AS "fileName", e.summary, e.reason
       FROM audit_events e
       JOIN users u ON u.id = e.user_id
       JOIN assessments a ON a.trial_id = e.trial_id AND a.id::text = e.entity_id
       LEFT JOIN dataset_versions v ON v.assessment_id = a.id AND v.number = (e.new_value->>'version')::int
       LEFT JOIN uploads up ON up.id = v.upload_id
      WHERE e.trial_id = :trialId AND e.entity_type = 'assessment-data' AND e.after_lock
      ORDER BY e.created_at DESC, e.id DESC`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
}

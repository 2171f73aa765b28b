import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { AppError } from "@/lib/errors";
import type pg from "pg";
import { AuditEvent } from "@/models";
import { notify } from "@/lib/notifications/notify";
import type { VersionSource } from "@/models/DatasetVersion";
import { copyValues, encodeValues } from "./copy-values";
import { groupValuesByPlot, type PlotValues } from "./group-values";
import { columnsOf, type PlotValue, type ValueColumns } from "./value-columns";

export type NewValue = PlotValue;

export interface CommitRequest {
  trialId: string;
  assessmentId: string;
  userId: string;
  source: VersionSource;
  uploadId?: string;
  /** An upload replaces the whole data set; a per-plot entry replaces those plots only. */
  replacePlotNumbers?: number[];
  /** A few values as objects, or a file's many as columns. */
  values: NewValue[] | ValueColumns;
  reason?: string;
  /**
   * The trial's plots (number → id) when the caller knows them and `confirm` makes sure they
   * are still the trial's plots; otherwise the commit reads them.
   */
  plotIds?: ReadonlyMap<number, string>;
  /**
   * A check run alongside the commit once it holds the assessment's row (say, that the stored
   * file is still the one read); if it fails, the commit rolls back before writing its values.
   */
  confirm?: () => Promise<void>;
}

export interface CommittedVersion {
  id: string;
  number: number;
  rowsAdded: number;
  rowsReplaced: number;
}

async function lockAssessment(sequelize: Sequelize, request: CommitRequest, transaction: Transaction) {
  const [row] = await sequelize.query<{ status: string }>(
    `SELECT t.status FROM assessments a JOIN trials t ON t.id = a.trial_id
      WHERE a.id = :assessmentId AND a.trial_id = :trialId FOR UPDATE OF a`,
    { replacements: { assessmentId: request.assessmentId, trialId: request.trialId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new AppError("NOT_FOUND", "That assessment does not exist or is not visible to you.");
  return row.status;
}

/**
 * Inserts the version numbered after the assessment's last one (the assessment row is locked,
 * so neither the number nor the values in place can change meanwhile), in one statement with
 * its bookkeeping: the upload it came from is marked, and the values it replaces (those of the
 * sets its insert trigger closes) are counted before they are closed.
 */
async function insertVersion(sequelize: Sequelize, versionId: string, request: CommitRequest, valueCount: number, reason: string | null, transaction: Transaction) {
  // NULL: the whole assessment; a list (even an empty one): those plots only.
  const scope = !request.replacePlotNumbers
    ? "NULL::uuid[]"
    : request.replacePlotNumbers.length === 0
      ? "'{}'::uuid[]"
      : "(SELECT COALESCE(array_agg(id), '{}') FROM plots WHERE trial_id = :trialId AND number IN (:plotNumbers))";
  // Inside the same transaction, so a file can never become two versions.
  const marking = request.uploadId
    ? "marked AS (UPDATE uploads SET status = 'committed', version_id = :versionId, updated_at = now() WHERE id = :uploadId AND status = 'checked' RETURNING 1),"
    : "";
  const [inserted] = await sequelize.query<{ number: number; rowsReplaced: number; marked: number | null }>(
    `WITH ${marking}
     scope AS (SELECT ${scope} AS plot_ids),
     replaced AS (
       SELECT COALESCE(sum(cardinality(v.quadrats)), 0)::int AS value_count
         FROM scope, observation_sets s JOIN observation_values v ON v.version_id = s.version_id AND v.plot_id = s.plot_id
        WHERE s.assessment_id = :assessmentId AND s.replaced_in_version_id IS NULL
          AND (scope.plot_ids IS NULL OR s.plot_id = ANY (scope.plot_ids)))
     INSERT INTO dataset_versions (id, assessment_id, trial_id, number, source, upload_id, created_by_id, reason, rows_added, rows_replaced, scope_plot_ids, created_at)
     SELECT :versionId, :assessmentId, :trialId, COALESCE(MAX(number), 0) + 1, :source, :uploadId, :userId, :reason, :rowsAdded,
            (SELECT value_count FROM replaced), (SELECT plot_ids FROM scope), now()
       FROM dataset_versions WHERE assessment_id = :assessmentId
     RETURNING number, rows_replaced AS "rowsReplaced", ${request.uploadId ? "(SELECT count(*)::int FROM marked)" : "NULL::int"} AS marked`,
    {
      replacements: {
        versionId,
        assessmentId: request.assessmentId,
        trialId: request.trialId,
        source: request.source,
        uploadId: request.uploadId ?? null,
        userId: request.userId,
        reason,
        rowsAdded: valueCount,
        plotNumbers: request.replacePlotNumbers ?? [],
      },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  if (request.uploadId && inserted.marked !== 1) throw new AppError("CONFLICT", "This file has already been committed, or was not checked.");
  return { number: inserted.number, rowsReplaced: inserted.rowsReplaced };
}

/** Sequelize keeps the pg client of a transaction here; COPY has to run on that very client. */
function clientOf(transaction: Transaction): pg.ClientBase {
  const client = (transaction as unknown as { connection?: pg.ClientBase }).connection;
  if (!client) throw new Error("the transaction has no connection");
  return client;
}

/** Encodes batch by batch, letting the event loop turn between batches so the transaction's queries move on meanwhile. */
async function encodeInTurns(grouped: PlotValues[], versionId: string, plotIds: ReadonlyMap<number, string>): Promise<Buffer[]> {
  const payload: Buffer[] = [];
  for (const buffer of encodeValues(grouped, versionId, plotIds)) {
    payload.push(buffer);
    await new Promise((resolve) => setImmediate(resolve));
  }
  return payload;
}

interface VersionFacts {
  request: CommitRequest;
  next: number;
  valueCount: number;
  status: string;
  reason: string | null;
}

/**
 * A new version's notices, queued with the data so a crash after the commit cannot lose them:
 * the owner hears of a new upload, and the reviewers of any change made after their sign-off,
 * with its reason.
 */
async function queueNotices(facts: VersionFacts, transaction: Transaction): Promise<void> {
  const { request, next, status, reason } = facts;
  const change = { trialId: request.trialId, assessmentId: request.assessmentId, versionNumber: next, actorId: request.userId };
  if (request.source === "upload") await notify({ type: "upload-committed", ...change }, { transaction });
  if (status === "locked") await notify({ type: "data-changed-after-lock", ...change, reason: reason ?? "" }, { transaction });
}

/** The audit entry of a new version, written last, after its values. */
async function auditVersion(facts: VersionFacts, rowsReplaced: number, transaction: Transaction): Promise<void> {
  const { request, next, valueCount, status, reason } = facts;
  const where = request.replacePlotNumbers ? `plot${request.replacePlotNumbers.length === 1 ? "" : "s"} ${request.replacePlotNumbers.join(", ")}` : "the whole assessment";
  await AuditEvent.create(
    {
      trialId: request.trialId,
      userId: request.userId,
      entityType: "assessment-data",
      entityId: request.assessmentId,
      action: rowsReplaced > 0 ? "update" : "create",
      summary: `Version ${next}: ${valueCount} value${valueCount === 1 ? "" : "s"} for ${where} (${rowsReplaced} replaced)`,
      oldValue: null,
      newValue: { version: next, rowsAdded: valueCount, rowsReplaced },
      source: request.source === "upload" ? `upload ${request.uploadId}` : "per-plot entry",
      reason,
      afterLock: status === "locked",
    },
    { transaction },
  );
}

/**
 * Writes a new numbered version of an assessment's data in one transaction: all of it or
 * none. The assessment row is locked first, so two commits at once become versions N and
 * N+1 in turn, never a mix. Old values are superseded plot by plot (observation sets), never
 * overwritten; the new ones go in with one binary COPY, a row per plot.
 */
export async function commitVersion(sequelize: Sequelize, request: CommitRequest): Promise<CommittedVersion> {
  const columns = Array.isArray(request.values) ? columnsOf(request.values) : request.values;
  const valueCount = columns.plotNumbers.length;
  return sequelize.transaction(async (transaction) => {
    const status = await lockAssessment(sequelize, request, transaction);
    if (status === "published") throw new AppError("CONFLICT", "This trial is published; its data can no longer change.");
    const reason = request.reason?.trim() || null;
    if (status === "locked" && !reason) {
      throw new AppError("INVALID_INPUT", "This trial is locked after review: say why the data change. The reviewer will see your reason.", [
        { path: "reason", message: "Say why the data change." },
      ]);
    }

    // The database works through the version's rows (its insert trigger opens the sets) and
    // bookkeeping while this thread groups and encodes the values, turn by turn.
    const versionId = randomUUID();
    const plotsRead: Promise<ReadonlyMap<number, string>> = request.plotIds
      ? Promise.resolve(request.plotIds)
      : sequelize
          .query<{ id: string; number: number }>("SELECT id, number FROM plots WHERE trial_id = :trialId", {
            replacements: { trialId: request.trialId },
            type: QueryTypes.SELECT,
            transaction,
          })
          .then((plots) => new Map(plots.map((plot) => [plot.number, plot.id])));
    const recorded = insertVersion(sequelize, versionId, request, valueCount, reason, transaction).then(async ({ number, rowsReplaced }) => {
      const facts: VersionFacts = { request, next: number, valueCount, status, reason };
      await queueNotices(facts, transaction);
      return { facts, rowsReplaced };
    });
    recorded.catch(() => {});
    const confirmed = request.confirm?.();
    confirmed?.catch(() => {});
    let payload: Buffer[] | null;
    try {
      const plotIds = await plotsRead;
      const unknown = request.replacePlotNumbers?.find((number) => !plotIds.has(number));
      if (unknown !== undefined) throw new AppError("INVALID_INPUT", `Plot ${unknown} is not in this trial.`);
      // Refuses unknown plots and a second value for a cell too.
      const grouped = groupValuesByPlot(columns, [...plotIds.keys()]);
      payload = grouped.length > 0 ? await encodeInTurns(grouped, versionId, plotIds) : null;
    } catch (error) {
      // Nothing may still be using the transaction when it rolls back.
      await recorded.catch(() => {});
      throw error;
    }
    const { facts, rowsReplaced } = await recorded;
    // Ran alongside everything above; a refusal rolls it back before the values go out.
    await confirmed;
    if (payload) await copyValues(clientOf(transaction), payload);
    await auditVersion(facts, rowsReplaced, transaction);
    return { id: versionId, number: facts.next, rowsAdded: valueCount, rowsReplaced };
  });
}

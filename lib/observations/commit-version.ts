import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { AppError } from "@/lib/errors";
import type pg from "pg";
import { AuditEvent, DatasetVersion } from "@/models";
import { notify } from "@/lib/notifications/notify";
import type { VersionSource } from "@/models/DatasetVersion";
import { copyValues, encodeValues } from "./copy-values";
import { groupValuesByPlot } from "./group-values";

export interface NewValue {
  plotNumber: number;
  quadrat: number;
  species: string;
  value: number;
}

export interface CommitRequest {
  trialId: string;
  assessmentId: string;
  userId: string;
  source: VersionSource;
  uploadId?: string;
  /** An upload replaces the whole data set; a per-plot entry replaces those plots only. */
  replacePlotNumbers?: number[];
  values: NewValue[];
  reason?: string;
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

/** Sequelize keeps the pg client of a transaction here; COPY has to run on that very client. */
function clientOf(transaction: Transaction): pg.ClientBase {
  const client = (transaction as unknown as { connection?: pg.ClientBase }).connection;
  if (!client) throw new Error("the transaction has no connection");
  return client;
}

/**
 * Writes a new numbered version of an assessment's data in one transaction: all of it or
 * none. The assessment row is locked first, so two commits at once become versions N and
 * N+1 in turn, never a mix. Old values are superseded plot by plot (observation sets), never
 * overwritten; the new ones go in with one binary COPY, a row per plot.
 */
export async function commitVersion(sequelize: Sequelize, request: CommitRequest): Promise<CommittedVersion> {
  return sequelize.transaction(async (transaction) => {
    const status = await lockAssessment(sequelize, request, transaction);
    if (status === "published") throw new AppError("CONFLICT", "This trial is published; its data can no longer change.");
    const reason = request.reason?.trim() || null;
    if (status === "locked" && !reason) {
      throw new AppError("INVALID_INPUT", "This trial is locked after review: say why the data change. The reviewer will see your reason.", [
        { path: "reason", message: "Say why the data change." },
      ]);
    }

    const plots = await sequelize.query<{ id: string; number: number }>(
      "SELECT id, number FROM plots WHERE trial_id = :trialId",
      { replacements: { trialId: request.trialId }, type: QueryTypes.SELECT, transaction },
    );
    const plotIds = new Map(plots.map((plot) => [plot.number, plot.id]));
    const unknown = request.values.find((value) => !plotIds.has(value.plotNumber));
    if (unknown) throw new AppError("INVALID_INPUT", `Plot ${unknown.plotNumber} is not in this trial.`);

    const [{ next }] = await sequelize.query<{ next: number }>(
      "SELECT COALESCE(MAX(number), 0) + 1 AS next FROM dataset_versions WHERE assessment_id = :assessmentId",
      { replacements: { assessmentId: request.assessmentId }, type: QueryTypes.SELECT, transaction },
    );
    // Named here, so the values can be encoded for their COPY while the version is inserted.
    const versionId = randomUUID();
    const creating = DatasetVersion.create(
      {
        id: versionId,
        assessmentId: request.assessmentId,
        trialId: request.trialId,
        number: next,
        source: request.source,
        uploadId: request.uploadId ?? null,
        createdById: request.userId,
        reason,
        rowsAdded: request.values.length,
        rowsReplaced: 0,
        scopePlotIds: request.replacePlotNumbers ? request.replacePlotNumbers.map((number) => plotIds.get(number)).filter((id): id is string => Boolean(id)) : null,
      },
      { transaction },
    );
    // Checked and encoded while the database writes the version and its sets (a refusal rolls both back):
    // one turn of the event loop puts the insert on the wire before this thread gets busy.
    creating.catch(() => {});
    await new Promise((resolve) => setImmediate(resolve));
    const grouped = groupValuesByPlot(request.values, plots.map((plot) => plot.number));
    const payload = grouped.length > 0 ? encodeValues(grouped, versionId, plotIds) : null;
    const version = await creating;

    // The version's insert trigger has closed the earlier sets of the plots it covers.
    const [{ rowsReplaced }] = await sequelize.query<{ rowsReplaced: number }>(
      `SELECT COALESCE(sum(cardinality(v.quadrats)), 0)::int AS "rowsReplaced"
         FROM observation_sets s JOIN observation_values v ON v.version_id = s.version_id AND v.plot_id = s.plot_id
        WHERE s.replaced_in_version_id = :versionId`,
      { replacements: { versionId: version.id }, type: QueryTypes.SELECT, transaction },
    );
    if (payload) await copyValues(clientOf(transaction), payload);
    if (request.uploadId) {
      // Inside the same transaction, so a file can never become two versions.
      const [, marked] = (await sequelize.query(
        "UPDATE uploads SET status = 'committed', version_id = :versionId, updated_at = now() WHERE id = :uploadId AND status = 'checked'",
        { replacements: { versionId: version.id, uploadId: request.uploadId }, transaction },
      )) as [unknown, { rowCount?: number } | number];
      if ((typeof marked === "number" ? marked : marked?.rowCount) !== 1) {
        throw new AppError("CONFLICT", "This file has already been committed, or was not checked.");
      }
    }
    await version.update({ rowsReplaced }, { transaction });

    const where = request.replacePlotNumbers ? `plot${request.replacePlotNumbers.length === 1 ? "" : "s"} ${request.replacePlotNumbers.join(", ")}` : "the whole assessment";
    await AuditEvent.create(
      {
        trialId: request.trialId,
        userId: request.userId,
        entityType: "assessment-data",
        entityId: request.assessmentId,
        action: rowsReplaced > 0 ? "update" : "create",
        summary: `Version ${next}: ${request.values.length} value${request.values.length === 1 ? "" : "s"} for ${where} (${rowsReplaced} replaced)`,
        oldValue: null,
        newValue: { version: next, rowsAdded: request.values.length, rowsReplaced },
        source: request.source === "upload" ? `upload ${request.uploadId}` : "per-plot entry",
        reason,
        afterLock: status === "locked",
      },
      { transaction },
    );
    // Queued with the data, so a crash after the commit cannot lose them: the owner hears of a
    // new upload, and the reviewers of any change made after their sign-off, with its reason.
    const change = { trialId: request.trialId, assessmentId: request.assessmentId, versionNumber: next, actorId: request.userId };
    if (request.source === "upload") await notify({ type: "upload-committed", ...change }, { transaction });
    if (status === "locked") await notify({ type: "data-changed-after-lock", ...change, reason: reason ?? "" }, { transaction });
    return { id: version.id, number: next, rowsAdded: request.values.length, rowsReplaced };
  });
}

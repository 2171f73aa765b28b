import "server-only";
import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { AppError } from "@/lib/errors";
import { AuditEvent, DatasetVersion } from "@/models";
import type { VersionSource } from "@/models/DatasetVersion";

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

const INSERT_CHUNK = 25_000;

async function lockAssessment(sequelize: Sequelize, request: CommitRequest, transaction: Transaction) {
  const [row] = await sequelize.query<{ status: string }>(
    `SELECT t.status FROM assessments a JOIN trials t ON t.id = a.trial_id
      WHERE a.id = :assessmentId AND a.trial_id = :trialId FOR UPDATE OF a`,
    { replacements: { assessmentId: request.assessmentId, trialId: request.trialId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new AppError("NOT_FOUND", "That assessment does not exist or is not visible to you.");
  return row.status;
}

async function insertValues(sequelize: Sequelize, request: CommitRequest, versionId: string, plotIds: Map<number, string>, transaction: Transaction) {
  for (let start = 0; start < request.values.length; start += INSERT_CHUNK) {
    const chunk = request.values.slice(start, start + INSERT_CHUNK);
    await sequelize.query(
      `INSERT INTO observations (assessment_id, plot_id, quadrat, species, value, added_in_version_id)
       SELECT :assessmentId, plot_id, quadrat, species, value, :versionId
         FROM unnest(:plotIds::uuid[], :quadrats::int[], :species::text[], :values::float8[]) AS v(plot_id, quadrat, species, value)`,
      {
        replacements: {
          assessmentId: request.assessmentId,
          versionId,
          plotIds: `{${chunk.map((value) => plotIds.get(value.plotNumber)).join(",")}}`,
          quadrats: `{${chunk.map((value) => value.quadrat).join(",")}}`,
          species: `{${chunk.map((value) => `"${value.species.replace(/(["\\])/g, "\\$1")}"`).join(",")}}`,
          values: `{${chunk.map((value) => value.value).join(",")}}`,
        },
        transaction,
      },
    );
  }
}

/**
 * Writes a new numbered version of an assessment's data in one transaction: all of it or
 * none. The assessment row is locked first, so two commits at once become versions N and
 * N+1 in turn, never a mix. Old rows are closed, not overwritten.
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
    const version = await DatasetVersion.create(
      {
        assessmentId: request.assessmentId,
        trialId: request.trialId,
        number: next,
        source: request.source,
        uploadId: request.uploadId ?? null,
        createdById: request.userId,
        reason,
        rowsAdded: request.values.length,
        rowsReplaced: 0,
      },
      { transaction },
    );

    const scope = request.replacePlotNumbers
      ? { clause: "AND plot_id = ANY(:scopePlotIds::uuid[])", scopePlotIds: `{${request.replacePlotNumbers.map((n) => plotIds.get(n)).filter(Boolean).join(",")}}` }
      : { clause: "", scopePlotIds: "{}" };
    const [, replaced] = (await sequelize.query(
      `UPDATE observations SET replaced_in_version_id = :versionId
        WHERE assessment_id = :assessmentId AND replaced_in_version_id IS NULL ${scope.clause}`,
      { replacements: { versionId: version.id, assessmentId: request.assessmentId, scopePlotIds: scope.scopePlotIds }, transaction },
    )) as [unknown, { rowCount?: number } | number];
    const rowsReplaced = typeof replaced === "number" ? replaced : (replaced?.rowCount ?? 0);

    await insertValues(sequelize, request, version.id, plotIds, transaction);
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
    return { id: version.id, number: next, rowsAdded: request.values.length, rowsReplaced };
  });
}

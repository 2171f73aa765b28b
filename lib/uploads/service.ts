import "server-only";
import { createHash, randomUUID } from "node:crypto";
import { db } from "@/lib/db/sequelize";
import { AppError, notFound } from "@/lib/errors";
import { readCsv } from "@/lib/ingest/read-csv";
import { recordsOf, type IngestContext, type IngestProblem, type IngestRecord } from "@/lib/ingest/types";
import { commitVersion, type CommittedVersion } from "@/lib/observations/commit-version";
import { objectInfo, openObject, presignUpload } from "@/lib/storage/objects";
import type { ReadCsvResult } from "@/lib/ingest/read-csv";
import type { SessionUser } from "@/lib/auth/session";
import type { StartUploadInput } from "@/lib/validations/uploads";
import { Upload, type Trial } from "@/models";
import { assertRecordable } from "@/lib/observations/recordable";
import { assertAssessmentOf, ingestContextFor } from "./context";
import { currentValuesOf, rememberCurrentValues, summarizeChanges, type ChangeSummary } from "./change-summary";
import { safeOriginalName } from "./file-name";

export interface StartedUpload {
  uploadId: string;
  putUrl: string;
  contentType: string;
}

export interface CheckedUpload {
  uploadId: string;
  status: "checked" | "refused";
  format: "long" | "wide" | null;
  rowCount: number;
  sha256: string;
  problems: IngestProblem[];
  errors: number;
  warnings: number;
  preview: IngestRecord[];
  changes: ChangeSummary;
}

const CONTENT_TYPE = "text/csv";
const PREVIEW_ROWS = 200;

export async function uploadTrialId(uploadId: string): Promise<string> {
  db();
  const upload = await Upload.findByPk(uploadId, { attributes: ["trialId"] });
  if (!upload) throw notFound("upload");
  return upload.trialId;
}

/** Registers the file and hands back a presigned PUT; the object key never uses the file's own name. */
export async function startUpload(user: SessionUser, trial: Trial, input: StartUploadInput): Promise<StartedUpload> {
  assertRecordable(trial);
  await assertAssessmentOf(input.trialId, input.assessmentId);
  const id = randomUUID();
  const objectKey = `trials/${input.trialId}/assessments/${input.assessmentId}/uploads/${id}.csv`;
  const putUrl = await presignUpload(objectKey, CONTENT_TYPE, input.sizeBytes);
  await Upload.create({
    id,
    trialId: input.trialId,
    assessmentId: input.assessmentId,
    objectKey,
    originalName: safeOriginalName(input.fileName),
    declaredSizeBytes: input.sizeBytes,
    sizeBytes: null,
    sha256: null,
    rowCount: null,
    uploadedById: user.id,
    versionId: null,
  });
  return { uploadId: id, putUrl, contentType: CONTENT_TYPE };
}

async function loadUpload(uploadId: string): Promise<Upload> {
  const upload = await Upload.findByPk(uploadId);
  if (!upload) throw notFound("upload");
  if (upload.status === "committed") throw new AppError("CONFLICT", "This file has already been committed as a version.");
  return upload;
}

/**
 * The last few checked files, by upload: a commit on the same server right after its check
 * reuses the parse instead of reading the file again, when storage still holds the very
 * same object (same entity tag) and the file would be checked against the same assessment
 * settings and plots.
 */
const recentlyChecked = new Map<string, { etag: string; contextDigest: string; plotIds: Map<number, string>; result: ReadCsvResult }>();
const RECENT_LIMIT = 4;

/** Everything a file is checked against (plots with their treatments, quadrats, unit, range) as one digest. */
const contextDigest = (context: IngestContext) => createHash("sha256").update(JSON.stringify(context)).digest("hex");

/**
 * Whether storage still holds the very object a remembered parse was made from, and the
 * assessment still asks what it asked then. Run once the commit holds the assessment's row,
 * so no change to its settings can land between this reading and the commit.
 */
async function stillAsChecked(upload: Upload, cached: { etag: string; contextDigest: string }): Promise<boolean> {
  const [info, context] = await Promise.all([objectInfo(upload.objectKey), ingestContextFor(upload.trialId, upload.assessmentId)]);
  if (info === null) throw new AppError("CONFLICT", "The file has not arrived in storage. Upload it again.");
  return Boolean(info.etag) && info.etag === cached.etag && contextDigest(context) === cached.contextDigest;
}

async function readStoredFile(upload: Upload): Promise<ReadCsvResult> {
  // Storage and the database are asked at once.
  const contextRead = ingestContextFor(upload.trialId, upload.assessmentId);
  contextRead.catch(() => {});
  // One request gives the size, the entity tag and the bytes.
  const stored = await openObject(upload.objectKey);
  if (stored === null) throw new AppError("CONFLICT", "The file has not arrived in storage. Upload it again.");
  if (stored.size !== Number(upload.declaredSizeBytes)) {
    stored.body.destroy?.();
    throw new AppError("INVALID_INPUT", "The stored file is not the size that was announced. Upload it again.");
  }
  const context = await contextRead;
  const result = await readCsv(stored.body, context, undefined, { expectedBytes: stored.size });
  recentlyChecked.delete(upload.id);
  const plotIds = new Map(context.plots.map((plot) => [plot.number, plot.id!]));
  recentlyChecked.set(upload.id, { etag: stored.etag, contextDigest: contextDigest(context), plotIds, result });
  while (recentlyChecked.size > RECENT_LIMIT) recentlyChecked.delete(recentlyChecked.keys().next().value!);
  return result;
}

/** Reads the stored file back, checks every row, and keeps the problems with the upload. */
export async function checkUpload(uploadId: string): Promise<CheckedUpload> {
  db();
  const upload = await loadUpload(uploadId);
  // The database reads the values in place while this process parses the file.
  const current = currentValuesOf(upload.assessmentId);
  current.catch(() => {});
  const result = await readStoredFile(upload);
  const errors = result.problems.filter((problem) => problem.severity === "error").length;
  const status = errors > 0 ? "refused" : "checked";
  const saved = upload.update({ status, problems: result.problems, rowCount: result.rowsRead, sizeBytes: result.sizeBytes, sha256: result.sha256 });
  saved.catch(() => {});
  // The change summary is worked out while the database records the check.
  const changes = summarizeChanges(result.values, await current);
  await saved;
  return {
    uploadId,
    status,
    format: result.format,
    rowCount: result.rowsRead,
    sha256: result.sha256,
    problems: result.problems,
    errors,
    warnings: result.problems.length - errors,
    preview: recordsOf(result.values, 0, PREVIEW_ROWS),
    changes,
  };
}

/** The remembered parse turned out not to match what storage holds, or what the assessment asks, now. */
class StoredFileChanged extends Error {}

/**
 * Commits a checked file as the assessment's next version; the file must not have changed.
 * A parse remembered from the check (of this very file: same checksum) is committed while
 * storage and the assessment are confirmed unchanged alongside; a failed confirmation rolls
 * the commit back before its values are written, and the file is read and checked again.
 */
export async function commitUpload(user: SessionUser, uploadId: string, reason?: string): Promise<CommittedVersion> {
  db();
  const upload = await loadUpload(uploadId);
  if (upload.status !== "checked") throw new AppError("CONFLICT", "Check the file and fix its errors before committing it.");
  const cached = recentlyChecked.get(upload.id);
  // Another server may have checked a newer file under the same upload since.
  if (cached && cached.result.sha256 === upload.sha256) {
    const confirm = async () => {
      if (!(await stillAsChecked(upload, cached))) throw new StoredFileChanged();
    };
    try {
      // The digest confirmed covers the plots' ids too, so the commit need not read them.
      return await commitChecked(user, upload, cached.result, reason, { confirm, plotIds: cached.plotIds });
    } catch (error) {
      if (!(error instanceof StoredFileChanged)) throw error;
    }
  }
  recentlyChecked.delete(upload.id);
  return commitChecked(user, upload, await readStoredFile(upload), reason);
}

async function commitChecked(
  user: SessionUser,
  upload: Upload,
  result: ReadCsvResult,
  reason: string | undefined,
  remembered?: { confirm: () => Promise<void>; plotIds: ReadonlyMap<number, string> },
): Promise<CommittedVersion> {
  if (result.sha256 !== upload.sha256) throw new AppError("CONFLICT", "The stored file changed after it was checked. Check it again.");
  if (result.problems.some((problem) => problem.severity === "error")) throw new AppError("CONFLICT", "The file has errors; fix them and upload it again.");
  const version = await commitVersion(db(), {
    trialId: upload.trialId,
    assessmentId: upload.assessmentId,
    userId: user.id,
    source: "upload",
    uploadId: upload.id,
    values: result.values,
    reason,
    confirm: remembered?.confirm,
    plotIds: remembered?.plotIds,
  });
  recentlyChecked.delete(upload.id);
  // An upload replaces every plot: the values now in place are exactly the file's rows.
  rememberCurrentValues(upload.assessmentId, { versionId: version.id, source: result.values });
  return version;
}

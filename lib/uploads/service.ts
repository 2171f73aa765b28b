import "server-only";
import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { AppError, notFound } from "@/lib/errors";
import { readCsv } from "@/lib/ingest/read-csv";
import type { IngestProblem, IngestRecord } from "@/lib/ingest/types";
import { commitVersion, type CommittedVersion } from "@/lib/observations/commit-version";
import { currentRawValues } from "@/lib/data/observations";
import { objectInfo, openObject, presignUpload } from "@/lib/storage/objects";
import type { ReadCsvResult } from "@/lib/ingest/read-csv";
import type { SessionUser } from "@/lib/auth/session";
import type { StartUploadInput } from "@/lib/validations/uploads";
import { Upload, type Trial } from "@/models";
import { assertRecordable } from "@/lib/observations/recordable";
import { ingestContextFor } from "./context";
import { safeOriginalName } from "./file-name";

export interface StartedUpload {
  uploadId: string;
  putUrl: string;
  contentType: string;
}

export interface ChangeSummary {
  added: number;
  changed: number;
  unchanged: number;
  removed: number;
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
  await ingestContextFor(input.trialId, input.assessmentId);
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
 * same object (same entity tag) and the plots have not changed.
 */
const recentlyChecked = new Map<string, { etag: string; plotCount: number; result: ReadCsvResult }>();
const RECENT_LIMIT = 4;

async function readStoredFile(upload: Upload): Promise<ReadCsvResult> {
  // Storage and the database are asked at once.
  const contextRead = ingestContextFor(upload.trialId, upload.assessmentId);
  contextRead.catch(() => {});
  const cached = recentlyChecked.get(upload.id);
  if (cached) {
    // The parse is reused only for the very same stored object (entity tag) and plots.
    const info = await objectInfo(upload.objectKey);
    if (info === null) throw new AppError("CONFLICT", "The file has not arrived in storage. Upload it again.");
    const context = await contextRead;
    if (info.etag && cached.etag === info.etag && cached.plotCount === context.plots.length) return cached.result;
  }
  // One request gives the size, the entity tag and the bytes.
  const stored = await openObject(upload.objectKey);
  if (stored === null) throw new AppError("CONFLICT", "The file has not arrived in storage. Upload it again.");
  if (stored.size !== Number(upload.declaredSizeBytes)) {
    stored.body.destroy?.();
    throw new AppError("INVALID_INPUT", "The stored file is not the size that was announced. Upload it again.");
  }
  const context = await contextRead;
  const result = await readCsv(stored.body, context);
  recentlyChecked.delete(upload.id);
  recentlyChecked.set(upload.id, { etag: stored.etag, plotCount: context.plots.length, result });
  while (recentlyChecked.size > RECENT_LIMIT) recentlyChecked.delete(recentlyChecked.keys().next().value!);
  return result;
}

/**
 * The values in place, keyed by plot, quadrat and species (case aside), for the preview's
 * change summary. A version never changes once written, so the values current at an
 * assessment's latest version can be kept: after an upload commits, they are exactly the
 * file's rows, and the next check of that assessment needs no 100,000-row read.
 */
interface CurrentValues {
  versionId: string;
  source: readonly { plotNumber: number; quadrat: number; species: string; value: number }[];
  index?: ValueIndex;
}

/** Values by species (case aside), then by plot × 64 + quadrat: small-integer keys, no string per value. */
type ValueIndex = Map<string, Map<number, number>>;

const currentByAssessment = new Map<string, CurrentValues>();

function remember(assessmentId: string, values: CurrentValues): void {
  currentByAssessment.delete(assessmentId);
  currentByAssessment.set(assessmentId, values);
  while (currentByAssessment.size > RECENT_LIMIT) currentByAssessment.delete(currentByAssessment.keys().next().value!);
}

function indexValues(values: CurrentValues["source"]): ValueIndex {
  const index: ValueIndex = new Map();
  for (const entry of values) {
    const species = entry.species.toLowerCase();
    let bySlot = index.get(species);
    if (!bySlot) index.set(species, (bySlot = new Map()));
    bySlot.set(entry.plotNumber * 64 + entry.quadrat, entry.value);
  }
  return index;
}

async function currentValuesOf(assessmentId: string): Promise<CurrentValues | null> {
  const [latest] = await db().query<{ id: string }>(
    "SELECT id FROM dataset_versions WHERE assessment_id = :assessmentId ORDER BY number DESC LIMIT 1",
    { replacements: { assessmentId }, type: QueryTypes.SELECT },
  );
  if (!latest) return null;
  let current = currentByAssessment.get(assessmentId);
  if (current?.versionId !== latest.id) {
    current = { versionId: latest.id, source: await currentRawValues(assessmentId) };
    remember(assessmentId, current);
  }
  return current;
}

const sameCell = (a: { plotNumber: number; quadrat: number; species: string }, b: { plotNumber: number; quadrat: number; species: string }) =>
  a.plotNumber === b.plotNumber && a.quadrat === b.quadrat && (a.species === b.species || a.species.toLowerCase() === b.species.toLowerCase());

/** A corrected file usually lists the same cells in the same order as the one before: then no lookups are needed. */
function compareInStep(records: IngestRecord[], source: CurrentValues["source"]): ChangeSummary | null {
  if (records.length !== source.length) return null;
  const summary: ChangeSummary = { added: 0, changed: 0, unchanged: 0, removed: 0 };
  for (let index = 0; index < records.length; index += 1) {
    const record = records[index];
    const before = source[index];
    if (!sameCell(record, before)) return null;
    if (before.value === record.value) summary.unchanged += 1;
    else summary.changed += 1;
  }
  return summary;
}

function compare(records: IngestRecord[], current: CurrentValues | null): ChangeSummary {
  if (!current) return { added: records.length, changed: 0, unchanged: 0, removed: 0 };
  const inStep = compareInStep(records, current.source);
  if (inStep) return inStep;
  current.index ??= indexValues(current.source);
  const existing = current.index;
  const summary: ChangeSummary = { added: 0, changed: 0, unchanged: 0, removed: 0 };
  let lastSpecies: string | null = null;
  let bySlot: Map<number, number> | undefined;
  for (const record of records) {
    if (record.species !== lastSpecies) {
      lastSpecies = record.species;
      bySlot = existing.get(record.species.toLowerCase());
    }
    const before = bySlot?.get(record.plotNumber * 64 + record.quadrat);
    if (before === undefined) summary.added += 1;
    else if (before === record.value) summary.unchanged += 1;
    else summary.changed += 1;
  }
  // Keys are unique on both sides, so whatever was not met again is removed.
  let existingCount = 0;
  for (const values of existing.values()) existingCount += values.size;
  summary.removed = existingCount - summary.changed - summary.unchanged;
  return summary;
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
  await upload.update({ status, problems: result.problems, rowCount: result.rowsRead, sizeBytes: result.sizeBytes, sha256: result.sha256 });
  return {
    uploadId,
    status,
    format: result.format,
    rowCount: result.rowsRead,
    sha256: result.sha256,
    problems: result.problems,
    errors,
    warnings: result.problems.length - errors,
    preview: result.records.slice(0, PREVIEW_ROWS),
    changes: compare(result.records, await current),
  };
}

/** Commits a checked file as the assessment's next version; the file is read again and must not have changed. */
export async function commitUpload(user: SessionUser, uploadId: string, reason?: string): Promise<CommittedVersion> {
  const sequelize = db();
  const upload = await loadUpload(uploadId);
  if (upload.status !== "checked") throw new AppError("CONFLICT", "Check the file and fix its errors before committing it.");
  const result = await readStoredFile(upload);
  if (result.sha256 !== upload.sha256) throw new AppError("CONFLICT", "The stored file changed after it was checked. Check it again.");
  if (result.problems.some((problem) => problem.severity === "error")) throw new AppError("CONFLICT", "The file has errors; fix them and upload it again.");
  const version = await commitVersion(sequelize, {
    trialId: upload.trialId,
    assessmentId: upload.assessmentId,
    userId: user.id,
    source: "upload",
    uploadId: upload.id,
    values: result.records,
    reason,
  });
  recentlyChecked.delete(upload.id);
  // An upload replaces every plot: the values now in place are exactly the file's rows.
  remember(upload.assessmentId, { versionId: version.id, source: result.records });
  return version;
}

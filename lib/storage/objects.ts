import "server-only";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { AppError } from "@/lib/errors";
import { bucket, s3 } from "./s3";

const PRESIGN_SECONDS = 15 * 60;
const HEAD_TIMEOUT_MS = 5_000;

function unavailable(): AppError {
  return new AppError("UNAVAILABLE", "File storage is not answering. Nothing was recorded; try again in a minute.");
}

/**
 * A browser PUT straight to storage; the signature binds type and length, so the object
 * cannot be swapped for another kind or size than the one declared.
 */
export async function presignUpload(key: string, contentType: string, sizeBytes: number): Promise<string> {
  try {
    return await getSignedUrl(s3(), new PutObjectCommand({ Bucket: bucket(), Key: key, ContentType: contentType, ContentLength: sizeBytes }), {
      expiresIn: PRESIGN_SECONDS,
      signableHeaders: new Set(["content-type", "content-length"]),
    });
  } catch {
    throw unavailable();
  }
}

export async function objectSize(key: string): Promise<number | null> {
  return (await objectInfo(key))?.size ?? null;
}

/** Storage answered that there is no such object (as opposed to not answering at all). */
function isMissingObject(error: unknown): boolean {
  const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
  return status === 404 || ["NotFound", "NoSuchKey"].includes((error as Error).name);
}

/** Size and entity tag of a stored object; the tag changes whenever the object is replaced. */
export async function objectInfo(key: string): Promise<{ size: number; etag: string } | null> {
  try {
    // Bounded: a commit waits on this while it holds its assessment's row.
    const head = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }), { abortSignal: AbortSignal.timeout(HEAD_TIMEOUT_MS) });
    return { size: head.ContentLength ?? 0, etag: head.ETag ?? "" };
  } catch (error) {
    if (isMissingObject(error)) return null;
    throw unavailable();
  }
}

/** The object's size, entity tag and bytes in one request; null when there is no such object. */
export async function openObject(key: string): Promise<{ size: number; etag: string; body: AsyncIterable<Uint8Array> & { destroy?: () => void } } | null> {
  try {
    const response = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return { size: response.ContentLength ?? 0, etag: response.ETag ?? "", body: response.Body as AsyncIterable<Uint8Array> & { destroy?: () => void } };
  } catch (error) {
    if (isMissingObject(error)) return null;
    throw unavailable();
  }
}

export async function readObject(key: string): Promise<AsyncIterable<Uint8Array>> {
  try {
    const response = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return response.Body as AsyncIterable<Uint8Array>;
  } catch {
    throw unavailable();
  }
}

export async function writeObject(key: string, body: Buffer | string, contentType: string): Promise<void> {
  try {
    await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
  } catch {
    throw unavailable();
  }
}

export async function deleteObject(key: string): Promise<void> {
  try {
    await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
  } catch {
    throw unavailable();
  }
}

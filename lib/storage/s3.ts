import "server-only";
import { HeadBucketCommand, type S3Client } from "@aws-sdk/client-s3";
import { config } from "@/lib/config";
import { createS3Client } from "./client";

const globalForS3 = globalThis as unknown as { hoebenchS3?: S3Client };

/** Path-style against the loopback fake; a real bucket needs only other settings. */
export function s3(): S3Client {
  // Two attempts: a storage outage should answer the user quickly, not after long retries.
  globalForS3.hoebenchS3 ??= createS3Client(config(), { maxAttempts: 2 });
  return globalForS3.hoebenchS3;
}

export function bucket(): string {
  return config().S3_BUCKET;
}

export async function storageReachable(): Promise<boolean> {
  try {
    await s3().send(new HeadBucketCommand({ Bucket: bucket() }), { abortSignal: AbortSignal.timeout(2000) });
    return true;
  } catch {
    return false;
  }
}

import "server-only";
import { HeadBucketCommand, S3Client } from "@aws-sdk/client-s3";
import { config } from "@/lib/config";

const globalForS3 = globalThis as unknown as { hoebenchS3?: S3Client };

/** Path-style against the loopback fake; a real bucket needs only other settings. */
export function s3(): S3Client {
  if (!globalForS3.hoebenchS3) {
    const settings = config();
    globalForS3.hoebenchS3 = new S3Client({
      endpoint: settings.S3_ENDPOINT,
      region: settings.S3_REGION,
      forcePathStyle: settings.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: settings.S3_ACCESS_KEY_ID, secretAccessKey: settings.S3_SECRET_ACCESS_KEY },
      // Otherwise presigned PUT URLs carry a checksum of an empty body and browsers' uploads fail.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
      maxAttempts: 2,
    });
  }
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

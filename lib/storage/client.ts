import { S3Client } from "@aws-sdk/client-s3";
import type { AppConfig } from "@/lib/config";

/**
 * The one way to build an S3 client from settings: path-style against the loopback fake, and
 * checksums only when required, otherwise presigned PUT URLs carry a checksum of an empty body
 * and browsers' uploads fail. No server-only guard: backups and restores run outside the app.
 */
export function createS3Client(settings: AppConfig, options: { maxAttempts?: number } = {}): S3Client {
  return new S3Client({
    endpoint: settings.S3_ENDPOINT,
    region: settings.S3_REGION,
    forcePathStyle: settings.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: settings.S3_ACCESS_KEY_ID, secretAccessKey: settings.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    ...options,
  });
}

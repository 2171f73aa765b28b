import { CreateBucketCommand, GetObjectCommand, HeadBucketCommand, ListObjectsV2Command, PutObjectCommand } from "@aws-sdk/client-s3";
import type { AppConfig } from "@/lib/config";
import { createS3Client } from "@/lib/storage/client";

/** A plain S3 client for backups and restores, which run outside the app (its own module is server-only). */
export function objectStore(settings: AppConfig) {
  const client = createS3Client(settings);
  return {
    async get(bucket: string, key: string): Promise<Buffer | null> {
      try {
        const response = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        return Buffer.from(await response.Body!.transformToByteArray());
      } catch (error) {
        if ((error as Error).name === "NoSuchKey" || (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
        throw error;
      }
    },
    async put(bucket: string, key: string, body: Buffer): Promise<void> {
      await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body }));
    },
    async ensureEmptyBucket(bucket: string): Promise<void> {
      try {
        await client.send(new HeadBucketCommand({ Bucket: bucket }));
      } catch {
        await client.send(new CreateBucketCommand({ Bucket: bucket }));
      }
      const listing = await client.send(new ListObjectsV2Command({ Bucket: bucket, MaxKeys: 1 }));
      if ((listing.KeyCount ?? 0) > 0) throw new Error(`bucket ${bucket} is not empty; restore only into an empty bucket`);
    },
    close: () => client.destroy(),
  };
}

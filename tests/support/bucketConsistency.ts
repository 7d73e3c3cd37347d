import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import type { Db } from "../../server/db/client.js";
import { files } from "../../server/db/schema.js";

export interface BucketComparison {
  objects: string[];
  rows: string[];
  /** Objects in the bucket that no files row names. */
  orphanObjects: string[];
  /** Files rows whose object is not in the bucket. */
  rowsWithoutObject: string[];
}

/** An S3 client for the local s3rver (its fixed S3RVER credentials). */
export const localS3Client = (endpoint: string) =>
  new S3Client({ endpoint, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });

/** Every key in the bucket, page by page (ListObjectsV2). */
export async function listKeys(client: S3Client, bucket: string): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys.sort();
}

/** Compares the bucket's objects with the files table (the whole database: it must be the test's own). */
export async function compareBucketWithFiles(db: Db, client: S3Client, bucket: string): Promise<BucketComparison> {
  const objects = await listKeys(client, bucket);
  const rows = (await db.select({ key: files.storageKey }).from(files)).map((r) => r.key).sort();
  return { objects, rows, orphanObjects: objects.filter((k) => !rows.includes(k)), rowsWithoutObject: rows.filter((k) => !objects.includes(k)) };
}

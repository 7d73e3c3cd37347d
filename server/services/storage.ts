import { CreateBucketCommand, DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { Upload } from "@aws-sdk/lib-storage";
import type { Readable } from "node:stream";

export interface StorageOptions {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

/** The file store: one S3 bucket, objects named by opaque keys. */
export interface StorageService {
  bucket: string;
  ensureBucket(): Promise<void>;
  put(key: string, body: Readable, contentType: string): Promise<void>;
  get(key: string): Promise<Readable>;
  remove(key: string): Promise<void>;
  /** Every object in the bucket with its last-modified time. */
  list(): Promise<{ key: string; lastModified: Date }[]>;
  check(): Promise<void>;
  close(): void;
}

export function createStorageService(opts: StorageOptions): StorageService {
  const client = new S3Client({
    endpoint: opts.endpoint,
    region: opts.region,
    forcePathStyle: true,
    credentials: { accessKeyId: opts.accessKeyId, secretAccessKey: opts.secretAccessKey },
    maxAttempts: 2,
  });
  const bucket = opts.bucket;
  return {
    bucket,
    ensureBucket: async () => {
      try {
        await client.send(new HeadBucketCommand({ Bucket: bucket }));
      } catch {
        await client.send(new CreateBucketCommand({ Bucket: bucket }));
      }
    },
    put: async (key, body, contentType) => {
      await new Upload({ client, params: { Bucket: bucket, Key: key, Body: body, ContentType: contentType }, queueSize: 2, partSize: 8 * 1024 * 1024 }).done();
    },
    get: async (key) => {
      const out = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
      return out.Body as Readable;
    },
    remove: async (key) => {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },
    list: async () => {
      const out: { key: string; lastModified: Date }[] = [];
      let token: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
        for (const o of page.Contents ?? []) if (o.Key) out.push({ key: o.Key, lastModified: o.LastModified ?? new Date(0) });
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
      return out;
    },
    check: async () => {
      await client.send(new HeadBucketCommand({ Bucket: bucket }));
    },
    close: () => client.destroy(),
  };
}

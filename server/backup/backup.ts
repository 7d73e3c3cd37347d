import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { ListObjectsV2Command, S3Client, GetObjectCommand, PutObjectCommand, CreateBucketCommand, HeadBucketCommand } from "@aws-sdk/client-s3";
import { ensurePostgresInstalled } from "../services/postgres.js";

export interface S3Target {
  endpoint: string;
  bucket: string;
  region?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
}

const client = (t: S3Target) =>
  new S3Client({ endpoint: t.endpoint, region: t.region ?? "us-east-1", forcePathStyle: true, credentials: { accessKeyId: t.accessKeyId ?? "S3RVER", secretAccessKey: t.secretAccessKey ?? "S3RVER" } });

// Object keys are opaque ("files/<uuid>"); on disk each becomes one file with "/" replaced.
const keyToName = (key: string) => encodeURIComponent(key);
const nameToKey = (name: string) => decodeURIComponent(name);

/**
 * Writes a backup to `dir`: database.dump (pg_dump, custom format), files/ (every object of the
 * bucket) and manifest.json (each object's SHA-256, and the dump's).
 */
export async function backup(databaseUrl: string, store: S3Target, dir: string): Promise<{ objects: number; dumpSha256: string }> {
  const bin = ensurePostgresInstalled();
  mkdirSync(join(dir, "files"), { recursive: true });
  const dump = join(dir, "database.dump");
  execFileSync(join(bin, "pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", "--file", dump, databaseUrl], { stdio: ["ignore", "ignore", "pipe"] });
  const s3 = client(store);
  const objects: Record<string, string> = {};
  let token: string | undefined;
  try {
    do {
      const page = await s3.send(new ListObjectsV2Command({ Bucket: store.bucket, ContinuationToken: token }));
      for (const o of page.Contents ?? []) {
        const body = await (await s3.send(new GetObjectCommand({ Bucket: store.bucket, Key: o.Key! }))).Body!.transformToByteArray();
        writeFileSync(join(dir, "files", keyToName(o.Key!)), body);
        objects[o.Key!] = createHash("sha256").update(body).digest("hex");
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  } finally {
    s3.destroy();
  }
  const dumpSha256 = createHash("sha256").update(readFileSync(dump)).digest("hex");
  writeFileSync(join(dir, "manifest.json"), JSON.stringify({ format: "isobatch-backup", version: 1, createdAt: new Date().toISOString(), dumpSha256, objects }, null, 2));
  return { objects: Object.keys(objects).length, dumpSha256 };
}

/** Restores a backup into an empty database and bucket, checking every hash in the manifest first. */
export async function restore(dir: string, databaseUrl: string, store: S3Target): Promise<{ objects: number }> {
  const manifest = JSON.parse(readFileSync(join(dir, "manifest.json"), "utf8")) as { dumpSha256: string; objects: Record<string, string> };
  const dump = join(dir, "database.dump");
  if (createHash("sha256").update(readFileSync(dump)).digest("hex") !== manifest.dumpSha256) throw new Error("The database dump does not match the hash in manifest.json; the backup is damaged.");
  for (const name of readdirSync(join(dir, "files"))) {
    const key = nameToKey(name);
    if (createHash("sha256").update(readFileSync(join(dir, "files", name))).digest("hex") !== manifest.objects[key]) throw new Error(`The stored file ${key} does not match its hash in manifest.json; the backup is damaged.`);
  }
  const bin = ensurePostgresInstalled();
  execFileSync(join(bin, "pg_restore"), ["--no-owner", "--no-privileges", "--exit-on-error", "--dbname", databaseUrl, dump], { stdio: ["ignore", "ignore", "pipe"] });
  const s3 = client(store);
  try {
    try {
      await s3.send(new HeadBucketCommand({ Bucket: store.bucket }));
    } catch {
      await s3.send(new CreateBucketCommand({ Bucket: store.bucket }));
    }
    for (const key of Object.keys(manifest.objects)) await s3.send(new PutObjectCommand({ Bucket: store.bucket, Key: key, Body: readFileSync(join(dir, "files", keyToName(key))) }));
  } finally {
    s3.destroy();
  }
  return { objects: Object.keys(manifest.objects).length };
}

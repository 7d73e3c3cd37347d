import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { inject } from "vitest";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { files } from "../../../server/db/schema.js";

let t: TestApp;
let c: Client;
let personId: string;
const bucket = "isobatch-files-test";
const s3 = new S3Client({ endpoint: inject("s3Endpoint"), region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });

beforeAll(async () => {
  t = await startTestApp({ bucket, settings: { uploadMaxBytes: 64 * 1024 } });
  const p = await buildPerson(t.database.db);
  personId = p.id;
  c = new Client(t.app);
  await c.signIn(p.email, p.password);
});
afterAll(async () => {
  s3.destroy();
  await t.close();
});

const objectCount = async () => (await s3.send(new ListObjectsV2Command({ Bucket: bucket }))).KeyCount ?? 0;
const rowCount = async () => (await t.database.db.select().from(files).where(eq(files.uploadedBy, personId))).length;
const upload = (content: Buffer | string, filename: string) => c.agent.post("/api/files").set("X-CSRF-Token", c.csrf).attach("file", Buffer.from(content), filename);

// The smallest valid PNG signature + IHDR chunk start is enough for content sniffing.
const PNG = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), Buffer.from("IHDR"), Buffer.alloc(200, 7)]);

describe("files", () => {
  it("stores an upload with its SHA-256 and serves it back after checking the hash", async () => {
    const csv = "time (s),volume (L)\n0,40.0\n60,41.2\n";
    const res = await upload(csv, "logger.csv");
    expect(res.status).toBe(201);
    const expected = createHash("sha256").update(csv).digest("hex");
    expect(res.body.file).toMatchObject({ contentType: "text/csv", sizeBytes: csv.length, sha256: expected, originalName: "logger.csv" });
    const [row] = await t.database.db.select().from(files).where(eq(files.id, res.body.file.id));
    expect(row.storageKey).not.toContain("logger"); // never the file's own name
    const back = await c.get(`/api/files/${res.body.file.id}`).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on("data", (d: Buffer) => parts.push(d));
      r.on("end", () => cb(null, Buffer.concat(parts)));
    });
    expect(back.status).toBe(200);
    expect(back.headers["x-content-sha256"]).toBe(expected);
    expect((back.body as Buffer).toString()).toBe(csv);
  });

  it("judges the type from the content: a PNG named .csv is stored as a PNG", async () => {
    const res = await upload(PNG, "photo.csv");
    expect(res.status).toBe(201);
    expect(res.body.file.contentType).toBe("image/png");
  });

  it("refuses a file over the size limit with 413 and stores nothing", async () => {
    const [rows, objects] = [await rowCount(), await objectCount()];
    const res = await upload("x".repeat(64 * 1024 + 10), "big.txt");
    expect(res.status).toBe(413);
    expect(res.body.error.field).toBe("file");
    expect(await rowCount()).toBe(rows);
    expect(await objectCount()).toBe(objects);
  });

  it("refuses a type outside the allow-list with 415 and stores nothing", async () => {
    const [rows, objects] = [await rowCount(), await objectCount()];
    const zip = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(300, 1)]);
    const res = await upload(zip, "trace.csv");
    expect(res.status).toBe(415);
    const binary = await upload(Buffer.from([0, 1, 2, 3, 0, 255, 254]), "data.bin");
    expect(binary.status).toBe(415);
    expect(await rowCount()).toBe(rows);
    expect(await objectCount()).toBe(objects);
  });

  it("refuses a download whose stored bytes no longer match the hash", async () => {
    const res = await upload("time (s),volume (L)\n0,1\n", "x.csv");
    await t.database.db.update(files).set({ sha256: "0".repeat(64) }).where(eq(files.id, res.body.file.id));
    const back = await c.get(`/api/files/${res.body.file.id}`);
    expect(back.status).toBe(409);
    expect(back.body.error.code).toBe("file-hash-mismatch");
  });

  it("answers 400 without a file part and 404 for an unknown id", async () => {
    const none = await c.agent.post("/api/files").set("X-CSRF-Token", c.csrf).field("note", "no file");
    expect(none.status).toBe(400);
    expect(none.body.error.field).toBe("file");
    expect((await c.get("/api/files/00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await c.get("/api/files/not-a-uuid")).status).toBe(404);
  });
});

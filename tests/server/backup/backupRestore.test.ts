import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createHash } from "node:crypto";
import { count } from "drizzle-orm";
import { GetObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { startTestApp, Client, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";
import { backup, restore } from "../../../server/backup/backup.js";
import { createDatabase } from "../../../server/db/client.js";
import { verifyAuditChain } from "../../../server/commands/auditVerifier.js";
import { auditEvents, files, people } from "../../../server/db/schema.js";

let t: TestApp;
const dir = mkdtempSync(join(tmpdir(), "isobatch-backup-"));
beforeAll(async () => {
  // The isolated database: nothing else in the run writes files or people there.
  t = await startTestApp({ databaseUrl: inject("isolatedDatabaseUrl"), bucket: "isobatch-backup-source" });
});
afterAll(async () => {
  await t.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("backup and restore", () => {
  it("restores a backup into an empty instance with every file hash and the audit chain intact", async () => {
    const p = await buildPerson(t.database.db, { roles: ["operator"] });
    const c = new Client(t.app);
    await c.signIn(p.email, p.password);
    for (let i = 0; i < 3; i++) {
      const res = await c.agent.post("/api/files").set("X-CSRF-Token", c.csrf).attach("file", Buffer.from(`time (s),volume (L)\n0,1\n${i + 1},1.1\n`), `trace-${i}.csv`);
      expect(res.status).toBe(201);
    }
    const source = { endpoint: inject("s3Endpoint"), bucket: "isobatch-backup-source" };
    const made = await backup(inject("isolatedDatabaseUrl"), source, dir);
    expect(made.objects).toBe(3);

    const target = { endpoint: inject("s3Endpoint"), bucket: "isobatch-backup-restored" };
    await restore(dir, inject("emptyDatabaseUrl"), target);
    const restored = createDatabase(inject("emptyDatabaseUrl"));
    const s3 = new S3Client({ endpoint: target.endpoint, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });
    try {
      expect(await verifyAuditChain(restored.db)).toMatchObject({ ok: true });
      const [a, b] = [(await restored.db.select({ n: count() }).from(auditEvents))[0].n, (await t.database.db.select({ n: count() }).from(auditEvents))[0].n];
      expect(a).toBeGreaterThan(0);
      expect(a).toBeLessThanOrEqual(b);
      expect((await restored.db.select({ n: count() }).from(people))[0].n).toBeGreaterThan(0);
      const rows = await restored.db.select().from(files);
      expect(rows).toHaveLength(3);
      for (const row of rows) {
        const body = await (await s3.send(new GetObjectCommand({ Bucket: target.bucket, Key: row.storageKey }))).Body!.transformToByteArray();
        expect(createHash("sha256").update(body).digest("hex")).toBe(row.sha256);
      }
      // The restored trail is as append-only as the original.
      await expect(restored.pool.query("delete from audit_events")).rejects.toThrow(/append-only/);
    } finally {
      s3.destroy();
      await restored.close();
    }
  });
});

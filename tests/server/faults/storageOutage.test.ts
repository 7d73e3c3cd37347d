import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { request as httpRequest, type Server } from "node:http";
import type { S3Client } from "@aws-sdk/client-s3";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { startOwnServices, type OwnServices } from "../../support/ownServices.js";
import { firstOrderCsv } from "../../support/batchDriver.js";
import { HttpSession } from "../../support/httpSession.js";
import { startCuttingProxy, type CuttingProxy } from "../../support/cuttingProxy.js";
import { compareBucketWithFiles, localS3Client } from "../../support/bucketConsistency.js";
import { sweepOrphanObjects } from "../../../server/services/orphanSweep.js";
import { buildPerson, type BuiltPerson } from "../../factories.js";

// The file store goes away while files are being uploaded: the person gets a clear 503, and the
// bucket and the files table still name the same objects (or a sweep is needed to make them).
const BUCKET = "isobatch-fault-files";
let services: OwnServices;
let t: TestApp;
let server: Server;
let baseUrl: string;
let person: BuiltPerson;
let s3: S3Client;
beforeAll(async () => {
  services = await startOwnServices("isobatch-fault-s3-");
  t = await startTestApp({ databaseUrl: services.databaseUrl, s3Endpoint: services.s3Endpoint, smtpUrl: services.smtpUrl, bucket: BUCKET, settings: { uploadMaxBytes: 4 * 1024 * 1024 } });
  await t.storage.ensureBucket();
  server = await new Promise<Server>((ok) => {
    const s = t.app.listen(0, "127.0.0.1", () => ok(s));
  });
  const address = server.address();
  baseUrl = `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`;
  person = await buildPerson(t.database.db, { roles: ["operator"] });
  s3 = localS3Client(services.s3Endpoint);
});
afterAll(async () => {
  s3?.destroy();
  server?.closeAllConnections();
  await new Promise((ok) => server?.close(ok));
  await t?.close();
  await services?.stop();
});

interface Upload {
  /** Sends what is left of the body and waits for the answer. */
  finish(): Promise<{ status: number; body: any; text: string }>;
}

/** Starts a multipart upload of `content` and sends only its first `headBytes`. */
async function beginUpload(session: HttpSession, content: Buffer, headBytes: number): Promise<Upload> {
  const boundary = "isobatch-fault-boundary";
  const body = Buffer.concat([Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="logger.csv"\r\nContent-Type: text/csv\r\n\r\n`), content, Buffer.from(`\r\n--${boundary}--\r\n`)]);
  let pending: () => unknown = () => undefined;
  const answer = new Promise<{ status: number; body: any; text: string }>((ok, fail) => {
    const req = httpRequest(`${baseUrl}/api/files`, { method: "POST", headers: { cookie: session.cookie, "x-csrf-token": session.csrf, "content-type": `multipart/form-data; boundary=${boundary}`, "content-length": String(body.length) } }, (res) => {
      let text = "";
      res.setEncoding("utf8").on("data", (c) => (text += c)).on("end", () => ok({ status: res.statusCode!, body: JSON.parse(text || "null"), text }));
    });
    req.on("error", fail);
    req.write(body.subarray(0, headBytes));
    pending = () => req.end(body.subarray(headBytes));
  });
  await new Promise((r) => setTimeout(r, 300)); // the app has read the head and is streaming into the store
  return { finish: () => (pending(), answer) };
}

const csv = (n: number) => Buffer.from(firstOrderCsv(2.0e-3, 22, { n }));

describe("the file store stopped during an upload", () => {
  it("answers 503 storage-unavailable, and leaves no files row without its object and no object without its row", async () => {
    const session = await new HttpSession(baseUrl).signIn(person.email, person.password);
    const good = await beginUpload(session, csv(200), 64);
    const kept = await good.finish();
    expect(kept.status).toBe(201);

    const upload = await beginUpload(session, csv(8000), 64 * 1024);
    await services.stopS3();
    const refused = await upload.finish();
    await services.startS3();
    expect(refused.status).toBe(503);
    expect(refused.body.error.code).toBe("storage-unavailable");
    expect(refused.body.error.message).toMatch(/file store/i);
    expect(refused.text).not.toMatch(/\bat .+:\d+:\d+|node_modules/);

    const after = await compareBucketWithFiles(t.database.db, s3, BUCKET);
    expect(after.rows).toHaveLength(1); // the good file only
    expect(after.rowsWithoutObject).toEqual([]);
    expect(after.orphanObjects).toEqual([]);
  });

  it("removes with the sweep an object left without its row when the store died after storing it but before answering", async () => {
    // The app writes to the store through a relay that drops the store's answer to the PUT;
    // the store is stopped at that moment, so the app's clean-up DELETE cannot reach it either.
    let proxy: CuttingProxy | undefined;
    let stopping: Promise<void> | undefined;
    proxy = await startCuttingProxy(services.s3Port, () => {
      stopping = services.stopS3();
    });
    const relayed = await startTestApp({ databaseUrl: services.databaseUrl, s3Endpoint: proxy.url, smtpUrl: services.smtpUrl, bucket: BUCKET });
    try {
      const local = await new Promise<Server>((ok) => {
        const s = relayed.app.listen(0, "127.0.0.1", () => ok(s));
      });
      const address = local.address();
      const url = `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`;
      const session = await new HttpSession(url).signIn(person.email, person.password);
      const before = await compareBucketWithFiles(t.database.db, s3, BUCKET);
      const res = await fetch(`${url}/api/files`, { method: "POST", headers: { cookie: session.cookie, "x-csrf-token": session.csrf }, body: formWith(csv(100)) });
      const body = await res.json();
      local.closeAllConnections();
      await new Promise((ok) => local.close(ok));
      expect(proxy.cut()).toBe(true);
      await stopping;
      await services.startS3();
      expect(res.status).toBe(503);
      expect(body.error.code).toBe("storage-unavailable");

      const after = await compareBucketWithFiles(t.database.db, s3, BUCKET);
      expect(after.rows).toEqual(before.rows); // no row was written
      expect(after.rowsWithoutObject).toEqual([]);
      // The stored object has no row: only the server's sweep removes it.
      expect(after.orphanObjects).toHaveLength(1);
      expect(after.orphanObjects[0]).toMatch(/^files\/[0-9a-f-]{36}$/);

      expect(await sweepOrphanObjects(t.database.db, t.storage, 3_600_000)).toEqual([]); // too young to be judged an orphan
      const swept = await sweepOrphanObjects(t.database.db, t.storage, 0);
      expect(swept).toEqual(after.orphanObjects);
      const clean = await compareBucketWithFiles(t.database.db, s3, BUCKET);
      expect(clean.orphanObjects).toEqual([]);
      expect(clean.objects).toEqual(clean.rows); // the kept file's object survived the sweep
    } finally {
      await relayed.close();
      await proxy.close();
    }
  });
});

function formWith(content: Buffer): FormData {
  const form = new FormData();
  form.append("file", new Blob([new Uint8Array(content)], { type: "text/csv" }), "logger.csv");
  return form;
}

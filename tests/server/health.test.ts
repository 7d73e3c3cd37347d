import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { startTestApp, type TestApp } from "../support/testApp.js";
import { freePort } from "../support/freePort.js";

let healthy: TestApp;
let broken: TestApp;
beforeAll(async () => {
  healthy = await startTestApp();
  const dead = await freePort();
  broken = await startTestApp({ s3Endpoint: `http://127.0.0.1:${dead}`, smtpUrl: `smtp://127.0.0.1:${dead}` });
});
afterAll(async () => {
  await healthy.close();
  await broken.close();
});

describe("GET /api/health", () => {
  it("answers 200 with every part ok", async () => {
    const res = await request(healthy.app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok", db: "ok", storage: "ok", mail: "ok" });
  });

  it("answers 503 naming the parts that are down", async () => {
    const res = await request(broken.app).get("/api/health");
    expect(res.status).toBe(503);
    expect(res.body.db).toBe("ok");
    expect(res.body.storage).toMatch(/^down/);
    expect(res.body.mail).toMatch(/^down/);
  });

  it("answers an unknown API path with 404 in the one error shape", async () => {
    const res = await request(healthy.app).get("/api/nothing-here");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("no-such-route");
  });

  it("answers malformed JSON with 400, not 500", async () => {
    const res = await request(healthy.app).post("/api/session").set("Content-Type", "application/json").send("{not json");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid-json");
  });
});

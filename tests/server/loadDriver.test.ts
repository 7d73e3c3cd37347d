import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runLoad } from "../support/loadDriver.js";

// The load benchmark's figures leave out each slice's lead-in; this checks that the driver counts
// exactly the answers sent after it, and every failure wherever it falls.
const LEAD_IN_S = 0.6;
let server: Server;
let url = "";
let started = 0;
const sentAt = new Map<string, number>();
let answered = 0;

beforeAll(async () => {
  server = createServer((req, res) => {
    req.resume();
    req.on("end", () => {
      answered++;
      // The very first request fails, inside the lead-in.
      if (answered === 1) {
        res.writeHead(500, { "content-type": "application/json" }).end("{}");
        return;
      }
      const id = `r${answered}`;
      sentAt.set(id, performance.now() - started);
      res.writeHead(201, { "content-type": "application/json" }).end(JSON.stringify({ id }));
    });
  });
  await new Promise<void>((ok) => server.listen(0, "127.0.0.1", ok));
  url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(() => new Promise<void>((ok) => server.close(() => ok())));

describe("load driver", () => {
  it("leaves the lead-in's answers out of the figures but counts its failures", async () => {
    let measuringAt = Number.NaN;
    const targets = [0, 1].map((i) => ({ path: `/samples/${i}`, headers: {}, body: "{}" }));
    started = performance.now();
    const outcome = await runLoad({ url, targets, durationS: 0.8, leadInS: LEAD_IN_S, idPath: ["id"] }, () => {
      measuringAt = performance.now() - started;
    });
    expect(outcome.non2xx).toBe(1);
    expect(outcome.statusCodes["500"]).toBeUndefined();
    expect(outcome.leadInAcknowledged.length).toBeGreaterThan(0);
    expect(outcome.acknowledged.length).toBe(outcome.ok2xx);
    expect(outcome.latenciesMs.length).toBe(outcome.ok2xx);
    expect(outcome.statusCodes["201"]).toBe(outcome.ok2xx);
    // The worker's clock starts after it has loaded, so each id is judged against when the
    // measured part began as the caller saw it, give or take the message's way across.
    const slack = 50;
    for (const id of outcome.leadInAcknowledged) expect(sentAt.get(id)).toBeLessThan(measuringAt + slack);
    for (const id of outcome.acknowledged) expect(sentAt.get(id)).toBeGreaterThan(measuringAt - slack);
    expect(outcome.durationS).toBeGreaterThan(0.7);
    expect(outcome.durationS).toBeLessThan(1.5);
  });
});

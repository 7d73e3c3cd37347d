import { parentPort, workerData } from "node:worker_threads";
import autocannon from "autocannon";
import type { LoadRun, LoadOutcome } from "./loadDriver.js";

// Runs in its own thread so the load generator does not share the server's event loop.
const run = workerData as LoadRun;
const acknowledged: string[] = [];
const latenciesMs: number[] = [];
let next = 0;

function idAt(body: string, path: string[]): string | undefined {
  try {
    let value: any = JSON.parse(body);
    for (const key of path) value = value?.[key];
    return typeof value === "string" ? value : undefined;
  } catch {
    return undefined;
  }
}

parentPort!.postMessage({ started: true });
const instance = autocannon(
  {
    url: run.url,
    connections: run.targets.length,
    duration: run.durationS,
    timeout: run.timeoutS ?? 10,
    method: "POST",
    // Each connection is one client: its own path, cookie and token, kept for the whole run.
    setupClient: (client) => {
      const target = run.targets[next++ % run.targets.length];
      client.setRequests([
        {
          method: "POST",
          path: target.path,
          headers: { "content-type": "application/json", ...target.headers },
          body: target.body,
          onResponse: (status, body) => {
            if (status < 200 || status >= 300) return;
            const id = idAt(body, run.idPath);
            if (id) acknowledged.push(id);
          },
        },
      ]);
    },
  },
  (err, result) => {
    if (err) {
      parentPort!.postMessage({ error: String(err) });
      return;
    }
    // Off the main thread autocannon hands back raw counters; its own aggregation gives the percentiles.
    const raw = result as unknown as { totalCompletedRequests: number };
    const aggregate = (autocannon as unknown as { aggregateResult(r: unknown, o: object): autocannon.Result }).aggregateResult([result], { url: run.url, connections: run.targets.length });
    const statusCodes = Object.fromEntries(Object.entries(result.statusCodeStats ?? {}).map(([code, v]) => [code, v.count ?? 0]));
    const outcome: LoadOutcome = {
      durationS: result.duration,
      requestsPerSecond: raw.totalCompletedRequests / result.duration,
      ok2xx: result["2xx"],
      non2xx: result.non2xx,
      errors: result.errors,
      timeouts: result.timeouts,
      p50Ms: aggregate.latency.p50,
      p99Ms: aggregate.latency.p99,
      maxMs: aggregate.latency.max,
      statusCodes,
      acknowledged,
      latenciesMs,
    };
    parentPort!.postMessage({ outcome });
  },
);
// Every completed request's time, so runs split into slices can be pooled exactly.
instance.on("response", (_client: unknown, _status: number, _bytes: number, responseTimeMs: number) => latenciesMs.push(responseTimeMs));
instance.on("error", (err) => parentPort!.postMessage({ error: String(err) }));

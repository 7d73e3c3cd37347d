import { parentPort, workerData } from "node:worker_threads";
import autocannon from "autocannon";
import { nearestRank, type LoadRun, type LoadOutcome } from "./loadDriver.js";

// Runs in its own thread so the load generator does not share the server's event loop.
const run = workerData as LoadRun;
const leadInMs = (run.leadInS ?? 0) * 1000;
const acknowledged: string[] = [];
const leadInAcknowledged: string[] = [];
const latenciesMs: number[] = [];
const statusCodes: Record<string, number> = {};
let ok2xx = 0;
let non2xx = 0;
let next = 0;
let measuring = leadInMs === 0;
let measuredFrom = 0;

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
const startMeasuring = () => {
  measuring = true;
  measuredFrom = performance.now();
  parentPort!.postMessage({ measuring: true });
};
if (measuring) startMeasuring();
else setTimeout(startMeasuring, leadInMs);
const instance = autocannon(
  {
    url: run.url,
    connections: run.targets.length,
    duration: (leadInMs / 1000) + run.durationS,
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
            if (id) (measuring ? acknowledged : leadInAcknowledged).push(id);
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
    // Counted here rather than by autocannon, so the lead-in is left out; failures (non-2xx,
    // errors and timeouts, the last two autocannon's own) count over the whole run.
    const durationS = (performance.now() - measuredFrom) / 1000;
    const sorted = Float64Array.from(latenciesMs).sort();
    const outcome: LoadOutcome = {
      durationS,
      requestsPerSecond: latenciesMs.length / durationS,
      ok2xx,
      non2xx,
      errors: result.errors,
      timeouts: result.timeouts,
      p50Ms: nearestRank(sorted, 0.5),
      p99Ms: nearestRank(sorted, 0.99),
      maxMs: sorted.length === 0 ? Number.NaN : sorted[sorted.length - 1],
      statusCodes,
      acknowledged,
      leadInAcknowledged,
      latenciesMs,
    };
    parentPort!.postMessage({ outcome });
  },
);
// Every completed request's time after the lead-in, so runs split into slices can be pooled exactly.
instance.on("response", (_client: unknown, status: number, _bytes: number, responseTimeMs: number) => {
  const ok = status >= 200 && status < 300;
  if (!ok) non2xx++;
  if (!measuring) return;
  latenciesMs.push(responseTimeMs);
  statusCodes[status] = (statusCodes[status] ?? 0) + 1;
  if (ok) ok2xx++;
});
instance.on("error", (err) => parentPort!.postMessage({ error: String(err) }));

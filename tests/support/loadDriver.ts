import { Worker } from "node:worker_threads";

/** What one connection sends, again and again, for the whole run. */
export interface LoadTarget {
  path: string;
  headers: Record<string, string>;
  body: string;
}

export interface LoadRun {
  url: string;
  /** One per connection. */
  targets: LoadTarget[];
  durationS: number;
  timeoutS?: number;
  /** Where the created row's id sits in a 2xx JSON body, e.g. ["sample", "id"]. */
  idPath: string[];
}

export interface LoadOutcome {
  durationS: number;
  /** Every completed response (any status) per second. */
  requestsPerSecond: number;
  ok2xx: number;
  non2xx: number;
  errors: number;
  timeouts: number;
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
  statusCodes: Record<string, number>;
  /** The ids read from every 2xx answer. */
  acknowledged: string[];
  /** The time of every completed request. */
  latenciesMs: number[];
}

/** Several runs against one endpoint as one: counts added, latencies pooled (percentiles by nearest rank). */
export function combineRuns(runs: LoadOutcome[]): LoadOutcome {
  const sum = (f: (o: LoadOutcome) => number) => runs.reduce((s, o) => s + f(o), 0);
  const latencies = Float64Array.from(runs.flatMap((o) => o.latenciesMs)).sort();
  const rank = (p: number) => (latencies.length === 0 ? Number.NaN : latencies[Math.max(0, Math.ceil(p * latencies.length) - 1)]);
  const statusCodes: Record<string, number> = {};
  for (const o of runs) for (const [code, n] of Object.entries(o.statusCodes)) statusCodes[code] = (statusCodes[code] ?? 0) + n;
  const durationS = sum((o) => o.durationS);
  return {
    durationS,
    requestsPerSecond: sum((o) => o.requestsPerSecond * o.durationS) / durationS,
    ok2xx: sum((o) => o.ok2xx),
    non2xx: sum((o) => o.non2xx),
    errors: sum((o) => o.errors),
    timeouts: sum((o) => o.timeouts),
    p50Ms: rank(0.5),
    p99Ms: rank(0.99),
    maxMs: latencies.length === 0 ? Number.NaN : latencies[latencies.length - 1],
    statusCodes,
    acknowledged: runs.flatMap((o) => o.acknowledged),
    latenciesMs: Array.from(latencies),
  };
}

/**
 * Drives POST requests with autocannon in a worker thread and returns its figures. `onStart` is
 * called once the worker has loaded and starts sending, so meters can leave out its start-up.
 */
export function runLoad(run: LoadRun, onStart?: () => void): Promise<LoadOutcome> {
  const file = new URL("./loadDriverWorker.ts", import.meta.url).href;
  // The worker registers the TypeScript loader itself, then loads the driver.
  const boot = `import("tsx/esm/api").then((m) => { m.register(); return import(${JSON.stringify(file)}); })`;
  return new Promise((ok, fail) => {
    const worker = new Worker(boot, { eval: true, workerData: run });
    const guard = setTimeout(() => {
      void worker.terminate();
      fail(new Error("the load driver did not finish in time"));
    }, (run.durationS + (run.timeoutS ?? 10) + 30) * 1000);
    worker.on("message", (msg: { started?: true; outcome?: LoadOutcome; error?: string }) => {
      if (msg.started) return onStart?.();
      clearTimeout(guard);
      void worker.terminate();
      if (msg.outcome) ok(msg.outcome);
      else fail(new Error(msg.error ?? "the load driver failed"));
    });
    worker.once("error", (err) => {
      clearTimeout(guard);
      fail(err);
    });
  });
}

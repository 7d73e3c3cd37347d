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
  /** Measured seconds, after the lead-in. */
  durationS: number;
  /**
   * Seconds of load before the measured part, whose answers are left out of every figure but
   * errors (their ids are kept apart): a run that starts on an endpoint left idle meets caches
   * and pools gone cold, which a continuous run meets only once.
   */
  leadInS?: number;
  timeoutS?: number;
  /** Where the created row's id sits in a 2xx JSON body, e.g. ["sample", "id"]. */
  idPath: string[];
}

export interface LoadOutcome {
  durationS: number;
  /** Every completed response (any status) per second. */
  requestsPerSecond: number;
  ok2xx: number;
  /** Over the whole run, lead-in included, like errors and timeouts. */
  non2xx: number;
  errors: number;
  timeouts: number;
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
  statusCodes: Record<string, number>;
  /** The ids read from every measured 2xx answer. */
  acknowledged: string[];
  /** The ids read from the lead-in's 2xx answers. */
  leadInAcknowledged: string[];
  /** The time of every completed request. */
  latenciesMs: number[];
}

/** The p-quantile of ascending values by nearest rank; NaN when there are none. */
export function nearestRank(sorted: ArrayLike<number>, p: number): number {
  return sorted.length === 0 ? Number.NaN : sorted[Math.max(0, Math.ceil(p * sorted.length) - 1)];
}

/** Several runs against one endpoint as one: counts added, latencies pooled (percentiles by nearest rank). */
export function combineRuns(runs: LoadOutcome[]): LoadOutcome {
  const sum = (f: (o: LoadOutcome) => number) => runs.reduce((s, o) => s + f(o), 0);
  const latencies = Float64Array.from(runs.flatMap((o) => o.latenciesMs)).sort();
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
    p50Ms: nearestRank(latencies, 0.5),
    p99Ms: nearestRank(latencies, 0.99),
    maxMs: latencies.length === 0 ? Number.NaN : latencies[latencies.length - 1],
    statusCodes,
    acknowledged: runs.flatMap((o) => o.acknowledged),
    leadInAcknowledged: runs.flatMap((o) => o.leadInAcknowledged),
    latenciesMs: Array.from(latencies),
  };
}

/**
 * Drives POST requests with autocannon in a worker thread and returns its figures. `onStart` is
 * called when the measured part begins (after the worker has loaded and any lead-in), so meters
 * can leave out what comes before it.
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
    }, ((run.leadInS ?? 0) + run.durationS + (run.timeoutS ?? 10) + 30) * 1000);
    worker.on("message", (msg: { started?: true; measuring?: true; outcome?: LoadOutcome; error?: string }) => {
      if (msg.started) return;
      if (msg.measuring) return onStart?.();
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

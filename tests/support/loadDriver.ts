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
}

/** Drives POST requests with autocannon in a worker thread and returns its figures. */
export function runLoad(run: LoadRun): Promise<LoadOutcome> {
  const file = new URL("./loadDriverWorker.ts", import.meta.url).href;
  // The worker registers the TypeScript loader itself, then loads the driver.
  const boot = `import("tsx/esm/api").then((m) => { m.register(); return import(${JSON.stringify(file)}); })`;
  return new Promise((ok, fail) => {
    const worker = new Worker(boot, { eval: true, workerData: run });
    const guard = setTimeout(() => {
      void worker.terminate();
      fail(new Error("the load driver did not finish in time"));
    }, (run.durationS + (run.timeoutS ?? 10) + 30) * 1000);
    worker.once("message", (msg: { outcome?: LoadOutcome; error?: string }) => {
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

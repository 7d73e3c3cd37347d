// Load benchmark: 50 signed-in operators record samples on their own running batches for 20 s,
// against the real app and against a bare Express + pg endpoint on the same database (after a
// short untimed warm-up, the two take turns in four slices of 5 s, and each one's slices are
// pooled: counts added, percentiles over every request); then checks that every acknowledged
// sample is stored with its audit row and the chain is intact. Each slice starts with 1 s of
// load that is not counted (failures excepted): an endpoint that sat idle through the other's
// slice starts with cold caches and pools, which a continuous 20 s run would meet only once.
// POST /api/batches/:id/samples stands for "recording an entry": its body is validated, and it
// writes the row, its audit row and a live notification in one transaction, like a step entry,
// without the per-step password check and one-shot rule that make step entries unrepeatable.
// Run: npx tsx tests/bench/load.ts   (loopback only; starts and stops its own services)
import { cpus, loadavg } from "node:os";
import { join } from "node:path";
import { pino } from "pino";
import { loadEnv } from "../../server/config.js";
import { bootServer, type RunningServer } from "../../server/boot.js";
import { createDatabase, type Database } from "../../server/db/client.js";
import { verifyAuditChain } from "../../server/commands/auditVerifier.js";
import { buildCampaign, buildPerson, buildPlannedBatch } from "../factories.js";
import { startOwnServices, type OwnServices } from "../support/ownServices.js";
import { freePort } from "../support/freePort.js";
import { HttpSession } from "../support/httpSession.js";
import { bringToRunning, type Signer } from "../support/runningBatch.js";
import { startBareEndpoint, type BareEndpoint } from "../support/bareSampleEndpoint.js";
import { combineRuns, runLoad, type LoadOutcome, type LoadTarget } from "../support/loadDriver.js";
import { checkSampleAudit } from "../support/sampleAudit.js";
import { combineReadings, startCpuMeter, type CpuReading } from "../support/cpuMeter.js";

const OPERATORS = 50;
const SUPERVISORS = 5;
const DURATION_S = 20;
const SLICES = 4;
const SLICE_S = DURATION_S / SLICES;
const WARM_UP_S = 5;
const LEAD_IN_S = 1;
const DEADLINE_MS = 5 * 60_000;
const TARGETS = { throughputShare: 0.4, p99Ms: 100 };
// One sample of the demo scenario (invented): a 30.5 L gas bulb with its GC result.
const SAMPLE = JSON.stringify({ sampledAt: "2024-06-12T10:30:00.000Z", volume: { value: 30.5, unit: "L" }, labResult: "MON 97.1 % (GC)" });

let services: OwnServices | undefined;
let app: RunningServer | undefined;
let bare: BareEndpoint | undefined;
let database: Database | undefined;

async function cleanUp() {
  await bare?.close().catch(() => undefined);
  await app?.close().catch(() => undefined);
  await database?.close().catch(() => undefined);
  await services?.stop().catch(() => undefined);
}

const load = () => loadavg().map((x) => x.toFixed(2)).join(" / ");
const step = (text: string) => console.log(`· ${text}`);

/** Runs `fn` over `items`, `width` at a time. */
async function inGroups<T>(items: T[], width: number, fn: (item: T, i: number) => Promise<void>) {
  for (let i = 0; i < items.length; i += width) await Promise.all(items.slice(i, i + width).map((item, j) => fn(item, i + j)));
}

async function setUp() {
  services = await startOwnServices("isobatch-load-");
  const port = await freePort();
  const env = loadEnv({ HOST: "127.0.0.1", PORT: String(port), SEED_DEMO: "false", LOG_LEVEL: "silent", MAIL_POLL_MS: "60000" });
  app = await bootServer(env, { databaseUrl: services.databaseUrl, s3Endpoint: services.s3Endpoint, smtpUrl: services.smtpUrl, mailDir: services.mailDir, sessionSecret: "load-bench-secret-long-enough-for-hmac-0123" }, pino({ level: "silent" }));
  database = createDatabase(services.databaseUrl);
  const db = database.db;
  step(`app on ${app.url}; PostgreSQL on port ${services.dbPort}`);

  const campaign = await buildCampaign(db);
  // Signing is limited per person and minute, so the verifications are shared among a few supervisors.
  const supervisors: Signer[] = [];
  for (let i = 0; i < SUPERVISORS; i++) {
    const person = await buildPerson(db, { roles: ["supervisor"], name: `Harrow Fen supervisor ${i + 1}` });
    supervisors.push({ person, session: await new HttpSession(app.url).signIn(person.email, person.password) });
  }
  const operators: Signer[] = [];
  const batchIds: string[] = [];
  for (let i = 0; i < OPERATORS; i++) {
    const person = await buildPerson(db, { roles: ["operator"], name: `Harrow Fen operator ${i + 1}` });
    operators.push({ person, session: await new HttpSession(app.url).signIn(person.email, person.password) });
    batchIds.push((await buildPlannedBatch(db, { campaign })).batch.id);
  }
  step(`${OPERATORS} operators and ${SUPERVISORS} supervisors signed in; ${OPERATORS} batches planned`);
  await inGroups(batchIds, SUPERVISORS, (id, i) => bringToRunning(operators[i], supervisors[i % SUPERVISORS], id));
  step(`${OPERATORS} batches charged (critical steps verified) and running`);
  return { operators, batchIds };
}

function row(name: string, o: LoadOutcome) {
  const rate = o.ok2xx / o.durationS;
  return `${name.padEnd(22)} ${rate.toFixed(1).padStart(9)} ${o.requestsPerSecond.toFixed(1).padStart(9)} ${o.p50Ms.toFixed(0).padStart(7)} ${o.p99Ms.toFixed(0).padStart(7)} ${o.maxMs.toFixed(0).padStart(7)} ${String(o.ok2xx).padStart(7)} ${String(o.non2xx).padStart(6)} ${String(o.errors).padStart(6)}`;
}

function cpuLine(name: string, c: CpuReading, o: LoadOutcome) {
  const perRequestMs = (cpuS: number) => ((cpuS * 1000) / Math.max(o.ok2xx, 1)).toFixed(2);
  return `${name} CPU: server event loop busy ${(c.mainLoopBusy * 100).toFixed(0)} %; this process (server + load thread) ${c.processCpuS.toFixed(1)} s (${perRequestMs(c.processCpuS)} ms a request); PostgreSQL ${c.postgresCpuS.toFixed(1)} s (${perRequestMs(c.postgresCpuS)} ms a request)`;
}

async function main() {
  console.log(`Isobatch load benchmark — ${cpus().length} CPU cores; load average (1/5/15 min) before: ${load()}`);
  const { operators, batchIds } = await setUp();
  const db = database!.db;

  const appTargets: LoadTarget[] = operators.map((op, i) => ({ path: `/api/batches/${batchIds[i]}/samples`, headers: { cookie: op.session.cookie, "x-csrf-token": op.session.csrf }, body: SAMPLE }));
  bare = await startBareEndpoint(services!.databaseUrl);
  const bareTargets: LoadTarget[] = batchIds.map((id) => ({ path: `/bare/batches/${id}/samples`, headers: {}, body: SAMPLE }));
  const endpoints = {
    app: { url: app!.url, targets: appTargets, idPath: ["sample", "id"] },
    bare: { url: bare.url, targets: bareTargets, idPath: ["id"] },
  };
  const pgDir = join(services!.dir, "postgres");

  // Untimed first, so both run optimised code when the clock starts; the app's samples still count in the check.
  step(`warming up: ${WARM_UP_S} s each (load average ${load()})`);
  const warmUp = await runLoad({ ...endpoints.app, durationS: WARM_UP_S });
  await runLoad({ ...endpoints.bare, durationS: WARM_UP_S });

  // The two endpoints take turns in slices, so a change in the machine's speed (its cores are
  // shared) weighs on both alike instead of on whichever ran second.
  const runs = { app: [] as LoadOutcome[], bare: [] as LoadOutcome[] };
  const cpu = { app: [] as { reading: CpuReading; durationS: number }[], bare: [] as { reading: CpuReading; durationS: number }[] };
  step(`measuring: ${SLICES} slices of ${SLICE_S} s on each endpoint, taking turns, each after ${LEAD_IN_S} s of load not counted, ${OPERATORS} connections (load average ${load()})`);
  for (let slice = 0; slice < SLICES; slice++) {
    const order: ("app" | "bare")[] = slice % 2 === 0 ? ["app", "bare"] : ["bare", "app"];
    for (const name of order) {
      // Metered from the end of the lead-in, so the worker's own start-up is left out too.
      let meter: (() => CpuReading) | undefined;
      const outcome = await runLoad({ ...endpoints[name], durationS: SLICE_S, leadInS: LEAD_IN_S }, () => (meter = startCpuMeter(pgDir)));
      cpu[name].push({ reading: meter!(), durationS: outcome.durationS });
      runs[name].push(outcome);
    }
    const rate = (o: LoadOutcome) => o.ok2xx / o.durationS;
    const [a, b] = [runs.app[slice], runs.bare[slice]];
    step(`slice ${slice + 1}: app ${rate(a).toFixed(0)}/s, bare ${rate(b).toFixed(0)}/s, ratio ${((rate(a) / rate(b)) * 100).toFixed(1)} %, app p99 ${a.p99Ms.toFixed(0)} ms`);
  }
  const real = combineRuns(runs.app);
  const floor = combineRuns(runs.bare);
  const realCpu = combineReadings(cpu.app);
  const floorCpu = combineReadings(cpu.bare);
  const bareRows = await bare.count();

  step("checking the stored record");
  const audit = await checkSampleAudit(db, batchIds, [...warmUp.acknowledged, ...real.leadInAcknowledged, ...real.acknowledged]);
  const chain = await verifyAuditChain(db);

  const ratio = real.ok2xx / real.durationS / (floor.ok2xx / floor.durationS);
  console.log("");
  console.log(`${"endpoint".padEnd(22)} ${"2xx/s".padStart(9)} ${"all/s".padStart(9)} ${"p50 ms".padStart(7)} ${"p99 ms".padStart(7)} ${"max ms".padStart(7)} ${"2xx".padStart(7)} ${"non2xx".padStart(6)} ${"errors".padStart(6)}`);
  console.log(row("app POST …/samples", real));
  console.log(row("bare insert", floor));
  console.log(`throughput ratio app / bare: ${(ratio * 100).toFixed(1)} %`);
  // Each connection sends its next request when the last is answered, so latency and throughput are tied.
  const loopMs = (o: LoadOutcome) => ((OPERATORS / Math.max(o.ok2xx / o.durationS, 1e-9)) * 1000).toFixed(0);
  console.log(`closed loop of ${OPERATORS} connections: mean latency ≈ connections / throughput = ${loopMs(real)} ms (app), ${loopMs(floor)} ms (bare)`);
  console.log(cpuLine("app", realCpu, real));
  console.log(cpuLine("bare", floorCpu, floor));
  console.log(`app status codes: ${JSON.stringify(real.statusCodes)}; timeouts ${real.timeouts}; ids read from 2xx answers ${real.acknowledged.length}`);
  console.log(`bare status codes: ${JSON.stringify(floor.statusCodes)}; rows written ${bareRows}`);
  console.log(`stored samples ${audit.stored} (acknowledged ${warmUp.acknowledged.length} in the warm-up, ${real.leadInAcknowledged.length} in the slices' lead-ins and ${real.acknowledged.length} measured; the rest were answered after a slice stopped counting)`);
  console.log(`acknowledged but missing: ${audit.missing.length}; stored without audit row: ${audit.withoutAudit.length}`);
  console.log(`audit chain: ${chain.ok ? `intact over ${chain.checked} rows` : `BROKEN at seq ${chain.brokenAt.seq}: ${chain.brokenAt.reason}`}`);
  console.log(`load average after: ${load()} (other processes on this machine share its cores)`);
  console.log("");

  const verdicts: [string, boolean][] = [
    [`throughput ≥ ${TARGETS.throughputShare * 100} % of bare (${(ratio * 100).toFixed(1)} %)`, ratio >= TARGETS.throughputShare],
    [`p99 < ${TARGETS.p99Ms} ms (${real.p99Ms.toFixed(0)} ms)`, real.p99Ms < TARGETS.p99Ms],
    [`zero errors (non-2xx ${real.non2xx}, connection errors ${real.errors}, timeouts ${real.timeouts})`, real.non2xx === 0 && real.errors === 0 && real.timeouts === 0],
    [`every acknowledged sample stored with its audit row (${real.acknowledged.length} of ${real.ok2xx} answers carried an id)`, audit.missing.length === 0 && audit.withoutAudit.length === 0 && real.acknowledged.length === real.ok2xx],
    ["audit chain intact", chain.ok],
  ];
  for (const [what, ok] of verdicts) console.log(`${ok ? "PASS" : "MISS"}  ${what}`);
}

const watchdog = setTimeout(() => {
  console.error(`load benchmark: still running after ${DEADLINE_MS / 1000} s; stopping`);
  void cleanUp().finally(() => process.exit(2));
}, DEADLINE_MS);

main()
  .then(cleanUp, async (err) => {
    console.error(err);
    await cleanUp();
    process.exitCode = 1;
  })
  .finally(() => {
    clearTimeout(watchdog);
    // The mail worker and pools are closed; anything left (autocannon's timers) must not keep the script alive.
    setTimeout(() => process.exit(), 500).unref();
  });

import { eq, inArray } from "drizzle-orm";
import { Readable } from "node:stream";
import type { Db } from "./client.js";
import { batches, people, rateModelVersions } from "./schema.js";
import type { StorageService } from "../services/storage.js";
import type { CheckCredentials } from "../commands/credentialChecker.js";
import type { Notifier } from "../commands/notifier.js";
import { createBatchReviewer } from "../commands/batchReviewer.js";
import { createBatchTransitioner } from "../commands/batchTransitioner.js";
import { createStepRecorder } from "../commands/stepRecorder.js";
import { createDeviationRecorder } from "../commands/deviationRecorder.js";
import { createBatchFiles } from "../commands/batchFiles.js";
import { receiveFile } from "../commands/fileReceiver.js";
import { createVersionedDocuments } from "../commands/versionedDocuments.js";
import { rateModelKind } from "../commands/rateModelKind.js";
import { proposeModelUpdate } from "../commands/modelProposer.js";
import { toSignedInPerson } from "../http/session.js";
import { DEMO_PASSWORD } from "./seed.js";
import { DEMO_PROGRESS } from "./demoScenario.js";
import { seedDemoTraining } from "./seedDemoTraining.js";
import { predictVolume } from "../../shared/kinetics/prediction.js";
import { checkConditionsFor, modelKAt } from "../../shared/execution/modelAtBatch.js";
import type { RateModelContent } from "../../shared/schemas/rateModels.js";
import type { BatchMove } from "../../shared/machines/batchMoves.js";

// A small seeded generator so every fresh demo has the same "noisy" traces.
function noise(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296 - 0.5;
  };
}

/** A logger CSV made from the model at the batch's (or a hotter) temperature, with a little noise. */
function demoTraceCsv(b: typeof batches.$inferSelect, model: { content: RateModelContent; epsilonA: number; yA0: number }, opts: { fraction: number; hotK: number; seed: number }) {
  const T = b.temperatureK + opts.hotK;
  const k = modelKAt(model.content, T);
  const cA0 = checkConditionsFor(b, model.yA0).cA0;
  const n = Math.round(60 * opts.fraction);
  const t = Array.from({ length: n + 1 }, (_, i) => i * 30);
  const V = predictVolume({ order: model.content.order, k, epsilonA: model.epsilonA, V0: b.v0L, cA0 }, t);
  const rnd = noise(opts.seed);
  const lines = ["time (s),volume (L),temperature (°C),pressure (bar(a))"];
  t.forEach((time, i) => lines.push(`${time},${(V[i] * (1 + 0.001 * rnd())).toFixed(5)},${(T - 273.15 + 0.3 * rnd()).toFixed(2)},${(b.pressurePa / 1e5 + 0.002 * rnd()).toFixed(4)}`));
  return lines.join("\n") + "\n";
}

/**
 * Takes the demo campaign's batches to the states the demo shows, through the same commands and
 * signatures people use (each demo account signs with the demo password): three released bench
 * batches and a model update fitted from them, a pilot batch running with half its trace, the hot
 * pilot batch in review failing the kinetics gate, a pilot batch on hold. Their training is recorded
 * first. Skips batches already moved.
 */
export async function seedDemoBatches(db: Db, deps: { storage: StorageService; check: CheckCredentials; notify: Notifier; uploadMaxBytes: number }) {
  const rows = await db.select().from(people).where(inArray(people.email, ["operator@harrowfen.example", "supervisor@harrowfen.example", "quality@harrowfen.example", "engineer@harrowfen.example"]));
  const who = (prefix: string) => {
    const row = rows.find((r) => r.email.startsWith(prefix));
    return row ? toSignedInPerson(row) : undefined;
  };
  const [op, sup, qa, eng] = [who("operator"), who("supervisor"), who("quality"), who("engineer")];
  if (!op || !sup || !qa || !eng) return;
  // Nobody performs or verifies a step without current training on the master record.
  await seedDemoTraining(db, { check: deps.check, notify: deps.notify });
  const base = { db, check: deps.check, notify: deps.notify };
  const reviewer = createBatchReviewer({ ...base, storage: deps.storage });
  const applyMove = createBatchTransitioner({ ...base, gate: reviewer.gate, afterMove: reviewer.afterMove });
  const steps = createStepRecorder(base);
  const deviations = createDeviationRecorder(base);
  const batchFiles = createBatchFiles({ db, storage: deps.storage, notify: deps.notify });
  const pw = DEMO_PASSWORD;
  const now = () => new Date().toISOString();
  const revision = async (id: string) => (await db.select({ r: batches.revision }).from(batches).where(eq(batches.id, id)))[0].r;
  const move = async (person: typeof op, id: string, m: BatchMove, extra: { reason?: string } = {}) => applyMove(person, id, { move: m, revision: await revision(id), password: pw, ...extra });
  const perform = (person: typeof op, id: string, key: string, values: Record<string, unknown>) => steps.perform(person, id, key, { values, comments: {}, password: pw });

  const planned = await db.select().from(batches).where(eq(batches.state, "planned"));
  const released: string[] = [];
  for (const [seed, [code, progress]] of Object.entries(DEMO_PROGRESS).entries()) {
    const b = planned.find((x) => x.code === code);
    if (!b) continue;
    const [model] = await db.select().from(rateModelVersions).where(eq(rateModelVersions.id, b.rateModelVersionId));
    const modelInfo = { content: model.content as RateModelContent, epsilonA: model.epsilonA, yA0: model.yA0 };
    const perLitre = (g: number) => +(g * b.v0L).toFixed(3);
    await move(op, b.id, "START_CHARGING");
    await perform(op, b.id, "reliefCheck", { reliefStatus: "In service, tag current", leakTestPressure: 2.5 });
    await perform(op, b.id, "chargeDmx", { dmxLot: `DMX-24-${String(seed + 11).padStart(3, "0")}`, dmxMass: perLitre(5.41) });
    await perform(op, b.id, "chargeN2", { n2Mass: perLitre(0.386) });
    await steps.verify(sup, b.id, "reliefCheck", pw);
    await steps.verify(sup, b.id, "chargeDmx", pw);
    await move(op, b.id, "START_RUN");
    if (progress.deviation) await deviations.raise(op, b.id, progress.deviation);
    if (progress.to === "held") {
      await move(op, b.id, "HOLD", { reason: progress.holdReason });
      continue;
    }
    const csv = demoTraceCsv(b, modelInfo, { fraction: progress.traceFraction ?? 1, hotK: progress.runHotK ?? 0, seed: seed + 1 });
    const file = await receiveFile({ db, storage: deps.storage, maxBytes: deps.uploadMaxBytes }, op, Readable.from([Buffer.from(csv)]), `${code}-logger.csv`);
    await batchFiles.addTrace(op, b.id, { fileId: file.id });
    if (progress.to === "running") continue;
    await perform(op, b.id, "pressurise", { temperature: +(b.temperatureK - 273.15).toFixed(1), pressure: 2.0, startedAt: now() });
    await steps.verify(sup, b.id, "pressurise", pw);
    await perform(op, b.id, "runEnd", { endedAt: now(), finalVolume: +(b.v0L * 1.69).toFixed(3) });
    await move(op, b.id, "START_SAMPLING");
    await perform(op, b.id, "sampleGas", { sampleId: `BULB-${seed + 1}`, sampledAt: now() });
    await move(op, b.id, "SUBMIT_FOR_REVIEW");
    if (progress.to === "review") continue;
    await perform(qa, b.id, "releaseChecklist", { analysisReviewed: "Reviewed, within specification" });
    await move(qa, b.id, "RELEASE");
    released.push(b.id);
  }
  if (released.length >= 2) {
    const [first] = await db.select().from(batches).where(eq(batches.id, released[0]));
    await proposeModelUpdate(db, createVersionedDocuments(db, deps.check, rateModelKind), eng, first.rateModelVersionId, released, true);
  }
}

import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "./client.js";
import { masterRecords, masterRecordVersions, people, trainingRecords } from "./schema.js";
import type { CheckCredentials } from "../commands/credentialChecker.js";
import type { Notifier } from "../commands/notifier.js";
import { createTrainingRecorder } from "../commands/trainingRecorder.js";
import { utcDay } from "../../shared/execution/trainingStatus.js";
import { toSignedInPerson } from "../http/session.js";
import { DEMO_PASSWORD } from "./seed.js";
import { DEMO_MASTER_RECORD, DEMO_TRAINING } from "./demoScenario.js";

const daysAgo = (days: number) => utcDay(new Date(Date.now() - days * 86_400_000));

/**
 * Records the demo people's training on HF-DMX version 1 through the training command, signed by
 * the demo admin with the demo password. Skips anyone with a training record on it already.
 */
export async function seedDemoTraining(db: Db, deps: { check: CheckCredentials; notify: Notifier }): Promise<void> {
  const [adminRow] = await db.select().from(people).where(eq(people.email, "admin@harrowfen.example"));
  const [version] = await db
    .select({ id: masterRecordVersions.id })
    .from(masterRecordVersions)
    .innerJoin(masterRecords, eq(masterRecords.id, masterRecordVersions.masterRecordId))
    .where(and(eq(masterRecords.code, DEMO_MASTER_RECORD.code), eq(masterRecordVersions.version, 1), eq(masterRecordVersions.status, "approved")));
  if (!adminRow || !version) return;
  const admin = toSignedInPerson(adminRow);
  const recorder = createTrainingRecorder({ db, ...deps });
  const trainees = await db.select({ id: people.id, email: people.email }).from(people).where(inArray(people.email, DEMO_TRAINING.map((t) => t.email)));
  for (const t of DEMO_TRAINING) {
    const trainee = trainees.find((p) => p.email === t.email);
    if (!trainee) continue;
    const [existing] = await db.select({ id: trainingRecords.id }).from(trainingRecords).where(and(eq(trainingRecords.personId, trainee.id), eq(trainingRecords.masterRecordVersionId, version.id))).limit(1);
    if (existing) continue;
    await recorder.record(admin, { personId: trainee.id, masterRecordVersionId: version.id, trainedOn: daysAgo(t.trainedDaysAgo), validUntil: daysAgo(t.trainedDaysAgo - t.validForDays), note: t.note, password: DEMO_PASSWORD });
  }
}

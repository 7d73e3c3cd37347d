import { and, eq, sql } from "drizzle-orm";
import type { Db, DbOrTx } from "../db/client.js";
import { masterRecords, masterRecordVersions, people, trainingRecords } from "../db/schema.js";
import { recordAudit } from "./audit.js";
import { announce } from "../services/live.js";
import { confirmSigner, recordSignature } from "./signatureRecorder.js";
import type { CheckCredentials } from "./credentialChecker.js";
import type { Notifier } from "./notifier.js";
import { trainingStatusOn, utcDay } from "../../shared/execution/trainingStatus.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import type { SignedInPerson } from "../policies/access.js";
import { presentTrainingRows } from "./trainingViews.js";
import type { TrainingProblemCode, TrainingRecordInput, TrainingRecordView, TrainingWithdrawInput } from "../../shared/schemas/training.js";

export const TRAINING_ENTITY = "training-record";

export interface TrainingProblem {
  code: TrainingProblemCode;
  message: string;
}

export interface TrainingRecorderDeps {
  db: Db;
  check: CheckCredentials;
  notify: Notifier;
}

const unprocessable = (code: string, message: string, field: string) => new HttpError(422, code, message, field);

async function versionNamed(db: DbOrTx, id: string) {
  const [v] = await db
    .select({ id: masterRecordVersions.id, familyId: masterRecordVersions.masterRecordId, version: masterRecordVersions.version, status: masterRecordVersions.status, code: masterRecords.code, title: masterRecords.title })
    .from(masterRecordVersions)
    .innerJoin(masterRecords, eq(masterRecords.id, masterRecordVersions.masterRecordId))
    .where(eq(masterRecordVersions.id, id));
  return v;
}

/** Exactly what a training signature signs: who was trained on what, and for which days. */
const signedTraining = (r: TrainingRecordView) => ({
  trainingRecordId: r.id,
  personId: r.person.id,
  personName: r.person.name,
  masterRecordVersionId: r.masterRecord.versionId,
  masterRecordCode: r.masterRecord.code,
  masterRecordVersion: r.masterRecord.version,
  trainedOn: r.trainedOn,
  validUntil: r.validUntil,
  note: r.note,
});

/**
 * Why `personId` may not perform or verify steps of the master-record version now, or null when
 * a current training record exists. Among several records, any current one is enough.
 */
export async function trainingProblem(tx: DbOrTx, personId: string, masterRecordVersionId: string, now = new Date()): Promise<TrainingProblem | null> {
  const rows = await tx
    .select({ trainedOn: trainingRecords.trainedOn, validUntil: trainingRecords.validUntil, withdrawnAt: trainingRecords.withdrawnAt, withdrawReason: trainingRecords.withdrawReason })
    .from(trainingRecords)
    .where(and(eq(trainingRecords.personId, personId), eq(trainingRecords.masterRecordVersionId, masterRecordVersionId)));
  const day = utcDay(now);
  const judged = rows.map((r) => ({ ...r, status: trainingStatusOn(r, day) }));
  if (judged.some((r) => r.status === "current")) return null;
  const v = await versionNamed(tx, masterRecordVersionId);
  const what = v ? `master record ${v.code} version ${v.version}` : "this master record version";
  const upcoming = judged.filter((r) => r.status === "not-yet-valid").sort((a, b) => a.trainedOn.localeCompare(b.trainedOn))[0];
  if (upcoming) return { code: "training-not-yet-valid", message: `Your training on ${what} counts from ${upcoming.trainedOn}; until then you may not perform or verify its steps.` };
  const lastEnded = judged.filter((r) => r.status === "expired").sort((a, b) => b.validUntil.localeCompare(a.validUntil))[0];
  if (lastEnded) return { code: "training-expired", message: `Your training on ${what} ended on ${lastEnded.validUntil}; a supervisor or admin must record a renewal before you perform or verify its steps.` };
  const withdrawn = judged.filter((r) => r.status === "withdrawn").sort((a, b) => b.withdrawnAt!.getTime() - a.withdrawnAt!.getTime())[0];
  if (withdrawn) return { code: "training-missing", message: `Your training on ${what} was withdrawn (${withdrawn.withdrawReason?.slice(0, 200)}); a supervisor or admin must record new training before you perform or verify its steps.` };
  return { code: "training-missing", message: `You have no training record for ${what}; a supervisor or admin must record your training before you perform or verify its steps.` };
}

/** Throws 403 with the reason when `personId` has no current training on the version. */
export async function requireTraining(tx: DbOrTx, personId: string, masterRecordVersionId: string): Promise<void> {
  const problem = await trainingProblem(tx, personId, masterRecordVersionId);
  if (problem) throw new HttpError(403, problem.code, problem.message);
}

/** Recording and withdrawing training (admins and supervisors), each signed and audited. */
export function createTrainingRecorder(deps: TrainingRecorderDeps) {
  return {
    async record(actor: SignedInPerson, input: TrainingRecordInput): Promise<TrainingRecordView> {
      if (input.personId === actor.id) throw new HttpError(403, "own-training", "You cannot record your own training; another supervisor or an admin must record it.");
      await confirmSigner(deps.check, actor, input.password);
      return deps.db.transaction(async (tx) => {
        const [trainee] = await tx.select().from(people).where(eq(people.id, input.personId));
        if (!trainee) throw unprocessable("person-not-found", "personId: there is no such person.", "personId");
        if (!trainee.active) throw unprocessable("person-inactive", `personId: ${trainee.name}'s account is deactivated; reactivate it before recording training.`, "personId");
        const v = await versionNamed(tx, input.masterRecordVersionId);
        if (!v) throw unprocessable("version-not-found", "masterRecordVersionId: there is no such master record version.", "masterRecordVersionId");
        if (v.status === "superseded") {
          const [current] = await tx.select({ version: masterRecordVersions.version }).from(masterRecordVersions).where(and(eq(masterRecordVersions.masterRecordId, v.familyId), eq(masterRecordVersions.status, "approved")));
          const now = current ? `version ${current.version} is the current one; record training on it instead.` : "no version of it is approved now.";
          throw unprocessable("version-superseded", `masterRecordVersionId: version ${v.version} of ${v.code} is superseded; ${now}`, "masterRecordVersionId");
        }
        if (v.status !== "approved") throw unprocessable("version-not-approved", `masterRecordVersionId: version ${v.version} of ${v.code} is a draft; training is recorded on approved versions only.`, "masterRecordVersionId");
        const today = utcDay(new Date());
        if (input.trainedOn > today) throw unprocessable("trained-on-in-future", `trainedOn: ${input.trainedOn} is after today (${today}, UTC); record training once it has taken place.`, "trainedOn");
        if (input.validUntil < input.trainedOn) throw unprocessable("valid-until-before-training", "validUntil: must be on or after the day of the training.", "validUntil");
        const [row] = await tx
          .insert(trainingRecords)
          .values({ personId: trainee.id, masterRecordVersionId: v.id, trainedOn: input.trainedOn, validUntil: input.validUntil, note: input.note || null, recordedBy: actor.id })
          .returning();
        const [view] = await presentTrainingRows(tx, [row]);
        await recordSignature(tx, actor, { meaning: "training-recorded", entityType: TRAINING_ENTITY, entityId: row.id, content: signedTraining(view) });
        await recordAudit(tx, actor, { action: "training-recorded", entityType: TRAINING_ENTITY, entityId: row.id, after: view });
        await announce(tx, { kind: "training", id: trainee.id });
        await deps.notify.toPerson(
          tx,
          trainee.id,
          `Isobatch: training recorded on ${v.code} version ${v.version}`,
          `${actor.name} recorded your training on master record ${v.code} version ${v.version} (${v.title}): trained on ${input.trainedOn}, valid until ${input.validUntil}.\n\n${deps.notify.page("/training")}\n`,
        );
        return view;
      });
    },

    async withdraw(actor: SignedInPerson, id: string, input: TrainingWithdrawInput): Promise<TrainingRecordView> {
      await confirmSigner(deps.check, actor, input.password);
      return deps.db.transaction(async (tx) => {
        const [row] = await tx.select().from(trainingRecords).where(eq(trainingRecords.id, id)).for("update");
        if (!row) throw notFound("That training record");
        if (row.withdrawnAt) throw conflict("already-withdrawn", `This training record was withdrawn on ${utcDay(row.withdrawnAt)}; it stays withdrawn.`);
        const [before] = await presentTrainingRows(tx, [row]);
        const [updated] = await tx.update(trainingRecords).set({ withdrawnAt: sql`now()`, withdrawnBy: actor.id, withdrawReason: input.reason }).where(eq(trainingRecords.id, id)).returning();
        const [after] = await presentTrainingRows(tx, [updated]);
        await recordSignature(tx, actor, { meaning: "training-withdrawn", entityType: TRAINING_ENTITY, entityId: id, content: { ...signedTraining(after), withdrawnAt: after.withdrawnAt, withdrawReason: after.withdrawReason }, comment: input.reason });
        await recordAudit(tx, actor, { action: "training-withdrawn", entityType: TRAINING_ENTITY, entityId: id, before, after, reason: input.reason });
        await announce(tx, { kind: "training", id: row.personId });
        const { code, version } = after.masterRecord;
        await deps.notify.toPerson(
          tx,
          row.personId,
          `Isobatch: training withdrawn on ${code} version ${version}`,
          `${actor.name} withdrew your training on master record ${code} version ${version}. Reason: ${input.reason}\n\nUntil new training is recorded you may not perform or verify its steps.\n\n${deps.notify.page("/training")}\n`,
        );
        return after;
      });
    },
  };
}

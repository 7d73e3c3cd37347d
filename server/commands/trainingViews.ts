import { asc, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { masterRecords, masterRecordVersions, people, trainingRecords } from "../db/schema.js";
import { trainingStatusOn, utcDay } from "../../shared/execution/trainingStatus.js";
import type { TrainingRecordView } from "../../shared/schemas/training.js";

type TrainingRow = typeof trainingRecords.$inferSelect;

/** Training records with names and master-record codes, as the API shows them, each with its status on `now`. */
export async function presentTrainingRows(db: DbOrTx, rows: TrainingRow[], now = new Date()): Promise<TrainingRecordView[]> {
  if (rows.length === 0) return [];
  const personIds = [...new Set(rows.flatMap((r) => [r.personId, r.recordedBy, r.withdrawnBy].filter((id): id is string => Boolean(id))))];
  const names = new Map((await db.select({ id: people.id, name: people.name }).from(people).where(inArray(people.id, personIds))).map((p) => [p.id, p.name]));
  const versionIds = [...new Set(rows.map((r) => r.masterRecordVersionId))];
  const versions = new Map(
    (
      await db
        .select({ id: masterRecordVersions.id, version: masterRecordVersions.version, status: masterRecordVersions.status, code: masterRecords.code, title: masterRecords.title })
        .from(masterRecordVersions)
        .innerJoin(masterRecords, eq(masterRecords.id, masterRecordVersions.masterRecordId))
        .where(inArray(masterRecordVersions.id, versionIds))
    ).map((v) => [v.id, v]),
  );
  const who = (id: string) => ({ id, name: names.get(id) ?? "unknown" });
  const day = utcDay(now);
  return rows.map((r) => {
    const v = versions.get(r.masterRecordVersionId)!;
    return {
      id: r.id,
      person: who(r.personId),
      masterRecord: { versionId: v.id, code: v.code, title: v.title, version: v.version, status: v.status },
      trainedOn: r.trainedOn,
      validUntil: r.validUntil,
      note: r.note,
      status: trainingStatusOn(r, day),
      recordedBy: who(r.recordedBy),
      recordedAt: r.recordedAt.toISOString(),
      withdrawnAt: r.withdrawnAt?.toISOString() ?? null,
      withdrawnBy: r.withdrawnBy ? who(r.withdrawnBy) : null,
      withdrawReason: r.withdrawReason,
    };
  });
}

/** One training record by id, presented (undefined when there is none). */
export async function presentTrainingById(db: DbOrTx, id: string): Promise<TrainingRecordView | undefined> {
  const rows = await db.select().from(trainingRecords).where(eq(trainingRecords.id, id)).orderBy(asc(trainingRecords.recordedAt));
  return (await presentTrainingRows(db, rows))[0];
}

import { randomUUID } from "node:crypto";
import type { Db } from "../server/db/client.js";
import { people } from "../server/db/schema.js";
import { sql } from "drizzle-orm";
import { hashPassword } from "../server/commands/passwords.js";
import type { Role } from "../shared/schemas/roles.js";
import { createVesselRegistrar } from "../server/commands/vesselRegistrar.js";
import { createVersionedDocuments } from "../server/commands/versionedDocuments.js";
import { rateModelKind } from "../server/commands/rateModelKind.js";
import { masterRecordKind } from "../server/commands/masterRecordKind.js";
import { createBatchPlanner } from "../server/commands/batchPlanner.js";
import { createCredentialChecker } from "../server/commands/credentialChecker.js";
import type { MailService } from "../server/services/mail.js";
import type { SignedInPerson } from "../server/policies/access.js";
import { DEMO_MASTER_RECORD, DEMO_RATE_MODEL, DEMO_VESSELS } from "../server/db/demoScenario.js";
import type { VesselInput } from "../shared/schemas/vessels.js";
import type { RateModelContent } from "../shared/schemas/rateModels.js";

export const TEST_PASSWORD = "correct horse battery";
// Cheap hashes keep the suite quick; the scheme and code path are the production ones.
const cheap = { logN: 10, r: 8, p: 1 };

export interface BuiltPerson {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  password: string;
}

// People made with { untrained: true } in this test file; the factories never train them.
const untrainedIds = new Set<string>();
// Fixture training: from a year ago to a year ahead (UTC days), recorded as a fixture, unsigned.
const FIXTURE_NOTE = "test fixture";
const fixtureDays = () => {
  const day = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);
  return { trainedOn: day(-365), validUntil: day(365) };
};

/**
 * Inserts a person with their own unique email; override anything. The person is trained on
 * every approved master-record version there is, unless `untrained` is set.
 */
export async function buildPerson(db: Db, overrides: Partial<typeof people.$inferInsert> & { roles?: Role[]; password?: string; untrained?: boolean } = {}): Promise<BuiltPerson> {
  const { password = TEST_PASSWORD, untrained = false, ...rest } = overrides;
  const tag = randomUUID().slice(0, 8);
  const [row] = await db
    .insert(people)
    .values({ email: `person-${tag}@test.example`, name: `Test Person ${tag}`, roles: ["operator"], passwordHash: await hashPassword(password, cheap), ...rest })
    .returning();
  if (untrained) untrainedIds.add(row.id);
  else await trainOnEveryApprovedVersion(db, row.id);
  return { id: row.id, email: row.email, name: row.name, roles: row.roles as Role[], password };
}

/** Fixture training for one person on every approved master-record version (inserted directly). */
async function trainOnEveryApprovedVersion(db: Db, personId: string) {
  const { trainedOn, validUntil } = fixtureDays();
  await db.execute(sql`
    insert into training_records (person_id, master_record_version_id, trained_on, valid_until, note, recorded_by)
    select ${personId}::uuid, id, ${trainedOn}::date, ${validUntil}::date, ${FIXTURE_NOTE}::text, ${personId}::uuid from master_record_versions where status = 'approved'`);
}

/** Fixture training for every active person (except the untrained ones) on one version. */
async function trainEveryoneOn(db: Db, masterRecordVersionId: string, recordedBy: string) {
  const { trainedOn, validUntil } = fixtureDays();
  const skip = untrainedIds.size ? sql`and id not in (${sql.join([...untrainedIds].map((id) => sql`${id}::uuid`), sql`, `)})` : sql``;
  await db.execute(sql`
    insert into training_records (person_id, master_record_version_id, trained_on, valid_until, note, recorded_by)
    select id, ${masterRecordVersionId}::uuid, ${trainedOn}::date, ${validUntil}::date, ${FIXTURE_NOTE}::text, ${recordedBy}::uuid from people where active ${skip}`);
}

const asSigner = (p: BuiltPerson): SignedInPerson => ({ id: p.id, email: p.email, name: p.name, roles: p.roles, mustChangePassword: false });
const noMail = { enqueue: async () => undefined } as unknown as MailService;
const checker = (db: Db) => createCredentialChecker({ db, mail: noMail, lockoutThreshold: 100, appUrl: "" });
const tag = () => randomUUID().slice(0, 8).toUpperCase();

/** A registered vessel (by default the demo's 40 L pilot vessel under a fresh tag). */
export async function buildVessel(db: Db, overrides: Partial<VesselInput> = {}) {
  const engineer = await buildPerson(db, { roles: ["engineer"] });
  return createVesselRegistrar(db).register(asSigner(engineer), { ...DEMO_VESSELS[1], tag: `V-${tag()}`, ...overrides });
}

/** An approved rate-model version (drafted by one engineer, approved by one quality person). */
export async function buildApprovedRateModel(db: Db, content: Partial<RateModelContent> = {}) {
  const engineer = await buildPerson(db, { roles: ["engineer"] });
  const quality = await buildPerson(db, { roles: ["quality"] });
  const docs = createVersionedDocuments(db, checker(db), rateModelKind);
  const draft = await docs.createFamily(asSigner(engineer), { code: `RM-${tag()}`, title: "Test rate model", content: { ...DEMO_RATE_MODEL.content, ...content } });
  return docs.approve(asSigner(quality), draft.id, quality.password);
}

/** An approved master-record version, with every active person (but the untrained) trained on it. */
export async function buildApprovedMasterRecord(db: Db) {
  const engineer = await buildPerson(db, { roles: ["engineer"] });
  const quality = await buildPerson(db, { roles: ["quality"] });
  const docs = createVersionedDocuments(db, checker(db), masterRecordKind);
  const draft = await docs.createFamily(asSigner(engineer), { code: `MR-${tag()}`, title: "Test master record", content: DEMO_MASTER_RECORD.content });
  const approved = await docs.approve(asSigner(quality), draft.id, quality.password);
  await trainEveryoneOn(db, approved.id, quality.id);
  return approved;
}

/** A campaign on freshly approved versions. */
export async function buildCampaign(db: Db, model: Partial<RateModelContent> = {}) {
  const engineer = await buildPerson(db, { roles: ["engineer"] });
  const [rateModel, masterRecord] = [await buildApprovedRateModel(db, model), await buildApprovedMasterRecord(db)];
  const campaign = await createBatchPlanner(db).createCampaign(asSigner(engineer), { code: `C-${tag()}`, process: "test process", masterRecordVersionId: masterRecord.id, rateModelVersionId: rateModel.id });
  return { campaign, rateModel, masterRecord, engineer };
}

/** A planned batch of a fresh campaign in a fresh 40 L vessel (V0 22 L, 250 °C, 2.0 bar(a)). */
export async function buildPlannedBatch(db: Db, opts: { model?: Partial<RateModelContent>; v0L?: number; temperatureC?: number; campaign?: Awaited<ReturnType<typeof buildCampaign>> } = {}) {
  const { campaign, rateModel, masterRecord, engineer } = opts.campaign ?? (await buildCampaign(db, opts.model));
  const vessel = await buildVessel(db);
  const batch = await createBatchPlanner(db).planBatch(asSigner(engineer), campaign.id, { code: `B-${tag()}`, vesselId: vessel.id, v0: { value: opts.v0L ?? 22, unit: "L" }, temperature: { value: opts.temperatureC ?? 250, unit: "°C" }, pressure: { value: 2, unit: "bar(a)" } });
  return { batch, campaign, vessel, rateModel, masterRecord, engineer };
}

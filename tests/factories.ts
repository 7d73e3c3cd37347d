import { randomUUID } from "node:crypto";
import type { Db } from "../server/db/client.js";
import { people } from "../server/db/schema.js";
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

/** Inserts a person with their own unique email; override anything. */
export async function buildPerson(db: Db, overrides: Partial<typeof people.$inferInsert> & { roles?: Role[]; password?: string } = {}): Promise<BuiltPerson> {
  const { password = TEST_PASSWORD, ...rest } = overrides;
  const tag = randomUUID().slice(0, 8);
  const [row] = await db
    .insert(people)
    .values({ email: `person-${tag}@test.example`, name: `Test Person ${tag}`, roles: ["operator"], passwordHash: await hashPassword(password, cheap), ...rest })
    .returning();
  return { id: row.id, email: row.email, name: row.name, roles: row.roles as Role[], password };
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

/** An approved master-record version. */
export async function buildApprovedMasterRecord(db: Db) {
  const engineer = await buildPerson(db, { roles: ["engineer"] });
  const quality = await buildPerson(db, { roles: ["quality"] });
  const docs = createVersionedDocuments(db, checker(db), masterRecordKind);
  const draft = await docs.createFamily(asSigner(engineer), { code: `MR-${tag()}`, title: "Test master record", content: DEMO_MASTER_RECORD.content });
  return docs.approve(asSigner(quality), draft.id, quality.password);
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

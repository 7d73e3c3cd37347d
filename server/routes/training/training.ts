import { and, asc, desc, eq, type SQL } from "drizzle-orm";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { parseQuery, validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { HttpError } from "../../http/errors.js";
import { people, trainingRecords } from "../../db/schema.js";
import { createTrainingRecorder } from "../../commands/trainingRecorder.js";
import { utcDay } from "../../../shared/execution/trainingStatus.js";
import { presentTrainingRows } from "../../commands/trainingViews.js";
import { TrainingListQuerySchema, TrainingRecordSchema, TrainingWithdrawSchema, type TrainingListView } from "../../../shared/schemas/training.js";
import type { Role } from "../../../shared/schemas/roles.js";
import { changesRecord, createsRecord } from "../../http/recordEffects.js";

/** Roles that see everyone's training; everyone else sees their own. */
const SEES_ALL: Role[] = ["admin", "supervisor", "quality"];
const RECORDERS: Role[] = ["admin", "supervisor"];
/** The most records one answer holds, newest first; filters narrow it down. */
export const TRAINING_LIST_LIMIT = 500;

/** /api/training: who is trained on which master-record version; admins and supervisors record and withdraw. */
export function trainingRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/training", registry);
  const recorder = createTrainingRecorder({ db: ctx.db, check: ctx.checkCredentials, notify: ctx.notify });
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  r.get("/", signedIn, async (req, res) => {
    const q = parseQuery(TrainingListQuerySchema, req.query);
    const viewer = me(req);
    const seesAll = SEES_ALL.some((role) => viewer.roles.includes(role));
    if (!seesAll && q.personId && q.personId !== viewer.id) throw new HttpError(403, "own-training-only", "You may see only your own training records.");
    const personId = seesAll ? q.personId : viewer.id;
    const where: SQL[] = [];
    if (personId) where.push(eq(trainingRecords.personId, personId));
    if (q.masterRecordVersionId) where.push(eq(trainingRecords.masterRecordVersionId, q.masterRecordVersionId));
    const rows = await ctx.db.select().from(trainingRecords).where(and(...where)).orderBy(desc(trainingRecords.recordedAt)).limit(TRAINING_LIST_LIMIT + 1);
    const now = new Date();
    const body: TrainingListView = { today: utcDay(now), records: await presentTrainingRows(ctx.db, rows.slice(0, TRAINING_LIST_LIMIT), now), truncated: rows.length > TRAINING_LIST_LIMIT };
    if (seesAll) {
      const everyone = await ctx.db.select({ id: people.id, name: people.name, roles: people.roles, active: people.active }).from(people).orderBy(asc(people.name));
      body.people = everyone.filter((p) => p.active).map((p) => ({ id: p.id, name: p.name, roles: p.roles as Role[] }));
    }
    res.json(body);
  });
  r.post("/", allow(...RECORDERS), createsRecord, validate(TrainingRecordSchema), async (req, res) => {
    res.status(201).json({ record: await recorder.record(me(req), req.body) });
  });
  r.post("/:id/withdraw", allow(...RECORDERS), changesRecord, validate(TrainingWithdrawSchema), async (req, res) => {
    res.json({ record: await recorder.withdraw(me(req), idParam(req), req.body) });
  });
  return r;
}

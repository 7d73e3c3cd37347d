import { asc } from "drizzle-orm";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { people } from "../../db/schema.js";
import { presentPerson } from "./presenter.js";
import { createPersonAdministrator } from "../../commands/personAdministrator.js";
import { PasswordResetSchema, PersonCreateSchema, PersonRolesSchema, ReasonOnlySchema } from "../../../shared/schemas/people.js";
import { idParam } from "../../http/params.js";
import { changesRecord, createsRecord } from "../../http/recordEffects.js";

/** /api/people: accounts and roles, for admins. People are never deleted. */
export function peopleRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/people", registry);
  const admin = createPersonAdministrator(ctx.db, (id) => ctx.sessionCache.forgetPerson(id));
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  r.get("/", allow("admin"), async (_req, res) => {
    const rows = await ctx.db.select().from(people).orderBy(asc(people.name));
    res.json({ people: rows.map(presentPerson) });
  });
  r.post("/", allow("admin"), createsRecord, validate(PersonCreateSchema), async (req, res) => {
    res.status(201).json({ person: await admin.create(me(req), req.body) });
  });
  r.put("/:id/roles", allow("admin"), changesRecord, validate(PersonRolesSchema), async (req, res) => {
    res.json({ person: await admin.setRoles(me(req), idParam(req), req.body.roles, req.body.reason) });
  });
  r.post("/:id/deactivate", allow("admin"), changesRecord, validate(ReasonOnlySchema), async (req, res) => {
    res.json({ person: await admin.deactivate(me(req), idParam(req), req.body.reason) });
  });
  r.post("/:id/reactivate", allow("admin"), changesRecord, validate(ReasonOnlySchema), async (req, res) => {
    res.json({ person: await admin.reactivate(me(req), idParam(req), req.body.reason) });
  });
  r.post("/:id/unlock", allow("admin"), changesRecord, validate(ReasonOnlySchema), async (req, res) => {
    res.json({ person: await admin.unlock(me(req), idParam(req), req.body.reason) });
  });
  r.post("/:id/reset-password", allow("admin"), changesRecord, validate(PasswordResetSchema), async (req, res) => {
    res.json({ person: await admin.resetPassword(me(req), idParam(req), req.body.temporaryPassword, req.body.reason) });
  });
  return r;
}

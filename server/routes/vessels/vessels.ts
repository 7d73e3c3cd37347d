import { asc, eq } from "drizzle-orm";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow, signedIn, type SignedInPerson } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { idParam } from "../../http/params.js";
import { notFound } from "../../http/errors.js";
import { vessels } from "../../db/schema.js";
import { presentVessel } from "./presenter.js";
import { createVesselRegistrar } from "../../commands/vesselRegistrar.js";
import { VesselCreateSchema, VesselStatusSchema, VesselUpdateSchema } from "../../../shared/schemas/vessels.js";
import { changesRecord, createsRecord } from "../../http/recordEffects.js";

/** /api/vessels: engineers register and edit; quality takes a vessel out of (or back into) service. */
export function vesselRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/vessels", registry);
  const registrar = createVesselRegistrar(ctx.db);
  const me = (req: { user?: unknown }) => req.user as SignedInPerson;

  r.get("/", signedIn, async (req, res) => {
    const rows = await ctx.db.select().from(vessels).orderBy(asc(vessels.tag));
    res.json({ vessels: rows.map((v) => presentVessel(v, me(req))) });
  });
  r.post("/", allow("engineer"), createsRecord, validate(VesselCreateSchema), async (req, res) => {
    res.status(201).json({ vessel: presentVessel(await registrar.register(me(req), req.body), me(req)) });
  });
  r.get("/:id", signedIn, async (req, res) => {
    const row = await ctx.db.query.vessels.findFirst({ where: eq(vessels.id, idParam(req)) });
    if (!row) throw notFound("That vessel");
    res.json({ vessel: presentVessel(row, me(req)) });
  });
  r.put("/:id", allow("engineer"), changesRecord, validate(VesselUpdateSchema), async (req, res) => {
    const { reason, revision, ...input } = req.body;
    res.json({ vessel: presentVessel(await registrar.update(me(req), idParam(req), input, reason, revision), me(req)) });
  });
  r.post("/:id/status", allow("quality"), changesRecord, validate(VesselStatusSchema), async (req, res) => {
    res.json({ vessel: presentVessel(await registrar.setStatus(me(req), idParam(req), req.body.status, req.body.reason), me(req)) });
  });
  return r;
}

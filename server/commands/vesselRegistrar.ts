import { eq, sql } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { vessels } from "../db/schema.js";
import { recordAudit, type Actor } from "./audit.js";
import { conflict, HttpError, notFound } from "../http/errors.js";
import { toSI } from "../../shared/units/index.js";
import type { VesselInput, VesselStatus } from "../../shared/schemas/vessels.js";

/** The vessel's quantities in SI, or 422 naming the field that makes it unsafe or impossible. */
export function vesselValues(input: VesselInput) {
  const mawpPa = toSI(input.mawp.value, input.mawp.unit);
  const reliefSetPa = toSI(input.reliefSetPressure.value, input.reliefSetPressure.unit);
  const minVolumeL = toSI(input.minVolume.value, input.minVolume.unit);
  const maxVolumeL = toSI(input.maxVolume.value, input.maxVolume.unit);
  if (mawpPa <= 0) throw new HttpError(422, "invalid-vessel", "mawp: the MAWP must be above zero absolute.", "mawp");
  if (reliefSetPa <= 0) throw new HttpError(422, "invalid-vessel", "reliefSetPressure: must be above zero absolute.", "reliefSetPressure");
  if (reliefSetPa > mawpPa) throw new HttpError(422, "relief-above-mawp", "reliefSetPressure: the relief set pressure must not exceed the MAWP.", "reliefSetPressure");
  if (minVolumeL >= maxVolumeL) throw new HttpError(422, "invalid-vessel", "minVolume: the rated minimum working volume must be below the maximum.", "minVolume");
  return {
    tag: input.tag,
    description: input.description,
    mawpPa,
    reliefSetPa,
    minVolumeL,
    maxVolumeL,
    boreAreaM2: input.boreArea ? toSI(input.boreArea.value, input.boreArea.unit) : null,
    pressureUnit: input.mawp.unit,
    volumeUnit: input.maxVolume.unit,
    areaUnit: input.boreArea?.unit ?? null,
  };
}

const snapshot = (row: typeof vessels.$inferSelect) => {
  const { createdAt: _c, updatedAt: _u, ...rest } = row;
  return rest;
};

/** Registers and changes vessels; each change audited with its reason. */
export function createVesselRegistrar(db: Db) {
  return {
    async register(actor: Actor, input: VesselInput) {
      const values = vesselValues(input);
      return db.transaction(async (tx) => {
        const [row] = await tx.insert(vessels).values({ ...values, createdBy: actor.id! }).onConflictDoNothing({ target: vessels.tag }).returning();
        if (!row) throw conflict("tag-taken", `A vessel tagged ${input.tag} is registered already.`);
        await recordAudit(tx, actor, { action: "vessel-registered", entityType: "vessel", entityId: row.id, after: snapshot(row) });
        return row;
      });
    },
    async update(actor: Actor, id: string, input: VesselInput, reason: string, revision: number) {
      const values = vesselValues(input);
      return db.transaction(async (tx) => {
        const [row] = await tx.select().from(vessels).where(eq(vessels.id, id)).for("update");
        if (!row) throw notFound("That vessel");
        if (row.revision !== revision) throw conflict("stale-revision", "Someone changed this vessel since you opened it. Reload it and make your change again.", { currentRevision: row.revision });
        const [updated] = await tx.update(vessels).set({ ...values, revision: row.revision + 1, updatedAt: sql`now()` }).where(eq(vessels.id, id)).returning().catch((err) => {
          if (err?.cause?.code === "23505" || err?.code === "23505") throw conflict("tag-taken", `A vessel tagged ${input.tag} is registered already.`);
          throw err;
        });
        await recordAudit(tx, actor, { action: "vessel-changed", entityType: "vessel", entityId: id, before: snapshot(row), after: snapshot(updated), reason });
        return updated;
      });
    },
    async setStatus(actor: Actor, id: string, status: VesselStatus, reason: string) {
      return db.transaction(async (tx) => {
        const [row] = await tx.select().from(vessels).where(eq(vessels.id, id)).for("update");
        if (!row) throw notFound("That vessel");
        if (row.status === status) throw conflict("status-unchanged", `Vessel ${row.tag} is already ${status}.`);
        const [updated] = await tx.update(vessels).set({ status, revision: row.revision + 1, updatedAt: sql`now()` }).where(eq(vessels.id, id)).returning();
        await recordAudit(tx, actor, { action: status === "in-service" ? "vessel-returned-to-service" : "vessel-taken-out-of-service", entityType: "vessel", entityId: id, before: { status: row.status }, after: { status }, reason });
        return updated;
      });
    },
  };
}

import type { vessels } from "../../db/schema.js";
import type { VesselView, VesselStatus } from "../../../shared/schemas/vessels.js";
import type { SignedInPerson } from "../../policies/access.js";

/** A vessel as the API shows it, with what the viewer may do to it. */
export function presentVessel(row: typeof vessels.$inferSelect, viewer: SignedInPerson): VesselView {
  return {
    id: row.id,
    tag: row.tag,
    description: row.description,
    mawpPa: row.mawpPa,
    reliefSetPa: row.reliefSetPa,
    minVolumeL: row.minVolumeL,
    maxVolumeL: row.maxVolumeL,
    boreAreaM2: row.boreAreaM2,
    entered: { pressureUnit: row.pressureUnit, volumeUnit: row.volumeUnit, areaUnit: row.areaUnit },
    status: row.status as VesselStatus,
    revision: row.revision,
    createdAt: row.createdAt.toISOString(),
    abilities: { edit: viewer.roles.includes("engineer"), changeStatus: viewer.roles.includes("quality") },
  };
}

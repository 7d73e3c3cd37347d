import { z } from "zod";
import { finite, positive } from "./common.js";
import { ReasonSchema } from "./people.js";
import { PRESSURE_UNITS, VOLUME_UNITS, AREA_UNITS } from "../units/index.js";

export const VESSEL_STATUSES = ["in-service", "out-of-service"] as const;
export type VesselStatus = (typeof VESSEL_STATUSES)[number];

const pressure = z.object({ value: finite(), unit: z.enum(PRESSURE_UNITS, { error: `must be one of ${PRESSURE_UNITS.join(", ")}` }) });
const volume = z.object({ value: positive(), unit: z.enum(VOLUME_UNITS, { error: `must be one of ${VOLUME_UNITS.join(", ")}` }) });

/** A vessel as the engineer enters it, each quantity in the unit they prefer. */
export const VesselInputSchema = z.object({
  tag: z.string({ error: "is required" }).trim().min(1, "is required").max(40, "must be at most 40 characters").regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "may hold letters, digits, dots, hyphens and underscores"),
  description: z.string({ error: "is required" }).trim().min(3, "must describe the vessel (at least 3 characters)").max(500),
  mawp: pressure,
  reliefSetPressure: pressure,
  minVolume: volume,
  maxVolume: volume,
  boreArea: z.object({ value: positive(), unit: z.enum(AREA_UNITS) }).nullable().optional(),
});
export type VesselInput = z.infer<typeof VesselInputSchema>;

export const VesselCreateSchema = VesselInputSchema;
export const VesselUpdateSchema = VesselInputSchema.extend({ reason: ReasonSchema, revision: z.number().int() });
export const VesselStatusSchema = z.object({ status: z.enum(VESSEL_STATUSES), reason: ReasonSchema });

export interface VesselView {
  id: string;
  tag: string;
  description: string;
  /** SI (Pa absolute, L, m²) and the unit the person entered, for showing it back. */
  mawpPa: number;
  reliefSetPa: number;
  minVolumeL: number;
  maxVolumeL: number;
  boreAreaM2: number | null;
  entered: { pressureUnit: string; volumeUnit: string; areaUnit: string | null };
  status: VesselStatus;
  revision: number;
  createdAt: string;
  abilities: { edit: boolean; changeStatus: boolean };
}

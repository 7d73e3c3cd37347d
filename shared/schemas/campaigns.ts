import { z } from "zod";
import { finite, positive, Uuid } from "./common.js";
import { PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS } from "../units/index.js";

export const CampaignCreateSchema = z.object({
  code: z.string({ error: "is required" }).trim().min(2).max(40).regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "may hold letters, digits, dots, hyphens and underscores"),
  process: z.string({ error: "is required" }).trim().min(3, "must name the process").max(300),
  masterRecordVersionId: Uuid,
  rateModelVersionId: Uuid,
});
export type CampaignCreateInput = z.infer<typeof CampaignCreateSchema>;

/** One planned batch: the vessel, its V0 and its operating point, in the units the person uses. */
export const BatchPlanSchema = z.object({
  code: z.string({ error: "is required" }).trim().min(2).max(40).regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "may hold letters, digits, dots, hyphens and underscores"),
  vesselId: Uuid,
  v0: z.object({ value: positive("must be a positive volume"), unit: z.enum(VOLUME_UNITS) }),
  temperature: z.object({ value: finite(), unit: z.enum(TEMPERATURE_UNITS) }),
  pressure: z.object({ value: finite(), unit: z.enum(PRESSURE_UNITS) }),
});
export type BatchPlanInput = z.infer<typeof BatchPlanSchema>;

export interface ScaledCharge {
  stepKey: string;
  stepTitle: string;
  fieldKey: string;
  label: string;
  unit: string;
  perLitre: { low: number | null; high: number | null };
  scaled: { low: number | null; high: number | null };
}

export interface PlanProblem {
  code: "final-volume-above-rated-max" | "final-volume-below-rated-min" | "v0-outside-rated-range" | "pressure-above-mawp" | "pressure-at-or-above-relief" | "vessel-out-of-service" | "temperature-not-physical" | "pressure-not-physical";
  field: string;
  message: string;
}

/** What planning works out for a batch; `problems` empty means the plan may be saved. */
export interface BatchPlanResult {
  epsilonA: number;
  v0L: number;
  temperatureK: number;
  pressurePa: number;
  maxConversion: number;
  finalVolumeL: number;
  cA0MolPerL: number;
  charges: ScaledCharge[];
  problems: PlanProblem[];
}

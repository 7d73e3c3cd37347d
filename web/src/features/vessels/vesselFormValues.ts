import type { Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { VesselCreateSchema, VesselUpdateSchema, type VesselInput, type VesselView } from "../../../../shared/schemas/vessels";
import type { AreaUnit, PressureUnit, VolumeUnit } from "../../../../shared/units";
import { valueInUnit } from "./quantityFormat";

/** What the vessel form holds while the person types; a number is undefined or NaN until filled in. */
export interface VesselFormValues {
  tag: string;
  description: string;
  mawp: { value: number; unit: PressureUnit };
  reliefSetPressure: { value: number; unit: PressureUnit };
  minVolume: { value: number; unit: VolumeUnit };
  maxVolume: { value: number; unit: VolumeUnit };
  /** Empty (NaN) means the vessel has no piston bore to record. */
  boreArea: { value: number; unit: AreaUnit };
  reason: string;
}

/** What a valid form submits: the API body (plus the reason when editing). */
export type VesselFormOutput = VesselInput & { reason?: string };

// Empty numbers are left undefined: the input then starts blank (NaN would be written into it).
const BLANK = undefined as unknown as number;

/** Empty form for registering a vessel, in the units most used on the pilot plant. */
export const EMPTY_VESSEL: VesselFormValues = {
  tag: "",
  description: "",
  mawp: { value: BLANK, unit: "bar(a)" },
  reliefSetPressure: { value: BLANK, unit: "bar(a)" },
  minVolume: { value: BLANK, unit: "L" },
  maxVolume: { value: BLANK, unit: "L" },
  boreArea: { value: BLANK, unit: "cm²" },
  reason: "",
};

/** A registered vessel back in the units it was entered in, for editing. */
export function vesselToForm(vessel: VesselView): VesselFormValues {
  const pressureUnit = vessel.entered.pressureUnit as PressureUnit;
  const volumeUnit = vessel.entered.volumeUnit as VolumeUnit;
  const areaUnit = (vessel.entered.areaUnit ?? "cm²") as AreaUnit;
  return {
    tag: vessel.tag,
    description: vessel.description,
    mawp: { value: valueInUnit(vessel.mawpPa, pressureUnit), unit: pressureUnit },
    reliefSetPressure: { value: valueInUnit(vessel.reliefSetPa, pressureUnit), unit: pressureUnit },
    minVolume: { value: valueInUnit(vessel.minVolumeL, volumeUnit), unit: volumeUnit },
    maxVolume: { value: valueInUnit(vessel.maxVolumeL, volumeUnit), unit: volumeUnit },
    boreArea: {
      value: vessel.boreAreaM2 === null ? BLANK : valueInUnit(vessel.boreAreaM2, areaUnit),
      unit: areaUnit,
    },
    reason: "",
  };
}

/** The API body the form stands for; an empty bore area becomes null. */
export function formToVesselBody(values: VesselFormValues, editing: boolean): Record<string, unknown> {
  const { reason, boreArea, ...rest } = values;
  const body: Record<string, unknown> = {
    ...rest,
    boreArea: Number.isFinite(boreArea.value) ? boreArea : null,
  };
  if (editing) body.reason = reason;
  return body;
}

/**
 * Validates the form with the same shared schema the server uses: the create schema, or the
 * update schema without the revision (the screen adds that from the vessel it opened).
 */
export function vesselResolver(editing: boolean): Resolver<VesselFormValues, unknown, VesselFormOutput> {
  const inner = editing ? zodResolver(VesselUpdateSchema.omit({ revision: true })) : zodResolver(VesselCreateSchema);
  return (values, context, options) =>
    inner(formToVesselBody(values, editing) as never, context, options as never) as ReturnType<
      Resolver<VesselFormValues, unknown, VesselFormOutput>
    >;
}

/** Form paths an API error's `field` can point at, mapped to the input that shows it. */
export function vesselErrorPath(field: string | undefined): keyof VesselFormValues | `${"mawp" | "reliefSetPressure" | "minVolume" | "maxVolume" | "boreArea"}.value` | null {
  if (!field) return null;
  const top = field.split(".")[0];
  if (top === "tag" || top === "description" || top === "reason") return top;
  if (top === "mawp" || top === "reliefSetPressure" || top === "minVolume" || top === "maxVolume" || top === "boreArea") return `${top}.value`;
  return null;
}

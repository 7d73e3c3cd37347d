import { z } from "zod";
import type { Resolver, UseFormReturn } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS, fromSI, toSI, type PressureUnit, type TemperatureUnit, type VolumeUnit } from "../../../../shared/units";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";

/** "manual" for a model typed in, otherwise the id of an approved rate-model version. */
export const MANUAL_MODEL = "manual";

/** What the analysis form holds while the person types; blank numbers are NaN. */
export interface AnalysisFormValues {
  modelSource: string;
  order: number;
  kRef: number;
  TRef: { value: number; unit: TemperatureUnit };
  EaKJPerMol: number;
  epsilonA: number;
  tolerancePct: number;
  residualPctOfV0: number;
  temperatureBandK: number;
  pressureBandPct: number;
  T: { value: number; unit: TemperatureUnit };
  P: { value: number; unit: PressureUnit };
  /** Blank: the first volume of the trace. */
  V0: { value: number; unit: VolumeUnit };
  /** Mole fraction of A in the charge; gives cA0 = yA0·P/(R·T). Needed unless the order is 1. */
  yA0: number;
  compareOrders: boolean;
  runWhere: "browser" | "server";
}

/** The model and conditions in SI, as the check takes them (residual limit still relative to V0). */
export interface AnalysisSetup {
  model: { order: number; kRef: number; TRef: number; Ea: number; epsilonA: number; tolerancePct: number; temperatureBandK: number; pressureBandPct: number };
  residualPctOfV0: number;
  conditions: { T: number; P: number; V0?: number; yA0?: number };
  compareOrders: boolean;
  runWhere: "browser" | "server";
}

// Demo defaults from the invented scenario (Harrow Fen, campaign HF-24): DMX → 2 MON, 30 % N2.
const BLANK = undefined as unknown as number;
export const DEMO_ANALYSIS: AnalysisFormValues = {
  modelSource: MANUAL_MODEL,
  order: 1,
  kRef: 2.0e-3,
  TRef: { value: 250, unit: "°C" },
  EaKJPerMol: 160,
  epsilonA: 0.7,
  tolerancePct: 10,
  residualPctOfV0: 1.5,
  temperatureBandK: 2,
  pressureBandPct: 2,
  T: { value: 250, unit: "°C" },
  P: { value: 2.0, unit: "bar(a)" },
  V0: { value: BLANK, unit: "L" },
  yA0: 0.7,
  compareOrders: true,
  runWhere: "browser",
};

const number = (what: string) => z.number({ error: `must be ${what}` }).refine(Number.isFinite, `must be ${what}`);
const atLeastZero = (what: string) => number(what).refine((v) => v >= 0, `must be ${what}, zero or more`);
const blankOr = <T extends z.ZodType>(schema: T) => z.union([z.nan().transform(() => undefined), z.undefined(), schema]);
const quantity = <U extends readonly [string, ...string[]]>(units: U, value: z.ZodType) => z.object({ value, unit: z.enum(units) });

const AnalysisFormSchema = z.object({
  modelSource: z.string(),
  order: atLeastZero("the reaction order").refine((n) => n <= 6, "must be at most 6"),
  kRef: number("a positive rate constant").refine((v) => v > 0, "must be a positive rate constant"),
  TRef: quantity(TEMPERATURE_UNITS, number("a temperature")),
  EaKJPerMol: atLeastZero("an activation energy in kJ/mol"),
  epsilonA: number("a number above −1").refine((v) => v > -1, "must be a number above −1"),
  tolerancePct: atLeastZero("a percentage"),
  residualPctOfV0: atLeastZero("a percentage of V0"),
  temperatureBandK: atLeastZero("a temperature difference in K"),
  pressureBandPct: atLeastZero("a percentage"),
  T: quantity(TEMPERATURE_UNITS, number("a temperature")),
  P: quantity(PRESSURE_UNITS, number("a pressure")),
  V0: quantity(VOLUME_UNITS, blankOr(number("a volume").refine((v) => v > 0, "must be a positive volume"))),
  yA0: blankOr(number("a mole fraction").refine((v) => v > 0 && v <= 1, "must be a mole fraction above 0 and at most 1")),
  compareOrders: z.boolean(),
  runWhere: z.enum(["browser", "server"]),
});

function toSetup(values: z.infer<typeof AnalysisFormSchema>): AnalysisSetup {
  const V0 = values.V0.value === undefined ? undefined : toSI(values.V0.value as number, values.V0.unit);
  return {
    model: {
      order: values.order,
      kRef: values.kRef,
      TRef: toSI(values.TRef.value as number, values.TRef.unit),
      Ea: values.EaKJPerMol * 1000,
      epsilonA: values.epsilonA,
      tolerancePct: values.tolerancePct,
      temperatureBandK: values.temperatureBandK,
      pressureBandPct: values.pressureBandPct,
    },
    residualPctOfV0: values.residualPctOfV0,
    conditions: { T: toSI(values.T.value as number, values.T.unit), P: toSI(values.P.value as number, values.P.unit), V0, yA0: values.yA0 as number | undefined },
    compareOrders: values.compareOrders,
    runWhere: values.runWhere,
  };
}

/** Validates the form and turns it into SI values for the check. */
export const analysisResolver: Resolver<AnalysisFormValues, unknown, AnalysisSetup> = async (values, context, options) => {
  const inner = zodResolver(AnalysisFormSchema);
  const result = await inner(values as never, context, options as never);
  if (Object.keys(result.errors).length > 0) return { values: {}, errors: result.errors } as never;
  return { values: toSetup(result.values as z.infer<typeof AnalysisFormSchema>), errors: {} };
};

/** The model fields filled from an approved rate-model version, in the units already chosen. */
export function modelFromVersion(version: RateModelVersionView, TRefUnit: TemperatureUnit): Partial<AnalysisFormValues> {
  const c = version.content;
  return {
    order: c.order,
    kRef: c.kRef,
    TRef: { value: Number(fromSI(c.TRefK, TRefUnit).toPrecision(10)), unit: TRefUnit },
    EaKJPerMol: c.EaJPerMol / 1000,
    epsilonA: version.derived.epsilonA,
    tolerancePct: c.tolerancePct,
    residualPctOfV0: c.residualRmsMaxPctOfV0,
    temperatureBandK: c.temperatureBandK,
    pressureBandPct: c.pressureBandPct,
    yA0: version.derived.yA0,
  };
}

/** Fills the form's model fields from an approved version and selects it as the model. */
export function applyVersion(form: UseFormReturn<AnalysisFormValues, unknown, AnalysisSetup>, version: RateModelVersionView): void {
  form.setValue("modelSource", version.id);
  for (const [key, value] of Object.entries(modelFromVersion(version, form.getValues("TRef.unit")))) {
    form.setValue(key as keyof AnalysisFormValues, value as never, { shouldValidate: true });
  }
}

import { z } from "zod";
import { finite, positive } from "./common.js";

/** Requests and answers of /api/kinetics: pure computation in SI units (s, L, K, Pa, mol/L). */

const Species = z.string({ error: "is required" }).trim().min(1, "is required").max(40, "is too long");
const Participant = z.object({
  species: Species,
  coefficient: positive("must be a positive stoichiometric coefficient"),
  phase: z.enum(["gas", "liquid", "solid"], { error: "must be gas, liquid or solid" }).default("gas"),
});

/** POST /api/kinetics/epsilon: the reaction, its key species and the feed mole fractions. */
export const EpsilonRequestSchema = z.object({
  reactants: z.array(Participant, { error: "must be a list of reactants" }).min(1, "needs at least one reactant").max(20, "has too many reactants"),
  products: z.array(Participant, { error: "must be a list of products" }).min(1, "needs at least one product").max(20, "has too many products"),
  keySpecies: Species,
  feed: z.record(Species, finite("must be a mole fraction"), { error: "must map each species to its mole fraction" }),
});
export type EpsilonRequest = z.infer<typeof EpsilonRequestSchema>;

const series = (what: string) => z.array(finite(`must hold only numbers (${what})`), { error: `must be a list of numbers (${what})` });

/** A trace in JSON: time (s) and gas volume (L), optionally temperature (K) and pressure (Pa). */
export const TraceJsonSchema = z
  .object({ t: series("s"), V: series("L"), T: series("K").optional(), P: series("Pa").optional() })
  .superRefine((trace, ctx) => {
    const n = trace.t.length;
    // As in a trace file: each time must come after the one before.
    const back = trace.t.findIndex((s, i) => i > 0 && !(s > trace.t[i - 1]));
    if (back > 0) ctx.addIssue({ code: "custom", path: ["t", back], message: `must increase: t[${back}] = ${trace.t[back]} s is not after t[${back - 1}] = ${trace.t[back - 1]} s` });
    for (const key of ["V", "T", "P"] as const) {
      const values = trace[key];
      if (values !== undefined && values.length !== n) {
        ctx.addIssue({ code: "custom", path: [key], message: `has ${values.length} values but t has ${n}` });
      }
    }
  });
export type TraceJson = z.infer<typeof TraceJsonSchema>;

/** Reading a trace CSV whose volume is given as piston travel. */
const CsvOptionsSchema = z.object({
  boreArea: positive("must be the piston bore area in m²").optional(),
  volumeAtZeroTravel: finite("must be the gas volume at zero travel in L").optional(),
});

const Order = z.union([finite("must be a number or \"auto\"").refine((n) => n >= 0 && n <= 6, "must be between 0 and 6"), z.literal("auto")], {
  error: "must be a number from 0 to 6 or \"auto\"",
});

/** POST /api/kinetics/fit without its trace (the "params" part of an upload). */
export const FitParamsSchema = z.object({
  V0: positive("must be the gas volume at t = 0 in L").optional(),
  epsilonA: finite("must be a number"),
  cA0: positive("must be the initial concentration of A in mol/L").optional(),
  order: Order,
  /** "volume" (default): least squares on the volumes; "linearised": the integral straight line. */
  method: z.enum(["volume", "linearised"], { error: "must be volume or linearised" }).optional(),
  /** Leave the per-point arrays (residuals) out of the answer. */
  includeSeries: z.boolean({ error: "must be true or false" }).optional(),
  csv: CsvOptionsSchema.optional(),
});
export type FitParams = z.infer<typeof FitParamsSchema>;

/** POST /api/kinetics/fit as JSON. */
export const FitRequestSchema = FitParamsSchema.omit({ csv: true }).extend({ trace: TraceJsonSchema });
export type FitRequest = z.infer<typeof FitRequestSchema>;

/** The approved rate model a trace is checked against, in SI units. */
export const CheckModelSchema = z.object({
  order: finite().refine((n) => n >= 0 && n <= 6, "must be between 0 and 6"),
  kRef: positive("must be a positive rate constant"),
  TRef: positive("must be a temperature in K"),
  Ea: finite("must be an activation energy in J/mol"),
  epsilonA: finite(),
  tolerancePct: finite(),
  residualRmsMax: finite("must be a volume in L"),
  temperatureBandK: finite(),
  pressureBandPct: finite(),
  minPoints: z.number().int("must be a whole number").min(2, "must be at least 2").optional(),
  minConversion: finite().optional(),
});

/** The batch conditions: set temperature (K), absolute pressure (Pa), V0 (L), and cA0 or yA0. */
export const CheckConditionsSchema = z.object({
  T: positive("must be a temperature in K"),
  P: positive("must be an absolute pressure in Pa"),
  V0: positive("must be the gas volume at t = 0 in L"),
  cA0: positive("must be the initial concentration of A in mol/L").optional(),
  yA0: finite().refine((y) => y > 0 && y <= 1, "must be a mole fraction above 0 and at most 1").optional(),
});

/** POST /api/kinetics/check without its trace (the "params" part of an upload). */
export const CheckParamsSchema = z.object({
  model: CheckModelSchema,
  conditions: CheckConditionsSchema,
  includeSeries: z.boolean({ error: "must be true or false" }).optional(),
  csv: CsvOptionsSchema.optional(),
});
export type CheckParams = z.infer<typeof CheckParamsSchema>;

/** POST /api/kinetics/check as JSON. */
export const CheckRequestSchema = CheckParamsSchema.omit({ csv: true }).extend({ trace: TraceJsonSchema });
export type CheckRequest = z.infer<typeof CheckRequestSchema>;

/** One order tried by order "auto". */
export interface OrderTrialView {
  label: string;
  order: number;
  orderFitted: boolean;
  k: number | null;
  kUnit: string;
  residualRms: number | null;
  r2: number | null;
  converged: boolean;
}

/** The answer of POST /api/kinetics/fit. Non-finite numbers come back as null. */
export interface FitResponse {
  method: "volume-nonlinear" | "linearised";
  order: number;
  orderFitted: boolean;
  orderStdError?: number | null;
  orderCI95?: [number | null, number | null];
  k: number | null;
  kUnit: string;
  kStdError: number | null;
  kCI95: [number | null, number | null];
  r2: number | null;
  residualRms: number | null;
  points: number;
  excludedPoints: number;
  converged: boolean;
  iterations: number;
  warnings: string[];
  /** The V0 used (L): as sent, or the first volume of the trace. */
  V0: number;
  /** Observed minus fitted volume at each used point, L (left out when includeSeries is false). */
  residuals?: (number | null)[];
  /** With order "auto": every order tried; the fields above are the chosen one. */
  orders?: OrderTrialView[];
  libraryVersion: string;
}

/** The answer of POST /api/kinetics/check. Non-finite numbers come back as null. */
export interface CheckResponse {
  verdict: "within" | "outside";
  reasons: { code: string; message: string }[];
  kObserved: number | null;
  kObservedCI95: [number | null, number | null];
  kModel: number;
  kUnit: string;
  deviationPct: number | null;
  residualRms: number | null;
  points: number;
  maxConversion: number | null;
  cA0: number | null;
  notes: string[];
  notice: string;
  predicted?: (number | null)[];
  linearised?: { x: (number | null)[]; y: (number | null)[]; slope: number | null; modelSlope: number | null } | null;
  residuals?: (number | null)[];
  libraryVersion: string;
}

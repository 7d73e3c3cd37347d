import { z } from "zod";
import { finite, positive } from "./common.js";
import { ReasonSchema } from "./people.js";

const Species = z.string({ error: "is required" }).trim().min(1, "is required").max(40, "is too long");
const Participant = z.object({
  species: Species,
  coefficient: positive("must be a positive stoichiometric coefficient"),
  phase: z.enum(["gas", "liquid", "solid"], { error: "must be gas, liquid or solid" }),
});

/** What the engineer writes in a rate-model draft; εA is derived from reaction and feed. */
export const RateModelContentSchema = z.object({
  reaction: z.object({
    reactants: z.array(Participant).min(1, "needs at least one reactant").max(10),
    products: z.array(Participant).min(1, "needs at least one product").max(10),
  }),
  keySpecies: Species,
  feed: z.record(Species, finite("must be a mole fraction")),
  order: finite("must be a number").refine((n) => n >= 0 && n <= 4, "must be between 0 and 4"),
  kRef: positive("must be a positive rate constant"),
  TRefK: positive("must be a temperature in kelvin").refine((t) => t > 150 && t < 1500, "must be between 150 K and 1500 K"),
  EaJPerMol: finite().refine((e) => e >= 0 && e <= 500_000, "must be between 0 and 500 000 J/mol"),
  tolerancePct: positive().refine((v) => v <= 100, "must be at most 100 %"),
  /** The largest residual RMS accepted, as a percentage of V0 so one model serves every scale. */
  residualRmsMaxPctOfV0: positive().refine((v) => v <= 50, "must be at most 50 % of V0"),
  temperatureBandK: positive().refine((v) => v <= 50, "must be at most 50 K"),
  pressureBandPct: positive().refine((v) => v <= 50, "must be at most 50 %"),
  notes: z.string().trim().max(4000).optional().default(""),
});
export type RateModelContent = z.infer<typeof RateModelContentSchema>;

export const RateModelCreateSchema = z.object({
  code: z.string({ error: "is required" }).trim().min(2, "is required").max(40).regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "may hold letters, digits, dots, hyphens and underscores"),
  title: z.string({ error: "is required" }).trim().min(3, "must say what the model is for").max(200),
  content: RateModelContentSchema,
});
export const RateModelDraftSchema = z.object({ content: RateModelContentSchema });
export const RateModelDraftUpdateSchema = z.object({ content: RateModelContentSchema, reason: ReasonSchema, revision: z.number().int() });

export { rateConstantUnit } from "../kinetics/fitResult.js";

export interface RateModelVersionView {
  id: string;
  modelId: string;
  code: string;
  title: string;
  version: number;
  status: "draft" | "approved" | "superseded";
  content: RateModelContent;
  derived: { epsilonA: number; delta: number; yA0: number; kUnit: string };
  basedOnBatchIds: string[];
  createdBy: { id: string; name: string };
  createdAt: string;
  approvedAt: string | null;
  revision: number;
  signatures: import("./common.js").SignatureView[];
  abilities: { edit: boolean; approve: boolean; succeed: boolean };
}

/** A proposed update from released batches; `save` stores it as a draft version. */
export const ModelProposalSchema = z.object({
  batchIds: z.array(z.uuid({ error: "must be batch ids" }), { error: "must be a list of batch ids" }).min(2, "needs at least two released batches").max(50),
  save: z.boolean().default(false),
});

import type { FieldError, Resolver } from "react-hook-form";
import { toNestErrors } from "@hookform/resolvers";
import type { z } from "zod";
import { computeEpsilonA } from "../../../../shared/kinetics/epsilonA";
import { KineticsInputError } from "../../../../shared/kinetics/kineticsInputError";
import {
  RateModelCreateSchema,
  RateModelDraftSchema,
  RateModelDraftUpdateSchema,
  type RateModelContent,
} from "../../../../shared/schemas/rateModels";
import { fromSI, toSI, type TemperatureUnit } from "../../../../shared/units";

type Phase = "gas" | "liquid" | "solid";

/** One reactant or product row as typed. */
export interface ParticipantRow {
  species: string;
  coefficient: number;
  phase: Phase;
}

/** The rate-model form: the content with T in °C or K, Ea in kJ/mol, and the feed as rows. */
export interface RateModelFormValues {
  code: string;
  title: string;
  reaction: { reactants: ParticipantRow[]; products: ParticipantRow[] };
  keySpecies: string;
  feed: { species: string; moleFraction: number }[];
  order: number;
  kRef: number;
  TRef: { value: number; unit: TemperatureUnit };
  EaKJPerMol: number;
  tolerancePct: number;
  residualRmsMaxPctOfV0: number;
  temperatureBandK: number;
  pressureBandPct: number;
  notes: string;
  reason: string;
}

/** What a valid form submits. */
export interface RateModelFormOutput {
  code?: string;
  title?: string;
  content: RateModelContent;
  reason?: string;
}

/** create: a new model; draft: the next version of a model; edit: change an open draft. */
export type RateModelFormMode = "create" | "draft" | "edit";

const BLANK = undefined as unknown as number;
const tidy = (x: number) => Number(x.toPrecision(10));

/** A blank form for a new model; one gas reactant and product rows to start from. */
export const EMPTY_RATE_MODEL: RateModelFormValues = {
  code: "",
  title: "",
  reaction: { reactants: [{ species: "", coefficient: 1, phase: "gas" }], products: [{ species: "", coefficient: 1, phase: "gas" }] },
  keySpecies: "",
  feed: [{ species: "", moleFraction: BLANK }],
  order: 1,
  kRef: BLANK,
  TRef: { value: BLANK, unit: "°C" },
  EaKJPerMol: BLANK,
  tolerancePct: BLANK,
  residualRmsMaxPctOfV0: BLANK,
  temperatureBandK: BLANK,
  pressureBandPct: BLANK,
  notes: "",
  reason: "",
};

/** A version's content as form values (T shown in °C, Ea in kJ/mol). */
export function contentToForm(content: RateModelContent, code = "", title = ""): RateModelFormValues {
  return {
    code,
    title,
    reaction: {
      reactants: content.reaction.reactants.map((p) => ({ ...p })),
      products: content.reaction.products.map((p) => ({ ...p })),
    },
    keySpecies: content.keySpecies,
    // The key species first, then the rest by name (the stored order is not the typed one).
    feed: Object.entries(content.feed)
      .sort(([a], [b]) => (a === content.keySpecies ? -1 : b === content.keySpecies ? 1 : a.localeCompare(b)))
      .map(([species, moleFraction]) => ({ species, moleFraction })),
    order: content.order,
    kRef: content.kRef,
    TRef: { value: tidy(fromSI(content.TRefK, "°C")), unit: "°C" },
    EaKJPerMol: tidy(content.EaJPerMol / 1000),
    tolerancePct: content.tolerancePct,
    residualRmsMaxPctOfV0: content.residualRmsMaxPctOfV0,
    temperatureBandK: content.temperatureBandK,
    pressureBandPct: content.pressureBandPct,
    notes: content.notes ?? "",
    reason: "",
  };
}

/** The feed rows as the API's {species: moleFraction} record. */
export function feedRecord(feed: RateModelFormValues["feed"]): Record<string, number> {
  return Object.fromEntries(feed.map((row) => [row.species.trim(), row.moleFraction]));
}

/** The content the form stands for, unvalidated, in the API's units (K, J/mol). */
export function formToContent(values: RateModelFormValues): RateModelContent {
  return {
    reaction: values.reaction,
    keySpecies: values.keySpecies.trim(),
    feed: feedRecord(values.feed),
    order: values.order,
    kRef: values.kRef,
    TRefK: Number.isFinite(values.TRef.value) ? toSI(values.TRef.value, values.TRef.unit) : Number.NaN,
    EaJPerMol: values.EaKJPerMol * 1000,
    tolerancePct: values.tolerancePct,
    residualRmsMaxPctOfV0: values.residualRmsMaxPctOfV0,
    temperatureBandK: values.temperatureBandK,
    pressureBandPct: values.pressureBandPct,
    notes: values.notes,
  };
}

/** Maps a path inside the content (as the schema or εA check names it) to the form input showing it. */
export function contentPathToForm(path: (string | number)[], values: RateModelFormValues): string {
  const [head, second] = path;
  if (head === "TRefK") return "TRef.value";
  if (head === "EaJPerMol") return "EaKJPerMol";
  if (head === "feed" && typeof second === "string") {
    const index = values.feed.findIndex((row) => row.species.trim() === second);
    return index >= 0 ? `feed.${index}.${path.length > 2 ? "species" : "moleFraction"}` : "feed";
  }
  return path.join(".");
}

/** "reaction.reactants[0].coefficient" (the kinetics library's style) as path parts. */
export function kineticsFieldPath(field: string): string[] {
  return field.replace(/\[(\d+)\]/g, ".$1").split(".");
}

const EA_MESSAGE = "must be between 0 and 500 kJ/mol";

function schemaFor(mode: RateModelFormMode) {
  if (mode === "create") return RateModelCreateSchema;
  if (mode === "edit") return RateModelDraftUpdateSchema.omit({ revision: true });
  return RateModelDraftSchema;
}

function collectErrors(values: RateModelFormValues, issues: z.core.$ZodIssue[]): Record<string, FieldError> {
  const errors: Record<string, FieldError> = {};
  const put = (path: string, message: string) => {
    if (!errors[path]) errors[path] = { type: "schema", message };
  };
  for (const issue of issues) {
    const [head, ...rest] = issue.path.map((p) => (typeof p === "symbol" ? String(p) : p));
    if (head !== "content") {
      put(String(head ?? "root"), issue.message);
      continue;
    }
    if (issue.code === "invalid_key" && rest[0] === "feed") {
      // A feed species name that fails the species rule: put the rule's own message on the name.
      const index = values.feed.findIndex((row) => row.species.trim() === String(rest[1]));
      put(index >= 0 ? `feed.${index}.species` : "feed", issue.issues[0]?.message ?? issue.message);
      continue;
    }
    const path = contentPathToForm(rest, values);
    put(path, path === "EaKJPerMol" && rest[0] === "EaJPerMol" ? EA_MESSAGE : issue.message);
  }
  const seen = new Map<string, number>();
  values.feed.forEach((row, index) => {
    const species = row.species.trim();
    if (seen.has(species)) put(`feed.${index}.species`, "is listed twice in the feed");
    seen.set(species, index);
  });
  return errors;
}

/**
 * Validates with the shared schema the server uses (after turning °C and kJ/mol into K and
 * J/mol), then with the same εA check, and puts each problem on the input that shows it.
 */
export function rateModelResolver(mode: RateModelFormMode): Resolver<RateModelFormValues, unknown, RateModelFormOutput> {
  return (values, _context, options) => {
    const body: Record<string, unknown> = { content: formToContent(values) };
    if (mode === "create") Object.assign(body, { code: values.code, title: values.title });
    if (mode === "edit") body.reason = values.reason;
    const parsed = schemaFor(mode).safeParse(body);
    const errors = collectErrors(values, parsed.success ? [] : parsed.error.issues);
    if (parsed.success && Object.keys(errors).length === 0) {
      const content = parsed.data.content;
      try {
        computeEpsilonA(content.reaction, content.keySpecies, content.feed);
      } catch (error) {
        if (!(error instanceof KineticsInputError)) throw error;
        errors[contentPathToForm(kineticsFieldPath(error.field), values)] = { type: "kinetics", message: error.message };
      }
      if (Object.keys(errors).length === 0) return { values: parsed.data as RateModelFormOutput, errors: {} };
    }
    return { values: {}, errors: toNestErrors(errors, options) };
  };
}

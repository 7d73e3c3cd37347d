import type { Request, RequestHandler } from "express";
import type { ZodType } from "zod";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { signedIn } from "../../policies/access.js";
import { validate } from "../../http/validate.js";
import { HttpError, fromZod } from "../../http/errors.js";
import {
  checkTrace,
  checkVerdict,
  computeEpsilonA,
  fitAutoOrder,
  fitIntegral,
  KineticsInputError,
  type IntegralFitResult,
  type Trace,
  type TraceCsvResult,
} from "../../../shared/kinetics/index.js";
import {
  CheckParamsSchema,
  CheckRequestSchema,
  EpsilonRequestSchema,
  FitParamsSchema,
  FitRequestSchema,
  type CheckParams,
  type EpsilonRequest,
  type FitParams,
  type TraceJson,
} from "../../../shared/schemas/kinetics.js";
import { presentCheck, presentFit } from "./kineticsPresenter.js";
import { readTraceUpload } from "./traceUpload.js";
import { computesOnly } from "../../http/recordEffects.js";

/** Runs a library computation; bad input it finds becomes 422 naming the field. */
function compute<T>(work: () => T, fieldOf: (field: string) => string = (f) => f): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof KineticsInputError) throw new HttpError(422, "invalid-kinetics-input", error.message, fieldOf(error.field));
    throw error;
  }
}

const isUpload = (req: Request) => Boolean(req.is("multipart/form-data"));

/** Validates a JSON body with `schema`, or lets a multipart upload through to be read later. */
function jsonOrUpload(schema: ZodType): RequestHandler {
  const json = validate(schema);
  return (req, res, next) => (isUpload(req) ? next() : json(req, res, next));
}

/** Parses the "params" part of an upload with `schema`; 400 naming params.<field> otherwise. */
function paramsReader<P>(schema: ZodType<P, unknown>) {
  return (text: string): P => {
    let value: unknown;
    try {
      value = JSON.parse(text);
    } catch {
      throw new HttpError(400, "invalid-params", "The params part is not valid JSON.", "params");
    }
    const parsed = schema.safeParse(value);
    if (parsed.success) return parsed.data;
    const error = fromZod(parsed.error);
    const field = error.field ? `params.${error.field}` : "params";
    throw new HttpError(400, error.code, `params.${error.message}`, field, error.extra);
  };
}

/** The parsed trace of an upload, or 422 listing the first problems, each naming its line. */
function traceOf(csv: TraceCsvResult): Trace {
  if (csv.ok) return csv.trace;
  const first = csv.errors[0];
  throw new HttpError(422, "trace-csv-invalid", `The trace file has ${csv.totalErrors} problem(s). ${first?.message ?? ""}`.trim(), "file", {
    problems: csv.errors,
    totalProblems: csv.totalErrors,
  });
}

function traceFromJson(trace: TraceJson): Trace {
  return {
    t: Float64Array.from(trace.t),
    V: Float64Array.from(trace.V),
    T: trace.T === undefined ? undefined : Float64Array.from(trace.T),
    P: trace.P === undefined ? undefined : Float64Array.from(trace.P),
  };
}

/**
 * Without V0 the first reading is taken as the charge at the start of the reaction, so time is
 * counted from it: a trace logged from t = 3600 s would otherwise be fitted as if 3600 s of
 * reaction had passed before its first volume.
 */
function fromFirstReading(trace: Trace): { trace: Trace; warning?: string } {
  const start = trace.t.length > 0 ? trace.t[0] : 0;
  if (!(Number.isFinite(start) && start > 0)) return { trace };
  const t = Float64Array.from(trace.t, (ti) => ti - start);
  return { trace: { ...trace, t }, warning: `V0 was taken from the first volume, read at t = ${start} s; times are counted from that reading.` };
}

function runFit(original: Trace, params: Omit<FitParams, "csv">) {
  const { trace, warning } = params.V0 === undefined ? fromFirstReading(original) : { trace: original, warning: undefined };
  const V0 = params.V0 ?? (trace.V.length > 0 ? trace.V[0] : undefined);
  if (V0 === undefined) throw new HttpError(422, "invalid-kinetics-input", "V0 is needed: the trace has no volumes to take it from.", "V0");
  if (params.order === "auto" && params.method === "linearised") {
    throw new HttpError(400, "invalid-input", "method: the linearised fit needs a numeric order, not \"auto\".", "method");
  }
  const setup = { V0, epsilonA: params.epsilonA, cA0: params.cA0 };
  const fit: IntegralFitResult = compute(() =>
    params.order === "auto" ? fitAutoOrder(trace, setup) : fitIntegral(trace, { ...setup, order: params.order as number, method: params.method }),
  );
  if (warning) fit.warnings.unshift(warning);
  return presentFit(fit, V0, params.includeSeries ?? true);
}

function runCheck(trace: Trace, params: Omit<CheckParams, "csv">) {
  const input = { model: params.model, conditions: params.conditions, trace };
  // Without the series there is nothing to draw, so the chart series are not built either.
  return presentCheck(compute(() => ((params.includeSeries ?? true) ? checkTrace(input) : checkVerdict(input))));
}

/** /api/kinetics: pure computation over the kinetics library; nothing stored. */
export function kineticsRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/kinetics", registry);
  const upload = <P extends { csv?: { boreArea?: number; volumeAtZeroTravel?: number } }>(req: Request, schema: ZodType<P, unknown>) =>
    readTraceUpload<P>(req, { maxBytes: ctx.settings.uploadMaxBytes, readParams: paramsReader<P>(schema), csvOptionsOf: (p) => p.csv });

  r.post("/epsilon", signedIn, computesOnly, validate(EpsilonRequestSchema), (req, res) => {
    const { reactants, products, keySpecies, feed } = req.body as EpsilonRequest;
    // The library names reaction.reactants[i]…; this body has reactants at the top level.
    res.json(compute(() => computeEpsilonA({ reactants, products }, keySpecies, feed), (f) => f.replace(/^reaction\./, "")));
  });

  r.post("/fit", signedIn, computesOnly, jsonOrUpload(FitRequestSchema), async (req, res) => {
    if (isUpload(req)) {
      const { params, csv } = await upload<FitParams>(req, FitParamsSchema);
      res.json(runFit(traceOf(csv), params));
      return;
    }
    const { trace, ...params } = req.body as FitParams & { trace: TraceJson };
    res.json(runFit(traceFromJson(trace), params));
  });

  r.post("/check", signedIn, computesOnly, jsonOrUpload(CheckRequestSchema), async (req, res) => {
    if (isUpload(req)) {
      const { params, csv } = await upload<CheckParams>(req, CheckParamsSchema);
      res.json(runCheck(traceOf(csv), params));
      return;
    }
    const { trace, ...params } = req.body as CheckParams & { trace: TraceJson };
    res.json(runCheck(traceFromJson(trace), params));
  });
  return r;
}

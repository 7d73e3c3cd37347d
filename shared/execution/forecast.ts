import { fitVolumes } from "../kinetics/volumeFit.js";
import { predictConversion } from "../kinetics/prediction.js";
import type { Trace } from "../kinetics/trace.js";

export interface ForecastInput {
  trace: Trace;
  order: number;
  epsilonA: number;
  v0L: number;
  cA0: number;
  /** The model's k at the batch temperature: used until the trace can be fitted. */
  kModel: number;
  targetConversion: number;
}

export interface Forecast {
  /** Where k came from: the trace so far, or the model while the trace is too short. */
  basis: "trace" | "model";
  k: number;
  currentConversion: number;
  /** Seconds from the trace's start to the target, with the 95 % range from k's interval. */
  targetAtS: number | null;
  targetRangeS: [number, number] | null;
  /** Seconds still to go after the last reading. */
  remainingS: number | null;
  remainingUncertaintyS: number | null;
  message: string;
}

function timeToConversion(order: number, k: number, epsilonA: number, cA0: number, v0L: number, target: number): number | null {
  if (!(k > 0)) return null;
  if (order === 1) return -Math.log(1 - target) / k;
  const X = (t: number) => predictConversion({ order, k, epsilonA, V0: v0L, cA0 }, [t])[0];
  let hi = 1;
  for (let i = 0; i < 80 && X(hi) < target; i++) hi *= 2;
  if (X(hi) < target) return null;
  let lo = 0;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (X(mid) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

const minutes = (s: number) => (s >= 5400 ? `${(s / 3600).toFixed(1)} h` : `${Math.max(0, Math.round(s / 60))} min`);

/** When the batch will reach the target conversion, from the trace so far (or the model), in words too. */
export function forecastTarget(input: ForecastInput): Forecast {
  const n = input.trace.t.length;
  const lastT = n ? input.trace.t[n - 1] : 0;
  const currentConversion = n && input.epsilonA !== 0 ? (input.trace.V[n - 1] - input.v0L) / (input.epsilonA * input.v0L) : 0;
  let k = input.kModel;
  let kRange: [number, number] = [input.kModel, input.kModel];
  let basis: Forecast["basis"] = "model";
  if (n >= 8 && currentConversion > 0.05) {
    try {
      const fit = fitVolumes(input.trace, { order: input.order, V0: input.v0L, epsilonA: input.epsilonA, cA0: input.cA0 });
      if (fit.converged && fit.k > 0) {
        k = fit.k;
        kRange = [Math.max(fit.kCI95[0], k * 1e-3), fit.kCI95[1]];
        basis = "trace";
      }
    } catch {
      /* too little to fit yet: stay with the model */
    }
  }
  const at = timeToConversion(input.order, k, input.epsilonA, input.cA0, input.v0L, input.targetConversion);
  const early = timeToConversion(input.order, kRange[1], input.epsilonA, input.cA0, input.v0L, input.targetConversion);
  const late = timeToConversion(input.order, kRange[0], input.epsilonA, input.cA0, input.v0L, input.targetConversion);
  if (at === null) return { basis, k, currentConversion, targetAtS: null, targetRangeS: null, remainingS: null, remainingUncertaintyS: null, message: `Target conversion ${input.targetConversion} cannot be forecast from this trace.` };
  const range: [number, number] = [early ?? at, late ?? at];
  const remaining = at - lastT;
  const uncertainty = (range[1] - range[0]) / 2;
  const source = basis === "trace" ? "from the trace so far" : "from the model (the trace is too short to fit yet)";
  const message =
    currentConversion >= input.targetConversion
      ? `Target conversion ${input.targetConversion} reached (now ${currentConversion.toFixed(3)}).`
      : `Target conversion ${input.targetConversion} expected in ${minutes(remaining)}${basis === "trace" ? ` ± ${minutes(uncertainty)}` : ""}, ${source}.`;
  return { basis, k, currentConversion, targetAtS: at, targetRangeS: range, remainingS: remaining, remainingUncertaintyS: uncertainty, message };
}

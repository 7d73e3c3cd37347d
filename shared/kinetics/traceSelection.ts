import type { Trace } from "./trace.js";

export interface SelectedPoints {
  t: Float64Array;
  V: Float64Array;
  excluded: number;
  warnings: string[];
}

export interface SelectionRules {
  V0: number;
  epsilonA: number;
  /** Exclude points whose conversion read from volume exceeds this (default: exclude XA ≥ 1). */
  maxConversion?: number;
}

/**
 * The points a fit may use: finite, t ≥ 0, and conversion below full (or below the given cap).
 * Arrays are copied only when something is dropped (the copies may view longer buffers).
 */
export function selectFitPoints(trace: Trace, rules: SelectionRules): SelectedPoints {
  const { V0, epsilonA } = rules;
  const cap = rules.maxConversion;
  const n = Math.min(trace.t.length, trace.V.length);
  if (trace.t instanceof Float64Array && trace.V instanceof Float64Array && allClearlyUsable(trace.t, trace.V, n, rules)) {
    return { t: trace.t.subarray(0, n), V: trace.V.subarray(0, n), excluded: 0, warnings: [] };
  }
  // One pass straight into arrays sized for every point; the result views the part filled.
  const t = new Float64Array(n);
  const V = new Float64Array(n);
  const tIn = trace.t;
  const vIn = trace.V;
  const scale = epsilonA * V0;
  let kept = 0;
  let pastFull = 0;
  let pastCap = 0;
  let invalid = 0;
  for (let i = 0; i < n; i++) {
    const ti = tIn[i];
    const vi = vIn[i];
    if (!Number.isFinite(ti) || !Number.isFinite(vi) || ti < 0) {
      invalid++;
      continue;
    }
    const X = (vi - V0) / scale;
    if (!(X < 1)) {
      if (Number.isNaN(X)) invalid++;
      else pastFull++;
      continue;
    }
    if (cap !== undefined && X > cap) {
      pastCap++;
      continue;
    }
    t[kept] = ti;
    V[kept++] = vi;
  }
  const warnings: string[] = [];
  if (pastFull > 0) warnings.push(`${pastFull} point(s) at or past full conversion (XA ≥ 1) excluded.`);
  if (pastCap > 0) warnings.push(`conversion above ${cap} excluded (${pastCap} point(s)).`);
  if (invalid > 0) warnings.push(`${invalid} point(s) with a missing, non-finite or negative-time value excluded.`);
  if (kept === n && trace.t instanceof Float64Array && trace.V instanceof Float64Array) {
    return { t: trace.t.subarray(0, n), V: trace.V.subarray(0, n), excluded: 0, warnings };
  }
  return { t: t.subarray(0, kept), V: V.subarray(0, kept), excluded: n - kept, warnings };
}

/** Margin on the conversion limit that covers the rounding of the quick test below. */
const CLEAR_MARGIN = 1e-9;
/** Below this |εA| the rounding of the bound could exceed the margin; the exact rules then run. */
const MIN_QUICK_EPSILON = 1e-4;
/** Largest finite double: `x <= LARGEST` is false for NaN and +∞. */
const LARGEST = 1.7976931348623157e308;

/**
 * One quick read of the trace: true when every point passes the rules with room to spare, so the
 * per-point bookkeeping is not needed. A point near a limit sends the caller to the exact rules.
 */
function allClearlyUsable(t: Float64Array, V: Float64Array, n: number, rules: SelectionRules): boolean {
  const { V0, epsilonA } = rules;
  // XA < limit read as a bound on V: XA = (V − V0)/(εA·V0) rises with V when εA > 0.
  const bound = V0 + (Math.min(1, rules.maxConversion ?? 1) - CLEAR_MARGIN) * epsilonA * V0;
  if (!(Number.isFinite(bound) && Math.abs(epsilonA) >= MIN_QUICK_EPSILON)) return false;
  return epsilonA > 0 ? allWithin(t, V, n, -LARGEST, bound) : allWithin(t, V, n, bound, LARGEST);
}

/** True when every 0 ≤ t[i] < ∞ and lowV < V[i] < highV (false for any NaN). */
function allWithin(t: Float64Array, V: Float64Array, n: number, lowV: number, highV: number): boolean {
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return false;
  }
  return true;
}

/** Every `stride`-th point plus the last: a coarse copy for a quick first fit. */
export function thinPoints(t: Float64Array, V: Float64Array, target: number): { t: Float64Array; V: Float64Array } {
  const stride = Math.max(1, Math.floor(t.length / target));
  const count = Math.ceil(t.length / stride);
  const tt = new Float64Array(count);
  const vv = new Float64Array(count);
  for (let i = 0, j = 0; j < count; i += stride, j++) {
    tt[j] = t[i];
    vv[j] = V[i];
  }
  return { t: tt, V: vv };
}

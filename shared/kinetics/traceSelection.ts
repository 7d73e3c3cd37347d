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
 * Arrays are copied only when something is dropped.
 */
export function selectFitPoints(trace: Trace, rules: SelectionRules): SelectedPoints {
  const { V0, epsilonA } = rules;
  const cap = rules.maxConversion;
  const n = Math.min(trace.t.length, trace.V.length);
  const keep = new Uint8Array(n);
  let kept = 0;
  let pastFull = 0;
  let pastCap = 0;
  let invalid = 0;
  for (let i = 0; i < n; i++) {
    const t = trace.t[i];
    const V = trace.V[i];
    if (!Number.isFinite(t) || !Number.isFinite(V) || t < 0) {
      invalid++;
      continue;
    }
    const X = (V - V0) / (epsilonA * V0);
    if (!(X < 1)) {
      if (Number.isNaN(X)) invalid++;
      else pastFull++;
      continue;
    }
    if (cap !== undefined && X > cap) {
      pastCap++;
      continue;
    }
    keep[i] = 1;
    kept++;
  }
  const warnings: string[] = [];
  if (pastFull > 0) warnings.push(`${pastFull} point(s) at or past full conversion (XA ≥ 1) excluded.`);
  if (pastCap > 0) warnings.push(`conversion above ${cap} excluded (${pastCap} point(s)).`);
  if (invalid > 0) warnings.push(`${invalid} point(s) with a missing, non-finite or negative-time value excluded.`);
  if (kept === n && trace.t instanceof Float64Array && trace.V instanceof Float64Array) {
    return { t: trace.t.subarray(0, n), V: trace.V.subarray(0, n), excluded: 0, warnings };
  }
  const t = new Float64Array(kept);
  const V = new Float64Array(kept);
  for (let i = 0, j = 0; i < n; i++) {
    if (keep[i] === 1) {
      t[j] = trace.t[i];
      V[j++] = trace.V[i];
    }
  }
  return { t, V, excluded: n - kept, warnings };
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

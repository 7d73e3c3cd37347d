import type { Trace } from "./trace.js";
import type { SelectionBuffers } from "./selectionBuffers.js";

export interface SelectedPoints {
  t: Float64Array;
  V: Float64Array;
  excluded: number;
  warnings: string[];
  /** How many points from the first were kept one after another, before the first dropped one. */
  leadingRun: number;
}

export interface SelectionRules {
  V0: number;
  epsilonA: number;
  /** Exclude points whose conversion read from volume exceeds this (default: exclude XA ≥ 1). */
  maxConversion?: number;
  /**
   * Keep points read at or past full conversion (XA ≥ 1) instead of dropping them. The volume fit
   * does: near the plateau noise lifts some volumes past V0(1 + εA), and dropping only those (the
   * ones lifted, never the ones lowered) biases k low. The linearised forms need XA < 1.
   */
  keepPastFull?: boolean;
}

/** The rules of the nonlinear volume fit: every valid point, past full conversion included. */
export function volumeFitRules(V0: number, epsilonA: number): SelectionRules {
  return { V0, epsilonA, keepPastFull: true };
}

/**
 * The points a fit may use: finite, t ≥ 0, and conversion below full (or below the given cap).
 * Arrays are copied only when something is dropped (the copies may view longer buffers), into
 * `buffers` when given: then the result is valid only until their next use.
 */
export function selectFitPoints(trace: Trace, rules: SelectionRules, buffers?: SelectionBuffers): SelectedPoints {
  const { V0, epsilonA } = rules;
  const cap = rules.maxConversion;
  const n = Math.min(trace.t.length, trace.V.length);
  const typed = trace.t instanceof Float64Array && trace.V instanceof Float64Array ? { t: trace.t, V: trace.V } : undefined;
  // With every point kept, typed arrays serve as they are.
  const whole = typed && ((warnings: string[]): SelectedPoints => ({ t: typed.t.subarray(0, n), V: typed.V.subarray(0, n), excluded: 0, warnings, leadingRun: n }));
  const counts = new SelectionCounts();
  const clear = typed ? clearlyUsablePrefix(typed.t, typed.V, n, rules, counts) : 0;
  if (whole && clear === n) return whole(selectionWarnings(counts, cap));
  // Into arrays sized for every point, the result viewing the part filled: the points before the
  // first that needs a closer look in one block copy, the rest one by one.
  const { t, V } = buffers?.take(n) ?? { t: new Float64Array(n), V: new Float64Array(n) };
  if (typed) {
    t.set(typed.t.subarray(0, clear));
    V.set(typed.V.subarray(0, clear));
    counts.kept = clear;
    counts.kept = sortTypedPoints(typed.t, typed.V, clear, n, rules, t, V, counts);
  } else for (let i = 0; i < n; i++) sortPoint(trace.t[i], trace.V[i], rules, t, V, counts);
  const { kept } = counts;
  const leadingRun = counts.firstDropAt < 0 ? kept : counts.firstDropAt;
  const warnings = selectionWarnings(counts, cap);
  if (whole && kept === n) return whole(warnings);
  return { t: t.subarray(0, kept), V: V.subarray(0, kept), excluded: n - kept, warnings, leadingRun };
}

export function pastFullKeptWarning(count: number): string {
  return `${count} point(s) read at or past full conversion (XA ≥ 1), kept in the fit as noise about the plateau (volumes far past it point to a leak or a meter fault).`;
}

function selectionWarnings({ pastFull, pastFullKept, pastCap, invalid }: SelectionCounts, cap: number | undefined): string[] {
  const warnings: string[] = [];
  if (pastFull > 0) warnings.push(`${pastFull} point(s) at or past full conversion (XA ≥ 1) excluded.`);
  if (pastFullKept > 0) warnings.push(pastFullKeptWarning(pastFullKept));
  if (pastCap > 0) warnings.push(`conversion above ${cap} excluded (${pastCap} point(s)).`);
  if (invalid > 0) warnings.push(`${invalid} point(s) with a missing, non-finite or negative-time value excluded.`);
  return warnings;
}

/** Margin on the conversion limit that covers the rounding of the quick test below. */
const CLEAR_MARGIN = 1e-9;
/** Below this |εA| the rounding of the bound could exceed the margin; the exact rules then run. */
const MIN_QUICK_EPSILON = 1e-4;
/** Largest finite double: `x <= LARGEST` is false for NaN and +∞. */
const LARGEST = 1.7976931348623157e308;

/** Open limits on V. */
interface VolumeLimits {
  lowV: number;
  highV: number;
}

/**
 * Open limits on V within which a point's conversion lies between lowX and highX with room to
 * spare (±Infinity: no limit on that side), so comparisons alone decide it; undefined when no
 * such quick test is safe. A point outside them is left to the exact rules.
 */
function clearlyBetween(rules: SelectionRules, lowX: number, highX: number): VolumeLimits | undefined {
  const { V0, epsilonA } = rules;
  if (!(Math.abs(epsilonA) >= MIN_QUICK_EPSILON)) return undefined;
  // XA = (V − V0)/(εA·V0) read as V; an unlimited side stays finite so that ±∞ in V is never clear.
  const volumeAt = (X: number) => (Number.isFinite(X) ? V0 + X * epsilonA * V0 : X * epsilonA > 0 ? LARGEST : -LARGEST);
  const a = volumeAt(lowX + CLEAR_MARGIN);
  const b = volumeAt(highX - CLEAR_MARGIN);
  if (!(Number.isFinite(a) && Number.isFinite(b))) return undefined;
  return epsilonA > 0 ? { lowV: a, highV: b } : { lowV: b, highV: a };
}

/** The limits on V of points every rule keeps, with room to spare (0 ≤ t < ∞ checked besides). */
export function clearVolumeLimits(rules: SelectionRules): VolumeLimits | undefined {
  // Short of full conversion even when points past it are kept: those take the exact rule, which counts them.
  return clearlyBetween(rules, Number.NEGATIVE_INFINITY, Math.min(1, rules.maxConversion ?? 1));
}

/** How the points were sorted so far. */
class SelectionCounts {
  kept = 0;
  pastFull = 0;
  /** Points at or past full conversion that were kept (keepPastFull). */
  pastFullKept = 0;
  pastCap = 0;
  invalid = 0;
  /** Points kept before the first was dropped; −1 while none has been. */
  firstDropAt = -1;

  /** Notes a dropped point, `kept` points having been kept so far. */
  dropped(kept: number): void {
    if (this.firstDropAt < 0) this.firstDropAt = kept;
  }
}

/**
 * sortPoint for the points from…n−1 of typed arrays: points clearly inside the usable range, clearly
 * past full conversion or clearly past the cap are decided by comparisons alone; only those
 * near a limit (or invalid) take the exact rule.
 */
function sortTypedPoints(tIn: Float64Array, vIn: Float64Array, from: number, n: number, rules: SelectionRules, t: Float64Array, V: Float64Array, counts: SelectionCounts): number {
  const cap = rules.maxConversion;
  const keepPastFull = rules.keepPastFull === true;
  const capBelowFull = cap !== undefined && cap < 1;
  const unlimited = Number.POSITIVE_INFINITY;
  // Each range clearly inside one outcome of the exact rule: kept short of full conversion; kept
  // past it (keepPastFull, up to a cap); dropped past it; dropped above the cap.
  const keep = clearVolumeLimits(rules) ?? NONE;
  const keepPast = (keepPastFull && !capBelowFull ? clearlyBetween(rules, 1, cap ?? unlimited) : undefined) ?? NONE;
  const dropPast = (keepPastFull ? undefined : clearlyBetween(rules, 1, unlimited)) ?? NONE;
  const capped = (cap !== undefined && (capBelowFull || keepPastFull) ? clearlyBetween(rules, cap, keepPastFull ? unlimited : 1) : undefined) ?? NONE;
  // Plain doubles in locals (x + 0), so the loop does not re-read boxed numbers at every point.
  const keepLow = keep.lowV + 0, keepHigh = keep.highV + 0;
  const keepPastLow = keepPast.lowV + 0, keepPastHigh = keepPast.highV + 0;
  const dropPastLow = dropPast.lowV + 0, dropPastHigh = dropPast.highV + 0;
  const capLow = capped.lowV + 0, capHigh = capped.highV + 0;
  let kept = counts.kept;
  // The counts go to `counts` where they change and the kept count is returned: nothing after
  // the loop may need type feedback (see LoopSums in passBasics.ts).
  for (let i = from; i < n; i++) {
    const ti = tIn[i];
    const vi = vIn[i];
    if (ti >= 0 && ti <= LARGEST) {
      if (vi > keepLow && vi < keepHigh) {
        t[kept] = ti;
        V[kept++] = vi;
        continue;
      }
      if (vi > keepPastLow && vi < keepPastHigh) {
        counts.pastFullKept++;
        t[kept] = ti;
        V[kept++] = vi;
        continue;
      }
      if (vi > dropPastLow && vi < dropPastHigh) {
        counts.pastFull++;
        counts.dropped(kept);
        continue;
      }
      if (vi > capLow && vi < capHigh) {
        counts.pastCap++;
        counts.dropped(kept);
        continue;
      }
    }
    counts.kept = kept;
    sortPoint(ti, vi, rules, t, V, counts);
    kept = counts.kept;
  }
  return kept;
}

/** The exact rule for one point: kept (appended to t and V), or counted as why it was not. */
function sortPoint(ti: number, vi: number, rules: SelectionRules, t: Float64Array, V: Float64Array, counts: SelectionCounts): void {
  if (!Number.isFinite(ti) || !Number.isFinite(vi) || ti < 0) {
    counts.dropped(counts.kept);
    counts.invalid++;
    return;
  }
  const X = (vi - rules.V0) / (rules.epsilonA * rules.V0);
  if (Number.isNaN(X) || (X >= 1 && !rules.keepPastFull)) {
    counts.dropped(counts.kept);
    if (Number.isNaN(X)) counts.invalid++;
    else counts.pastFull++;
    return;
  }
  if (rules.maxConversion !== undefined && X > rules.maxConversion) {
    counts.dropped(counts.kept);
    counts.pastCap++;
    return;
  }
  if (X >= 1) counts.pastFullKept++;
  t[counts.kept] = ti;
  V[counts.kept++] = vi;
}

/** Limits no value meets, for when a quick test is not safe. */
const NONE: VolumeLimits = { lowV: Number.NaN, highV: Number.NaN };

/**
 * One quick read of the trace: how many points from the first are clearly kept (n when all are).
 * Under keepPastFull with no cap every valid point is kept, and those at or past full conversion
 * are counted into `counts` by the exact rule.
 */
function clearlyUsablePrefix(t: Float64Array, V: Float64Array, n: number, rules: SelectionRules, counts: SelectionCounts): number {
  if (rules.keepPastFull && rules.maxConversion === undefined) return validPrefixCountingPastFull(t, V, n, rules, counts);
  const limits = clearVolumeLimits(rules);
  return limits === undefined ? 0 : prefixWithin(t, V, n, limits.lowV, limits.highV);
}

/**
 * The index of the first point with an invalid time or volume, or n; the valid points before it
 * that read XA ≥ 1 are counted (countPastFull).
 */
function validPrefixCountingPastFull(t: Float64Array, V: Float64Array, n: number, rules: SelectionRules, counts: SelectionCounts): number {
  let i = 0;
  while (i < n) {
    const ti = t[i];
    const v = V[i];
    if (!(ti >= 0 && ti <= LARGEST && v - v === 0)) break;
    i++;
  }
  counts.pastFullKept += countPastFull(V.subarray(0, i), rules);
  return i;
}

/**
 * How many of these finite volumes read XA ≥ 1, by the exact rule's own division, counted without
 * a branch (noise about the plateau makes that test a coin toss at every point). A division per
 * point took about 1.4 plain passes here; comparisons against margins with the division near them
 * took 2.5.
 */
export function countPastFull(V: Float64Array, rules: SelectionRules): number {
  const V0 = rules.V0 + 0;
  const perX = rules.epsilonA * rules.V0;
  const n = V.length;
  let pastFull = 0;
  for (let i = 0; i < n; i++) pastFull += +((V[i] - V0) / perX >= 1);
  return pastFull;
}

/**
 * Open limits on V that admit exactly the finite volumes reading XA < 1 under the exact rule
 * ((V − V0)/(εA·V0) ≥ 1 is past full conversion): that rule is monotonic in V, so one edge splits
 * the line, found by bracketing V0(1 + εA) and halving down to adjacent doubles. A checked pass
 * with this guard proves that no point is past full conversion without counting them. Undefined
 * when no edge is bracketed (a non-finite εA or V0).
 */
export function shortOfFullGuard(rules: SelectionRules): VolumeLimits | undefined {
  const V0 = rules.V0;
  const perX = rules.epsilonA * rules.V0;
  // Past full lies above the edge when εA·V0 > 0 (+0 included), below it otherwise; `higher`
  // is false below the edge and true above it either way.
  const upward = 1 / perX > 0;
  const higher = (v: number) => (v - V0) / perX >= 1 === upward;
  const guess = V0 + perX;
  if (!Number.isFinite(guess)) return undefined;
  let width = Math.abs(guess) * 1e-15 + Number.MIN_VALUE;
  let below = guess - width;
  let above = guess + width;
  for (let doublings = 0; (higher(below) || !higher(above)) && doublings < 1100; doublings++) {
    width *= 2;
    below = guess - width;
    above = guess + width;
  }
  if (higher(below) || !higher(above) || !Number.isFinite(below) || !Number.isFinite(above)) return undefined;
  // Halve until `below` and `above` are adjacent doubles: the last one short of the edge and the first past it.
  for (;;) {
    const middle = below + (above - below) / 2;
    if (middle === below || middle === above) break;
    if (higher(middle)) above = middle;
    else below = middle;
  }
  // Upward, `above` is the first volume past full; downward, `below` is the last one.
  return upward ? { lowV: Number.NEGATIVE_INFINITY, highV: above } : { lowV: below, highV: Number.POSITIVE_INFINITY };
}

/** The index of the first point without 0 ≤ t[i] < ∞ and lowV < V[i] < highV (NaN fails), or n. */
function prefixWithin(t: Float64Array, V: Float64Array, n: number, lowV: number, highV: number): number {
  for (let i = 0; i < n; i++) {
    const ti = t[i];
    const v = V[i];
    if (!(ti >= 0 && ti <= LARGEST && v > lowV && v < highV)) return i;
  }
  return n;
}

/** Every `stride`-th point from the first (about `target` of them): a coarse copy for a quick first fit. */
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

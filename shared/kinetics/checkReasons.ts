/** Plain-sentence reasons for the kinetics check, with the numbers and units. */

export type CheckReasonCode =
  | "k-outside-tolerance"
  | "residuals-too-large"
  | "temperature-outside-band"
  | "pressure-outside-band"
  | "too-few-points"
  | "conversion-too-low"
  | "volume-past-full-conversion"
  | "volume-against-epsilon"
  | "no-volume-change-expected"
  | "fit-failed";

export interface CheckReason {
  code: CheckReasonCode;
  message: string;
}

/** Number shown to four significant figures, without trailing zeros in exponent form. */
export function show(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  return Number(value.toPrecision(digits)).toString();
}

export interface BandExcursion {
  count: number;
  of: number;
  worstValue: number;
  worstTime: number;
}

/** Points of a series outside centre ± halfWidth, with the furthest one. */
export function findExcursions(
  t: ArrayLike<number>,
  values: ArrayLike<number>,
  centre: number,
  halfWidth: number,
): BandExcursion | undefined {
  // Usually every point is inside: one quick read proves it, and only a series with an
  // excursion is read again to count and place them.
  if (allInBand(values, centre, halfWidth)) return undefined;
  let count = 0;
  let worst = 0;
  let worstValue = Number.NaN;
  let worstTime = Number.NaN;
  for (let i = 0; i < values.length; i++) {
    const off = Math.abs(values[i] - centre);
    if (!(off <= halfWidth)) {
      count++;
      if (off > worst || Number.isNaN(worstValue)) {
        worst = off;
        worstValue = values[i];
        worstTime = t[i];
      }
    }
  }
  return { count, of: values.length, worstValue, worstTime };
}

/** True when |value − centre| ≤ halfWidth for every value (false at a NaN). */
function allInBand(values: ArrayLike<number>, centre: number, halfWidth: number): boolean {
  const n = values.length;
  for (let i = 0; i < n; i++) {
    const off = values[i] - centre;
    if (!(off <= halfWidth && off >= -halfWidth)) return false;
  }
  return true;
}

export interface VolumeFaults {
  pastFull: number;
  against: number;
  extremeV: number;
  againstV: number;
}

/** The largest and smallest volume, ignoring NaN (−∞ and +∞ when there is none). */
export interface VolumeRange {
  largest: number;
  smallest: number;
}

/** One read of the volumes for their range, which both volume rules below start from. */
export function volumeRange(V: ArrayLike<number>): VolumeRange {
  const n = V.length;
  let largest = Number.NEGATIVE_INFINITY;
  let smallest = Number.POSITIVE_INFINITY;
  const range: VolumeRange = { largest, smallest };
  // Stored as they change (both at the first finite volume): nothing after the loop may need
  // type feedback (see LoopSums in passBasics.ts).
  for (let i = 0; i < n; i++) {
    const v = V[i];
    if (v > largest) range.largest = largest = v;
    if (v < smallest) range.smallest = smallest = v;
  }
  return range;
}

/**
 * Counts points moving the wrong way or beyond full conversion, allowing `allowance` L of noise.
 * Both rules are monotonic in V, so the range shows whether any point breaks them; only then are
 * the volumes read again to count and place the faults.
 */
export function volumeDirectionFaults(V: ArrayLike<number>, V0: number, epsilonA: number, allowance: number, range = volumeRange(V)): VolumeFaults {
  const sign = Math.sign(epsilonA);
  const full = V0 * (1 + epsilonA);
  const faults: VolumeFaults = { pastFull: 0, against: 0, extremeV: Number.NaN, againstV: Number.NaN };
  const furthest = sign > 0 ? range.largest : range.smallest;
  const backmost = sign > 0 ? range.smallest : range.largest;
  if (!(sign * (furthest - full) > allowance || sign * (backmost - V0) < -allowance)) return faults;
  const n = V.length;
  for (let i = 0; i < n; i++) {
    const v = V[i];
    if (sign * (v - full) > allowance) {
      faults.pastFull++;
      if (Number.isNaN(faults.extremeV) || sign * (v - faults.extremeV) > 0) faults.extremeV = v;
    }
    if (sign * (v - V0) < -allowance) {
      faults.against++;
      if (Number.isNaN(faults.againstV) || sign * (v - faults.againstV) < 0) faults.againstV = v;
    }
  }
  return faults;
}

/**
 * The highest conversion (V − V0)/(εA·V0) over the volumes, ignoring NaN; −∞ when there is none.
 * The conversion rises with V for εA > 0 and falls for εA < 0, so it is that of the largest or
 * the smallest volume, converted once.
 */
export function highestConversion(V: ArrayLike<number>, V0: number, epsilonA: number, range = volumeRange(V)): number {
  return (epsilonA > 0 ? range.largest - V0 : range.smallest - V0) / (epsilonA * V0);
}

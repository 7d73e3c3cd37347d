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
  let count = 0;
  let worst = 0;
  let worstValue = Number.NaN;
  let worstTime = Number.NaN;
  for (let i = 0; i < values.length; i++) {
    const off = Math.abs(values[i] - centre);
    if (off > halfWidth || Number.isNaN(off)) {
      count++;
      if (off > worst || Number.isNaN(worstValue)) {
        worst = off;
        worstValue = values[i];
        worstTime = t[i];
      }
    }
  }
  return count === 0 ? undefined : { count, of: values.length, worstValue, worstTime };
}

/** Counts points moving the wrong way or beyond full conversion, allowing `allowance` L of noise. */
export function volumeDirectionFaults(
  V: ArrayLike<number>,
  V0: number,
  epsilonA: number,
  allowance: number,
): { pastFull: number; against: number; extremeV: number; againstV: number } {
  const sign = Math.sign(epsilonA);
  const full = V0 * (1 + epsilonA);
  let pastFull = 0;
  let against = 0;
  let extremeV = Number.NaN;
  let againstV = Number.NaN;
  for (let i = 0; i < V.length; i++) {
    const v = V[i];
    if (sign * (v - full) > allowance) {
      pastFull++;
      if (Number.isNaN(extremeV) || sign * (v - extremeV) > 0) extremeV = v;
    }
    if (sign * (v - V0) < -allowance) {
      against++;
      if (Number.isNaN(againstV) || sign * (v - againstV) < 0) againstV = v;
    }
  }
  return { pastFull, against, extremeV, againstV };
}

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findExcursions, highestConversion, volumeDirectionFaults, volumeRange } from "../../../shared/kinetics/checkReasons";

// The scans read a series quickly first (the volume rules only its range) and count only when
// something is off; these properties compare them with the rules applied point by point, NaN and
// infinities included.
const reading = fc.oneof(
  { weight: 10, arbitrary: fc.double({ min: 1.5, max: 4, noNaN: true }) },
  { weight: 2, arbitrary: fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0, 4.3, 5, 8, 10) },
);
const series = fc.array(reading, { maxLength: 60 });

describe("check reasons read from the series", () => {
  it("findExcursions counts every point outside the band and keeps the furthest (first of equals)", () => {
    fc.assert(
      fc.property(series, fc.double({ min: 0, max: 1, noNaN: true }), (values, halfWidth) => {
        const t = values.map((_, i) => 10 * i);
        const centre = 2.5;
        let count = 0, worst = 0, worstValue = Number.NaN, worstTime = Number.NaN;
        values.forEach((v, i) => {
          const off = Math.abs(v - centre);
          if (off > halfWidth || Number.isNaN(off)) {
            count++;
            if (off > worst || Number.isNaN(worstValue)) [worst, worstValue, worstTime] = [off, v, t[i]];
          }
        });
        const found = findExcursions(Float64Array.from(t), Float64Array.from(values), centre, halfWidth);
        if (count === 0) expect(found).toBeUndefined();
        else expect(found).toEqual({ count, of: values.length, worstValue, worstTime });
      }),
    );
  });

  it("volumeDirectionFaults and highestConversion agree with the rules point by point, for either sign of εA", () => {
    fc.assert(
      fc.property(series, fc.constantFrom(0.7, -0.4, 2), fc.constantFrom(0, 0.01, 0.5), (values, epsilonA, allowance) => {
        const V0 = 2.5, sign = Math.sign(epsilonA), full = V0 * (1 + epsilonA);
        const expected = { pastFull: 0, against: 0, extremeV: Number.NaN, againstV: Number.NaN };
        let highest = Number.NEGATIVE_INFINITY;
        for (const v of values) {
          if (sign * (v - full) > allowance) {
            expected.pastFull++;
            if (Number.isNaN(expected.extremeV) || sign * (v - expected.extremeV) > 0) expected.extremeV = v;
          }
          if (sign * (v - V0) < -allowance) {
            expected.against++;
            if (Number.isNaN(expected.againstV) || sign * (v - expected.againstV) < 0) expected.againstV = v;
          }
          const X = (v - V0) / (epsilonA * V0);
          if (X > highest) highest = X;
        }
        const V = Float64Array.from(values);
        expect(volumeDirectionFaults(V, V0, epsilonA, allowance)).toEqual(expected);
        expect(highestConversion(V, V0, epsilonA)).toBe(highest);
        const range = volumeRange(V);
        expect(volumeDirectionFaults(V, V0, epsilonA, allowance, range)).toEqual(expected);
        expect(highestConversion(V, V0, epsilonA, range)).toBe(highest);
      }),
      { numRuns: 1000 },
    );
  });
});

import { describe, expect, it } from "vitest";
import {
  KINETICS_LIBRARY_VERSION,
  concentrationFromConversion,
  conversionFromVolume,
  initialConcentrationGas,
  volumeFromConversion,
} from "../../../shared/kinetics/index";

describe("conversion and concentration", () => {
  it("cA0 of an ideal gas at 273.15 K and 101 325 Pa is 1/22.413 969 54 mol/L (CODATA 2018 molar volume; from memory)", () => {
    expect(initialConcentrationGas(1, 101325, 273.15)).toBeCloseTo(1 / 22.41396954, 10);
  });

  it("XA = (V − V0)/(εA·V0) inverts V = V0(1 + εA·XA)", () => {
    expect(conversionFromVolume(volumeFromConversion(0.42, 2, 0.7), 2, 0.7)).toBeCloseTo(0.42, 14);
  });

  it("CA = CA0(1 − XA)/(1 + εA·XA) (common practice)", () => {
    expect(concentrationFromConversion(0.5, 0.0322, 0.7)).toBeCloseTo((0.0322 * 0.5) / 1.35, 15);
  });

  it("εA = 0 gives no conversion from volume rather than a division by zero", () => {
    expect(conversionFromVolume(2, 2, 0)).toBeNaN();
  });

  it("exports a library version", () => {
    expect(KINETICS_LIBRARY_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });
});

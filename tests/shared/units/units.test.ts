import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  UNITS_BY_QUANTITY,
  convertUnit,
  fromSI,
  parseUnit,
  quantityOf,
  toSI,
  travelToVolume,
  type Unit,
} from "../../../shared/units/index";

describe("known conversions", () => {
  it("bar is exactly 100 000 Pa (NIST SP 811, Appendix B.8: 1 bar = 1.0E+05 Pa exactly; from memory)", () => {
    expect(toSI(1, "bar(a)")).toBe(100000);
  });

  it("psi is 6894.757293168 Pa (NIST SP 811, Appendix B.8: pound-force per square inch = 6.894 757 E+03 Pa; exact from lb = 0.453 592 37 kg, standard gravity 9.806 65 m/s² and in = 0.0254 m; from memory)", () => {
    expect(toSI(1, "psi(a)")).toBeCloseTo(6894.757293168, 9);
    expect(toSI(1, "psi(a)")).toBeCloseTo((0.45359237 * 9.80665) / (0.0254 * 0.0254), 9);
  });

  it("gauge readings add the standard atmosphere 101 325 Pa (NIST SP 811, B.8: standard atmosphere = 1.013 25 E+05 Pa exactly; from memory)", () => {
    expect(toSI(0, "bar(g)")).toBe(101325);
    expect(toSI(1, "bar(g)")).toBe(201325);
    expect(toSI(14.7, "psi(g)")).toBeCloseTo(14.7 * 6894.757293168 + 101325, 6);
  });

  it("0 °C is 273.15 K (SI Brochure, 9th edition, 2.3.1; from memory)", () => {
    expect(toSI(0, "°C")).toBe(273.15);
    expect(toSI(250, "°C")).toBeCloseTo(523.15, 12);
    expect(fromSI(373.15, "°C")).toBeCloseTo(100, 12);
  });

  it("time and volume (SI Brochure, 9th edition, table 8: min = 60 s, h = 3600 s, L = 1 dm³; from memory)", () => {
    expect(toSI(1, "h")).toBe(3600);
    expect(toSI(2.5, "min")).toBe(150);
    expect(toSI(1, "m³")).toBe(1000);
    expect(toSI(250, "mL")).toBeCloseTo(0.25, 15);
  });

  it("piston travel times bore area gives volume in L", () => {
    // 100 mm of travel in a 0.01 m² bore sweeps 0.001 m³ = 1 L.
    expect(travelToVolume(100, "mm", 0.01)).toBeCloseTo(1, 14);
    expect(travelToVolume(10, "cm", 100, "cm²")).toBeCloseTo(1, 14);
  });

  it("refuses to convert across quantities", () => {
    expect(() => convertUnit(1, "bar(a)", "K")).toThrow(/Cannot convert/);
  });
});

describe("round trips", () => {
  const allUnits = Object.values(UNITS_BY_QUANTITY).flat() as Unit[];
  it("fromSI(toSI(x)) returns x for every unit", () => {
    fc.assert(
      fc.property(fc.constantFrom(...allUnits), fc.double({ min: -1e6, max: 1e6, noNaN: true }), (unit, value) => {
        const back = fromSI(toSI(value, unit), unit);
        expect(Math.abs(back - value)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(value)) + 1e-9);
      }),
    );
  });

  it("every listed unit belongs to its quantity", () => {
    for (const [quantity, units] of Object.entries(UNITS_BY_QUANTITY)) {
      for (const unit of units) expect(quantityOf(unit)).toBe(quantity);
    }
  });
});

describe("parseUnit", () => {
  it("reads loose spellings", () => {
    expect(parseUnit("min")).toBe("min");
    expect(parseUnit(" ML ")).toBe("mL");
    expect(parseUnit("m^3")).toBe("m³");
    expect(parseUnit("degC")).toBe("°C");
    expect(parseUnit("°C")).toBe("°C");
    expect(parseUnit("bar(a)")).toBe("bar(a)");
    expect(parseUnit("bar g")).toBe("bar(g)");
    expect(parseUnit("psig")).toBe("psi(g)");
    expect(parseUnit("kPa")).toBe("kPa");
  });

  it("refuses pressure units that do not say absolute or gauge, and unknown units", () => {
    expect(parseUnit("bar")).toBeUndefined();
    expect(parseUnit("psi")).toBeUndefined();
    expect(parseUnit("furlong")).toBeUndefined();
  });

  it("refuses mPa (the millipascal in SI case) rather than reading it as MPa", () => {
    // SI Brochure, 9th edition, table 7: m is milli, M is mega (from memory).
    expect(parseUnit("mPa")).toBeUndefined();
    expect(parseUnit("MPa")).toBe("MPa");
    expect(parseUnit("MPA")).toBe("MPa");
    expect(parseUnit("mpa")).toBe("MPa");
  });
});

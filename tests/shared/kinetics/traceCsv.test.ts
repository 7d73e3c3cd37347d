import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createTraceCsvParser, parseTraceCsv, type TraceCsvResult } from "../../../shared/kinetics/index";

function errorsOf(result: TraceCsvResult) {
  if (result.ok) throw new Error("expected the parse to fail");
  return result.errors;
}

describe("parseTraceCsv", () => {
  it("reads a header with units in () and converts to s, L, K, Pa", () => {
    const text = "time (min),volume (mL),temperature (°C),pressure (bar(a))\n0,2000,250,2\n1,2010,250.2,2.01\n";
    const result = parseTraceCsv(text);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(Array.from(result.trace.t)).toEqual([0, 60]);
    expect(result.trace.V[1]).toBeCloseTo(2.01, 14);
    expect(result.trace.T?.[0]).toBeCloseTo(523.15, 12);
    expect(result.trace.P?.[1]).toBeCloseTo(201000, 9);
  });

  it("reads piston travel in [] with a bore area, CRLF line ends and gauge pressure", () => {
    const text = "t [s], travel [mm], T [K], P [bar(g)]\r\n0,10,523.15,1\r\n5,12.5,523.2,1\r\n";
    const result = parseTraceCsv(text, { boreArea: 0.02, volumeAtZeroTravel: 0.5 });
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.trace.V[0]).toBeCloseTo(0.5 + 0.01 * 0.02 * 1000, 14);
    expect(result.trace.V[1]).toBeCloseTo(0.5 + 0.0125 * 0.02 * 1000, 14);
    expect(result.trace.P?.[0]).toBe(201325);
  });

  it("accepts semicolons, quoted headings, blank lines and a byte-order mark", () => {
    const text = '\uFEFF"Time (s)";"V (L)"\n\n0;1.0\n1;1.1\n';
    const result = parseTraceCsv(text);
    expect(result.ok).toBe(true);
  });

  it("names the line and the problem", () => {
    const text = ["time (s),volume (L)", "0,1", "1,abc", "1,1.2", "0.5,1.3", "2,-1", "3,"].join("\n");
    const errors = errorsOf(parseTraceCsv(text));
    expect(errors.map((e) => [e.line, e.code])).toEqual([
      [3, "not-a-number"],
      [4, "duplicate-time"],
      [5, "time-not-increasing"],
      [6, "negative-volume"],
      [7, "not-a-number"],
    ]);
    expect(errors[0].message).toMatch(/^Line 3: .*"abc" is not a number/);
  });

  it("points a header with no data rows at the line below the header, trailing blank lines aside", () => {
    for (const text of ["t (s),V (L)", "t (s),V (L)\n", "t (s),V (L)\n\n\n"]) {
      expect(errorsOf(parseTraceCsv(text)).map((e) => [e.line, e.code])).toEqual([[2, "no-data"]]);
    }
  });

  it("takes plain decimal numbers only: hexadecimal or binary text is not a number", () => {
    const text = ["time (s),volume (L)", "0,40", "1,0x28", "2,1e1", "3,.5", "4,+41.", "5,0b101"].join("\n");
    const errors = errorsOf(parseTraceCsv(text));
    expect(errors.map((e) => [e.line, e.code])).toEqual([
      [3, "not-a-number"],
      [7, "not-a-number"],
    ]);
  });

  it("reports missing columns, unknown units and travel without a bore area on line 1", () => {
    expect(errorsOf(parseTraceCsv("volume (L)\n1\n")).map((e) => e.code)).toEqual(["missing-column"]);
    expect(errorsOf(parseTraceCsv("time (fortnights),volume (L)\n0,1\n"))[0]).toMatchObject({ line: 1, code: "unknown-unit" });
    expect(errorsOf(parseTraceCsv("time (s),pressure (bar)\n0,1\n")).map((e) => e.code)).toEqual(["unknown-unit", "missing-column"]);
    expect(errorsOf(parseTraceCsv("time (s),x (mm)\n0,1\n"))[0]).toMatchObject({ line: 1, code: "missing-bore-area" });
    expect(errorsOf(parseTraceCsv("")).map((e) => e.code)).toEqual(["no-data"]);
  });

  it("lists at most 20 problems and counts them all", () => {
    const rows = Array.from({ length: 50 }, (_, i) => `${i},bad`);
    const result = parseTraceCsv(["time (s),volume (L)", ...rows].join("\n"));
    if (result.ok) throw new Error("expected failure");
    expect(result.errors).toHaveLength(20);
    expect(result.totalErrors).toBe(50);
    expect(result.errors[19].line).toBe(21);
  });
});

describe("createTraceCsvParser", () => {
  it("gives the same trace whatever the chunk boundaries", () => {
    const lines = ["time (s),volume (L)"];
    for (let i = 0; i < 3000; i++) lines.push(`${i * 0.5},${(1 + i * 1e-4).toFixed(6)}`);
    const text = lines.join("\n");
    const whole = parseTraceCsv(text);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: text.length - 1 }), { maxLength: 12 }), (cuts) => {
        const parser = createTraceCsvParser();
        let start = 0;
        for (const cut of [...new Set(cuts)].sort((a, b) => a - b)) {
          parser.push(text.slice(start, cut));
          start = cut;
        }
        parser.push(text.slice(start));
        const result = parser.finish();
        if (!result.ok || !whole.ok) throw new Error("parse failed");
        expect(result.rows).toBe(3000);
        expect(result.trace.V).toEqual(whole.trace.V);
      }),
      { numRuns: 40 },
    );
  });

  it("imports a million rows into Float64Arrays", () => {
    const parser = createTraceCsvParser();
    parser.push("time (s),volume (L)\n");
    const rowsPerChunk = 50_000;
    for (let c = 0; c < 20; c++) {
      let chunk = "";
      for (let i = c * rowsPerChunk; i < (c + 1) * rowsPerChunk; i++) chunk += `${i},${1 + i * 1e-7}\n`;
      parser.push(chunk);
    }
    const result = parser.finish();
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.rows).toBe(1_000_000);
    expect(result.trace.t).toBeInstanceOf(Float64Array);
    expect(result.trace.t[999_999]).toBe(999_999);
  });
});

describe("malformed input", () => {
  it("never throws, only returns errors (property)", () => {
    const cell = fc.oneof(fc.string({ maxLength: 8 }), fc.double().map(String), fc.constantFrom('"', '""', "\r", ",", "NaN", "-1", ""));
    const row = fc.array(cell, { maxLength: 6 }).map((cells) => cells.join(fc.sample(fc.constantFrom(",", ";", "\t"), 1)[0]));
    const header = fc.constantFrom("time (s),volume (L)", "t [min];V [mL]", "time,volume", "x (mm),t (h)", "", "T (K),P (psi(g))");
    fc.assert(
      fc.property(header, fc.array(row, { maxLength: 30 }), fc.integer({ min: 1, max: 40 }), (head, rows, chunkSize) => {
        const text = [head, ...rows].join("\n");
        const parser = createTraceCsvParser({ boreArea: 0.01 });
        for (let i = 0; i < text.length; i += chunkSize) parser.push(text.slice(i, i + chunkSize));
        const result = parser.finish();
        expect(typeof result.ok).toBe("boolean");
        if (!result.ok) {
          expect(result.errors.length).toBeGreaterThan(0);
          expect(result.errors.length).toBeLessThanOrEqual(20);
          for (const e of result.errors) expect(e.line).toBeGreaterThanOrEqual(1);
        }
        expect(() => parseTraceCsv(text)).not.toThrow();
      }),
      { numRuns: 300 },
    );
  });

  it("does not throw on input that is not text", () => {
    const result = parseTraceCsv(42 as unknown as string);
    expect(result.ok).toBe(false);
  });
});

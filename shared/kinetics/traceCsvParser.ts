import Papa from "papaparse";
import { toSI, travelToVolume, type LengthUnit } from "../units/index.js";
import { readHeader, type ColumnSpec, type TraceColumn } from "./csvHeader.js";
import { GrowableFloat64 } from "./growableFloat64.js";
import { TraceProblemList, type TraceCsvProblem } from "./traceProblemList.js";

/** A number as instruments write it: decimal with an optional exponent (Number() would also take "0x28" or "0b1"). */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export type { TraceCsvProblem, TraceCsvProblemCode } from "./traceProblemList.js";

export interface TraceCsvOptions {
  /** Bore area of the piston, m²; needed when the file gives travel instead of volume. */
  boreArea?: number;
  /** Gas volume at zero travel, L (dead volume below the piston). Default 0. */
  volumeAtZeroTravel?: number;
}

export interface ParsedTrace {
  t: Float64Array;
  V: Float64Array;
  T?: Float64Array;
  P?: Float64Array;
}

export type TraceCsvResult =
  | { ok: true; trace: ParsedTrace; rows: number; columns: ColumnSpec[] }
  | { ok: false; errors: TraceCsvProblem[]; totalErrors: number };

export interface TraceCsvParser {
  /** Feeds the next piece of the file; pieces may split lines anywhere. */
  push(chunk: string): void;
  /** Ends the input and returns the trace or every problem found (never throws). */
  finish(): TraceCsvResult;
}

/** Text is handed to papaparse in blocks of whole lines of about this size. */
const BLOCK_CHARS = 1 << 20;

/** Creates a parser that accepts a trace CSV in string chunks. */
export function createTraceCsvParser(options: TraceCsvOptions = {}): TraceCsvParser {
  const rows = new TraceRowReader(options);
  let pending = "";
  let inQuotes = false;
  /** Index in `pending` of the last newline known to end a record, or -1. */
  let boundary = -1;
  let finished: TraceCsvResult | undefined;
  let atStart = true;

  const guarded = (work: () => void) => {
    try {
      work();
    } catch (error) {
      rows.problems.add(rows.lineNumber, "unreadable", `The file could not be read: ${String(error)}.`);
    }
  };

  return {
    push(chunk: string) {
      if (finished !== undefined) return;
      guarded(() => {
        if (typeof chunk !== "string") throw new TypeError("chunk is not text");
        if (atStart && chunk.length > 0) {
          atStart = false;
          if (chunk.charCodeAt(0) === 0xfeff) chunk = chunk.slice(1);
        }
        const start = pending.length;
        pending += chunk;
        if (!inQuotes && chunk.indexOf('"') === -1) {
          const last = chunk.lastIndexOf("\n");
          if (last >= 0) boundary = start + last;
        } else {
          for (let i = start; i < pending.length; i++) {
            const code = pending.charCodeAt(i);
            if (code === 34) inQuotes = !inQuotes;
            else if (code === 10 && !inQuotes) boundary = i;
          }
        }
        if (boundary + 1 >= BLOCK_CHARS / 4) {
          rows.readBlock(pending.slice(0, boundary));
          pending = pending.slice(boundary + 1);
          boundary = -1;
        }
      });
    },
    finish() {
      if (finished !== undefined) return finished;
      guarded(() => {
        if (pending.length > 0) rows.readBlock(pending);
        pending = "";
      });
      finished = rows.result();
      return finished;
    },
  };
}

/** Parses a whole trace CSV held in one string (never throws). */
export function parseTraceCsv(text: string, options: TraceCsvOptions = {}): TraceCsvResult {
  const parser = createTraceCsvParser(options);
  if (typeof text !== "string") {
    parser.push(text as unknown as string);
    return parser.finish();
  }
  for (let start = 0; start < text.length; start += BLOCK_CHARS) {
    parser.push(text.slice(start, start + BLOCK_CHARS));
  }
  return parser.finish();
}

/** Turns parsed rows into growable columns, checking each value as it arrives. */
class TraceRowReader {
  readonly problems = new TraceProblemList();
  lineNumber = 0;
  /** The header row's line, so "no data rows" points just below it (trailing blank lines aside). */
  private headerLine = 0;
  private delimiter: string | undefined;
  private columns: ColumnSpec[] | undefined;
  private readonly t = new GrowableFloat64();
  private readonly V = new GrowableFloat64();
  private readonly T = new GrowableFloat64();
  private readonly P = new GrowableFloat64();
  private lastTime = Number.NEGATIVE_INFINITY;
  private dataRows = 0;
  private volumeFrom: ((row: string[]) => number) | undefined;

  constructor(private readonly options: TraceCsvOptions) {}

  readBlock(text: string): void {
    this.delimiter ??= guessDelimiter(text);
    const parsed = Papa.parse<string[]>(text, {
      delimiter: this.delimiter,
      newline: "\n",
      skipEmptyLines: false,
      header: false,
    });
    for (const row of parsed.data) {
      this.lineNumber++;
      if (row.length === 0 || (row.length === 1 && row[0].trim() === "")) continue;
      if (this.columns === undefined) this.readHeaderRow(row);
      else this.readDataRow(row);
    }
  }

  private readHeaderRow(row: string[]): void {
    this.headerLine = this.lineNumber;
    const { columns, problems } = readHeader(row);
    for (const p of problems) this.problems.add(this.lineNumber, p.code, p.message);
    this.columns = columns;
    const volume = columns.find((c) => c.column === "volume");
    const travel = columns.find((c) => c.column === "travel");
    if (volume !== undefined) {
      this.volumeFrom = (r) => toSI(this.numberAt(r, volume), volume.unit);
    } else if (travel !== undefined) {
      const area = this.options.boreArea;
      if (area === undefined || !Number.isFinite(area) || area <= 0) {
        this.problems.add(this.lineNumber, "missing-bore-area", `Column "${travel.heading}" gives piston travel; a positive bore area (m²) is needed to turn it into volume.`);
        return;
      }
      const dead = this.options.volumeAtZeroTravel ?? 0;
      this.volumeFrom = (r) => dead + travelToVolume(this.numberAt(r, travel), travel.unit as LengthUnit, area);
    }
  }

  private readDataRow(row: string[]): void {
    const time = this.column("time");
    if (time === undefined || this.volumeFrom === undefined) return;
    const before = this.problems.total;
    const t = toSI(this.numberAt(row, time), time.unit);
    let timeOk = this.problems.total === before;
    if (timeOk && t === this.lastTime) {
      this.problems.add(this.lineNumber, "duplicate-time", `Time ${t} s repeats the previous row's time.`);
      timeOk = false;
    } else if (timeOk && t < this.lastTime) {
      this.problems.add(this.lineNumber, "time-not-increasing", `Time ${t} s is earlier than the previous row's ${this.lastTime} s.`);
      timeOk = false;
    }
    if (timeOk) this.lastTime = t;
    const V = this.volumeFrom(row);
    if (Number.isFinite(V) && V < 0) this.problems.add(this.lineNumber, "negative-volume", `Volume ${V} L is negative.`);
    const temperature = this.column("temperature");
    const pressure = this.column("pressure");
    const T = temperature === undefined ? 0 : toSI(this.numberAt(row, temperature), temperature.unit);
    const P = pressure === undefined ? 0 : toSI(this.numberAt(row, pressure), pressure.unit);
    if (this.problems.total !== before) return;
    this.dataRows++;
    this.t.push(t);
    this.V.push(V);
    if (temperature !== undefined) this.T.push(T);
    if (pressure !== undefined) this.P.push(P);
  }

  private column(which: TraceColumn): ColumnSpec | undefined {
    return (this.columns as ColumnSpec[]).find((c) => c.column === which);
  }

  /** Reads a numeric cell (plain decimal notation), logging a problem (and returning NaN) when it is not a number. */
  private numberAt(row: string[], spec: ColumnSpec): number {
    const cell = spec.index < row.length ? row[spec.index].trim() : "";
    const value = DECIMAL.test(cell) ? Number(cell) : Number.NaN;
    if (!Number.isFinite(value)) {
      const shown = cell === "" ? "is empty" : `"${cell.slice(0, 40)}" is not a number`;
      this.problems.add(this.lineNumber, "not-a-number", `${spec.heading}: ${shown}.`);
      return Number.NaN;
    }
    return value;
  }

  result(): TraceCsvResult {
    if (this.columns === undefined) {
      this.problems.add(Math.max(1, this.lineNumber), "no-data", "The file has no header row.");
    } else if (this.dataRows === 0 && this.problems.total === 0) {
      this.problems.add(this.headerLine + 1, "no-data", "The file has a header row but no data rows.");
    }
    if (this.problems.total > 0) {
      return { ok: false, errors: this.problems.listed(), totalErrors: this.problems.total };
    }
    const trace: ParsedTrace = { t: this.t.view(), V: this.V.view() };
    if (this.column("temperature") !== undefined) trace.T = this.T.view();
    if (this.column("pressure") !== undefined) trace.P = this.P.view();
    return { ok: true, trace, rows: this.dataRows, columns: this.columns as ColumnSpec[] };
  }
}

/** The delimiter used most (outside quotes) in the first non-blank line; comma when none. */
function guessDelimiter(text: string): string {
  const firstLine = text.split("\n").find((line) => line.trim() !== "") ?? "";
  const unquoted = firstLine.replace(/"[^"]*"/g, "");
  let best = ",";
  let bestCount = 0;
  for (const candidate of [",", ";", "\t", "|"]) {
    const count = unquoted.split(candidate).length - 1;
    if (count > bestCount) {
      best = candidate;
      bestCount = count;
    }
  }
  return best;
}

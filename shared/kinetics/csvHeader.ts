import { parseUnit, quantityOf, type Quantity, type Unit } from "../units/index.js";

export type TraceColumn = "time" | "volume" | "travel" | "temperature" | "pressure";

export interface ColumnSpec {
  column: TraceColumn;
  index: number;
  unit: Unit;
  heading: string;
}

export interface HeaderProblem {
  code: "unknown-unit" | "missing-column" | "duplicate-column";
  message: string;
}

const QUANTITY_OF_COLUMN: Record<TraceColumn, Quantity> = {
  time: "time",
  volume: "volume",
  travel: "length",
  temperature: "temperature",
  pressure: "pressure",
};

/** Single letters are case-sensitive (t is time, T is temperature); words are not. */
const LETTER_NAMES: Record<string, TraceColumn> = {
  t: "time", V: "volume", v: "volume", x: "travel", T: "temperature", P: "pressure", p: "pressure",
};
const WORD_NAMES: Record<string, TraceColumn> = {
  time: "time", volume: "volume", "gas volume": "volume", travel: "travel", position: "travel",
  "piston travel": "travel", "piston position": "travel", temperature: "temperature", temp: "temperature",
  pressure: "pressure",
};

/** Recognises a column name written loosely; undefined for columns the trace does not use. */
export function recogniseColumnName(name: string): TraceColumn | undefined {
  const trimmed = name.trim();
  return LETTER_NAMES[trimmed] ?? WORD_NAMES[trimmed.toLowerCase().replace(/[\s_]+/g, " ")];
}

/** Splits "name (unit)" or "name [unit]" into its parts; the unit may itself hold brackets. */
export function splitHeading(heading: string): { name: string; unitText: string | undefined } {
  const match = /^\s*([^([]+?)\s*[([](.*)[)\]]\s*$/.exec(heading);
  if (match === null) return { name: heading.trim(), unitText: undefined };
  return { name: match[1], unitText: match[2].trim() };
}

/** Reads the header row into column specs, collecting every problem found. */
export function readHeader(cells: string[]): { columns: ColumnSpec[]; problems: HeaderProblem[] } {
  const columns: ColumnSpec[] = [];
  const problems: HeaderProblem[] = [];
  const named = new Set<TraceColumn>();
  cells.forEach((rawHeading, index) => {
    const heading = rawHeading.replace(/^\uFEFF/, "").trim();
    const { name, unitText } = splitHeading(heading);
    const column = recogniseColumnName(name);
    if (column === undefined) return;
    if (named.has(column)) {
      problems.push({ code: "duplicate-column", message: `Column "${heading}" repeats the ${column} column.` });
      return;
    }
    named.add(column);
    const wanted = QUANTITY_OF_COLUMN[column];
    const unit = unitText === undefined ? undefined : parseUnit(unitText);
    if (unit === undefined || quantityOf(unit) !== wanted) {
      const said = unitText === undefined ? "no unit" : `unit "${unitText}"`;
      problems.push({
        code: "unknown-unit",
        message: `Column "${heading}" has ${said}; write a ${wanted} unit in () or [], for example ${exampleUnit(wanted)}.`,
      });
      return;
    }
    columns.push({ column, index, unit, heading });
  });
  if (!named.has("time")) {
    problems.push({ code: "missing-column", message: "No time column (name it time or t, with a unit)." });
  }
  if (!named.has("volume") && !named.has("travel")) {
    problems.push({
      code: "missing-column",
      message: "No volume column (name it volume or V, or travel, position or x for piston travel).",
    });
  }
  return { columns, problems };
}

function exampleUnit(quantity: Quantity): string {
  const examples: Record<Quantity, string> = {
    time: "(s), (min) or (h)",
    volume: "(mL), (L) or (m³)",
    length: "(mm) or (m)",
    area: "(m²)",
    temperature: "(°C) or (K)",
    pressure: "(Pa), (kPa), (bar(a)), (bar(g)), (psi(a)) or (psi(g))",
  };
  return examples[quantity];
}

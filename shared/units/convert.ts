import {
  KELVIN_AT_ZERO_CELSIUS,
  PA_PER_BAR,
  PA_PER_PSI,
  STANDARD_ATMOSPHERE_PA,
  quantityOf,
  type AreaUnit,
  type LengthUnit,
  type Unit,
} from "./unitCatalog.js";

/** value_base = value · scale + offset, for each unit. */
const LINEAR: Record<Unit, { scale: number; offset: number }> = {
  s: { scale: 1, offset: 0 },
  min: { scale: 60, offset: 0 },
  h: { scale: 3600, offset: 0 },
  mL: { scale: 1e-3, offset: 0 },
  L: { scale: 1, offset: 0 },
  "m³": { scale: 1000, offset: 0 },
  mm: { scale: 1e-3, offset: 0 },
  cm: { scale: 1e-2, offset: 0 },
  m: { scale: 1, offset: 0 },
  "mm²": { scale: 1e-6, offset: 0 },
  "cm²": { scale: 1e-4, offset: 0 },
  "m²": { scale: 1, offset: 0 },
  "°C": { scale: 1, offset: KELVIN_AT_ZERO_CELSIUS },
  K: { scale: 1, offset: 0 },
  Pa: { scale: 1, offset: 0 },
  kPa: { scale: 1e3, offset: 0 },
  MPa: { scale: 1e6, offset: 0 },
  "bar(a)": { scale: PA_PER_BAR, offset: 0 },
  "bar(g)": { scale: PA_PER_BAR, offset: STANDARD_ATMOSPHERE_PA },
  "psi(a)": { scale: PA_PER_PSI, offset: 0 },
  "psi(g)": { scale: PA_PER_PSI, offset: STANDARD_ATMOSPHERE_PA },
};

/** Converts a value in `unit` to the base unit of its quantity (s, L, m, m², K, Pa absolute). */
export function toSI(value: number, unit: Unit): number {
  const { scale, offset } = lookup(unit);
  return value * scale + offset;
}

/** Converts a value in the base unit of its quantity to `unit`. */
export function fromSI(value: number, unit: Unit): number {
  const { scale, offset } = lookup(unit);
  return (value - offset) / scale;
}

/** Converts between two units of the same quantity. */
export function convertUnit(value: number, from: Unit, to: Unit): number {
  if (quantityOf(from) !== quantityOf(to)) {
    throw new Error(`Cannot convert ${from} (${quantityOf(from)}) to ${to} (${quantityOf(to)}).`);
  }
  return fromSI(toSI(value, from), to);
}

/** Volume swept by a piston, L, from its travel and the bore area. */
export function travelToVolume(
  travel: number,
  travelUnit: LengthUnit,
  boreArea: number,
  boreAreaUnit: AreaUnit = "m²",
): number {
  const cubicMetres = toSI(travel, travelUnit) * toSI(boreArea, boreAreaUnit);
  return cubicMetres * 1000;
}

function lookup(unit: Unit): { scale: number; offset: number } {
  const entry = LINEAR[unit];
  if (entry === undefined) throw new Error(`Unknown unit "${String(unit)}".`);
  return entry;
}

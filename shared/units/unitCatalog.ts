/** Units Isobatch accepts, grouped by the quantity they measure. */

export const TIME_UNITS = ["s", "min", "h"] as const;
export const VOLUME_UNITS = ["mL", "L", "m³"] as const;
export const LENGTH_UNITS = ["mm", "cm", "m"] as const;
export const AREA_UNITS = ["mm²", "cm²", "m²"] as const;
export const TEMPERATURE_UNITS = ["°C", "K"] as const;
export const PRESSURE_UNITS = ["Pa", "kPa", "MPa", "bar(a)", "bar(g)", "psi(a)", "psi(g)"] as const;

export type TimeUnit = (typeof TIME_UNITS)[number];
export type VolumeUnit = (typeof VOLUME_UNITS)[number];
export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type AreaUnit = (typeof AREA_UNITS)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type Unit = TimeUnit | VolumeUnit | LengthUnit | AreaUnit | TemperatureUnit | PressureUnit;

export type Quantity = "time" | "volume" | "length" | "area" | "temperature" | "pressure";

/** Every catalogued unit, by the quantity it measures. */
export const UNITS_BY_QUANTITY: { readonly [Q in Quantity]: readonly Unit[] } = {
  time: TIME_UNITS,
  volume: VOLUME_UNITS,
  length: LENGTH_UNITS,
  area: AREA_UNITS,
  temperature: TEMPERATURE_UNITS,
  pressure: PRESSURE_UNITS,
};

/**
 * The unit every value is held in inside Isobatch. Volume is held in litres (not m³) because
 * concentrations are in mol/L; pressure is absolute.
 */
export const BASE_UNIT: { readonly [Q in Quantity]: Unit } = {
  time: "s",
  volume: "L",
  length: "m",
  area: "m²",
  temperature: "K",
  pressure: "Pa",
};

/** Atmospheric pressure added to gauge readings, Pa (standard atmosphere). */
export const STANDARD_ATMOSPHERE_PA = 101325;
/** One pound-force per square inch in pascals. */
export const PA_PER_PSI = 6894.757293168361;
/** One bar in pascals (exact). */
export const PA_PER_BAR = 100000;
/** Offset between degrees Celsius and kelvin (exact). */
export const KELVIN_AT_ZERO_CELSIUS = 273.15;

const QUANTITY_OF_UNIT = new Map<Unit, Quantity>();
for (const [quantity, units] of Object.entries(UNITS_BY_QUANTITY) as [Quantity, readonly Unit[]][]) {
  for (const unit of units) QUANTITY_OF_UNIT.set(unit, quantity);
}

/** The quantity a unit measures. */
export function quantityOf(unit: Unit): Quantity {
  const quantity = QUANTITY_OF_UNIT.get(unit);
  if (quantity === undefined) throw new Error(`Unknown unit "${String(unit)}".`);
  return quantity;
}

/** True when the string is one of the catalogued unit symbols. */
export function isUnit(value: string): value is Unit {
  return QUANTITY_OF_UNIT.has(value as Unit);
}

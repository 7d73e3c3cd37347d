import type { Unit } from "./unitCatalog.js";

/** Spellings seen in instrument exports and typed by hand, keyed after normalisation. */
const ALIASES: Record<string, Unit> = {
  s: "s", sec: "s", secs: "s", second: "s", seconds: "s",
  min: "min", mins: "min", minute: "min", minutes: "min",
  h: "h", hr: "h", hrs: "h", hour: "h", hours: "h",
  ml: "mL", cm3: "mL", cc: "mL",
  l: "L", litre: "L", liter: "L", litres: "L", liters: "L", dm3: "L",
  m3: "m³",
  mm: "mm", cm: "cm", m: "m",
  mm2: "mm²", cm2: "cm²", m2: "m²",
  c: "°C", degc: "°C", celsius: "°C",
  k: "K", kelvin: "K",
  pa: "Pa", kpa: "kPa", mpa: "MPa",
  // Bare "bar" and "psi" are refused on purpose: absolute or gauge must be stated.
  bara: "bar(a)", barg: "bar(g)",
  psia: "psi(a)", psig: "psi(g)",
};

/**
 * Reads a unit symbol written loosely ("min", "mL", "m^3", "degC", "bar(a)", "bar a", "psig")
 * and returns the catalogued unit, or undefined when it is not recognised.
 */
export function parseUnit(text: string): Unit | undefined {
  const key = normalised(text);
  const unit = ALIASES[key];
  // Case is loose (exports write "ML" or "KPA"), except where a symbol written in SI case names
  // another unit: "mPa" is the millipascal, not the megapascal, so it is refused, not misread.
  const trimmed = text.trim();
  if (unit === "MPa" && trimmed.startsWith("m") && trimmed !== trimmed.toLowerCase()) return undefined;
  return unit;
}

function normalised(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/³/g, "3")
    .replace(/²/g, "2")
    .replace(/\^/g, "")
    .replace(/[°º]/g, "deg")
    .replace(/[\s()._-]/g, "")
    .replace(/^deg(?=[ck]$)/, "");
}

import { fromSI, isUnit } from "../../../../shared/units";

const numberFormat = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 6 });

/** A number for display, with at most `digits` significant digits and no float noise; a dash for none. */
export function formatNumber(value: number | null | undefined, digits = 6): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  if (digits === 6) return numberFormat.format(value);
  return new Intl.NumberFormat("en-GB", { maximumSignificantDigits: digits }).format(value);
}

/** An SI value shown in `unit` (the unit the person entered it in), e.g. "12 bar(a)". */
export function formatInUnit(si: number | null | undefined, unit: string | null | undefined, digits = 6): string {
  if (si === null || si === undefined || !unit || !isUnit(unit)) return "—";
  return `${formatNumber(fromSI(si, unit), digits)} ${unit}`;
}

/** An SI value converted to `unit` and rounded to 10 significant digits, for refilling a form. */
export function valueInUnit(si: number, unit: string): number {
  if (!isUnit(unit)) return si;
  return Number(fromSI(si, unit).toPrecision(10));
}

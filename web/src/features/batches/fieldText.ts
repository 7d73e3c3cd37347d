import { isOutOfLimit } from "../../../../shared/execution/entrySchema";
import { formatLocal, formatUtc } from "../signatures/signatureTime";
import { formatNumber } from "../vessels/quantityFormat";
import type { BatchFieldView } from "./types";

function range(low: number | null, high: number | null, unit: string): string | null {
  const u = unit ? ` ${unit}` : "";
  if (low !== null && high !== null) return `${formatNumber(low)} to ${formatNumber(high)}${u}`;
  if (low !== null) return `at least ${formatNumber(low)}${u}`;
  if (high !== null) return `at most ${formatNumber(high)}${u}`;
  return null;
}

/** The limits of a number field at this batch's scale, e.g. "116.6 to 121.44 g"; null when it has none. */
export function limitsAtScaleText(field: BatchFieldView): string | null {
  if (field.kind !== "number") return null;
  return range(field.limitsAtScale.low, field.limitsAtScale.high, field.unit);
}

/** How the scaled limits came about, for fields given per litre of V0. */
export function perLitreNote(field: BatchFieldView, v0L: number): string | null {
  if (field.kind !== "number" || !field.perLitreV0) return null;
  const perLitre = range(field.low, field.high, `${field.unit} per litre of V0`);
  return perLitre ? `Set as ${perLitre}, scaled to V0 = ${formatNumber(v0L)} L.` : null;
}

/** A typed-in number box's text as a number; undefined when empty, NaN when unreadable. */
export function readNumber(text: string | undefined): number | undefined {
  const trimmed = (text ?? "").trim();
  if (trimmed === "") return undefined;
  // Tablets set to a comma-decimal locale type "2,5".
  const normal = /^[-+]?\d+,\d+$/.test(trimmed) ? trimmed.replace(",", ".") : trimmed;
  return /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(normal) ? Number(normal) : Number.NaN;
}

/** True when the typed value of a number field lies outside its limits at this scale. */
export function typedOutOfLimit(field: BatchFieldView, text: string | undefined, v0L: number): boolean {
  const value = readNumber(text);
  return value !== undefined && Number.isFinite(value) && isOutOfLimit(field, value, v0L);
}

/** A recorded value as text for the entry list (times in UTC with local time beside). */
export function recordedValueText(field: BatchFieldView, value: unknown, fileName?: (id: string) => string | undefined): string {
  if (value === undefined || value === null || value === "") return "—";
  if (field.kind === "number" && typeof value === "number") return `${formatNumber(value)}${field.unit ? ` ${field.unit}` : ""}`;
  if (field.kind === "datetime" && typeof value === "string") return `${formatUtc(value)} (${formatLocal(value)})`;
  if (field.kind === "attachment" && typeof value === "string") return fileName?.(value) ?? `file ${value.slice(0, 8)}…`;
  return String(value);
}

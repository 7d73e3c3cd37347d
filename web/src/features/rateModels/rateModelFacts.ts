import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { fromSI } from "../../../../shared/units";
import { formatNumber } from "../vessels/quantityFormat";
import { reactionEquation } from "./reactionEquation";

/** One labelled value of a version, as shown on screen and compared between versions. */
export interface Fact {
  key: string;
  label: string;
  value: string;
  group: "Reaction" | "Rate law" | "Acceptance limits" | "Notes";
}

const GROUP_ORDER: Fact["group"][] = ["Reaction", "Rate law", "Acceptance limits", "Notes"];

const n = (x: number) => formatNumber(x, 8);

/** Every value of a rate-model version in words and units, in a fixed order. */
export function rateModelFacts(version: RateModelVersionView): Fact[] {
  const c = version.content;
  const facts: Fact[] = [
    { key: "equation", label: "Reaction", value: reactionEquation(c.reaction), group: "Reaction" },
    { key: "keySpecies", label: "Key species (A)", value: c.keySpecies, group: "Reaction" },
    ...Object.entries(c.feed)
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([species, y]): Fact => ({ key: `feed.${species}`, label: `Feed mole fraction of ${species}`, value: n(y), group: "Reaction" })),
    { key: "epsilonA", label: "εA", value: n(version.derived.epsilonA), group: "Reaction" },
    { key: "delta", label: "δ (gas moles per mole of A)", value: n(version.derived.delta), group: "Reaction" },
    { key: "yA0", label: "yA0", value: n(version.derived.yA0), group: "Reaction" },
    { key: "order", label: "Order in A", value: n(c.order), group: "Rate law" },
    { key: "kRef", label: "k at the reference temperature", value: `${n(c.kRef)} ${version.derived.kUnit}`, group: "Rate law" },
    { key: "TRefK", label: "Reference temperature", value: `${n(c.TRefK)} K (${n(fromSI(c.TRefK, "°C"))} °C)`, group: "Rate law" },
    { key: "Ea", label: "Activation energy Ea", value: `${n(c.EaJPerMol / 1000)} kJ/mol`, group: "Rate law" },
    { key: "tolerancePct", label: "Allowed deviation of observed k", value: `± ${n(c.tolerancePct)} %`, group: "Acceptance limits" },
    { key: "residual", label: "Largest residual RMS of the fit", value: `${n(c.residualRmsMaxPctOfV0)} % of V0`, group: "Acceptance limits" },
    { key: "tBand", label: "Temperature band", value: `± ${n(c.temperatureBandK)} K`, group: "Acceptance limits" },
    { key: "pBand", label: "Pressure band", value: `± ${n(c.pressureBandPct)} %`, group: "Acceptance limits" },
    { key: "notes", label: "Notes", value: c.notes || "—", group: "Notes" },
  ];
  return facts;
}

/** A row of the comparison: one label with each version's value and whether they differ. */
export interface ComparedFact {
  key: string;
  label: string;
  group: Fact["group"];
  left: string;
  right: string;
  differs: boolean;
}

/** Lines up the facts of two versions; a fact only one version has shows a dash on the other side. */
export function compareFacts(left: Fact[], right: Fact[]): ComparedFact[] {
  const rank = (group: Fact["group"]) => GROUP_ORDER.indexOf(group);
  // A fact only the right version has (a new feed species, say) joins the end of its group.
  const keys = [...new Set([...left, ...right].sort((a, b) => rank(a.group) - rank(b.group)).map((f) => f.key))];
  const byKey = (list: Fact[]) => new Map(list.map((f) => [f.key, f]));
  const l = byKey(left);
  const r = byKey(right);
  return keys.map((key) => {
    const a = l.get(key);
    const b = r.get(key);
    const sample = (a ?? b)!;
    const left = a?.value ?? "—";
    const right = b?.value ?? "—";
    return { key, label: sample.label, group: sample.group, left, right, differs: left !== right };
  });
}

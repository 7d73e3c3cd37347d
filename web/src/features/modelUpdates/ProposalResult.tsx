import { IntervalChart } from "../../components/charts/IntervalChart";
import { Notice } from "../../components/Notice";
import type { RateModelVersionView } from "../../../../shared/schemas/rateModels";
import { formatInUnit, formatNumber } from "../vessels/quantityFormat";
import { arrheniusChart } from "./arrheniusPlot";
import type { ProposalView } from "./types";

const interval = ([lo, hi]: [number | null, number | null], scale = 1, digits = 4) =>
  lo === null || hi === null || !Number.isFinite(lo) || !Number.isFinite(hi) ? "not available" : `${formatNumber(lo * scale, digits)} to ${formatNumber(hi * scale, digits)}`;

/** Each batch's k at its temperature, the Arrhenius fit with its intervals and warnings, and the plot. */
export function ProposalResult({ proposal, base }: { proposal: ProposalView; base: RateModelVersionView }) {
  const { arrhenius } = proposal;
  const unit = base.derived.kUnit;
  const chart = arrheniusChart(proposal, base.content);
  return (
    <div className="flex flex-col gap-5">
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left">
          <caption className="mb-2 text-left text-lg font-semibold">k fitted to each batch at the temperature it ran at</caption>
          <thead>
            <tr className="border-b-2 border-ink-300">
              {["Batch", "Temperature as run", `k (${unit})`, "95 % interval", "Points"].map((h) => (
                <th key={h} scope="col" className="px-2 py-2 font-semibold whitespace-nowrap">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {proposal.points.map((p) => (
              <tr key={p.batchId} className="border-b border-ink-200">
                <th scope="row" className="px-2 py-2 font-semibold">
                  {p.code}
                </th>
                <td className="px-2 py-2 tabular-nums whitespace-nowrap">
                  {formatInUnit(p.T, "°C", 5)} ({formatNumber(p.T, 6)} K)
                </td>
                <td className="px-2 py-2 tabular-nums">{formatNumber(p.k, 5)}</td>
                <td className="px-2 py-2 tabular-nums whitespace-nowrap">{interval(p.kCI95, 1, 5)}</td>
                <td className="px-2 py-2 tabular-nums">{p.points}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <section aria-labelledby="fit-title" className="flex flex-col gap-3">
        <h3 id="fit-title" className="text-lg font-bold">
          Arrhenius fit{arrhenius.weighted ? " (weighted by each k's standard error)" : ""}
        </h3>
        <div className="overflow-x-auto rounded-lg border-2 border-ink-200 bg-white p-4">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">The proposed Arrhenius parameters beside the current version's</caption>
            <thead>
              <tr className="border-b-2 border-ink-300">
                <th scope="col" className="px-2 py-2 font-semibold">
                  Parameter
                </th>
                <th scope="col" className="px-2 py-2 font-semibold">
                  Proposed, with its 95 % interval
                </th>
                <th scope="col" className="px-2 py-2 font-semibold">
                  Version {base.version} now
                </th>
              </tr>
            </thead>
            <tbody className="tabular-nums">
              <tr className="border-b border-ink-200">
                <th scope="row" className="px-2 py-2 font-semibold">
                  kRef at {formatInUnit(arrhenius.TRef, "°C", 5)}
                </th>
                <td className="px-2 py-2">
                  {formatNumber(arrhenius.kRef, 4)} {unit} ({interval(arrhenius.kRefCI95)})
                </td>
                <td className="px-2 py-2">
                  {formatNumber(base.content.kRef, 4)} {unit}
                </td>
              </tr>
              <tr className="border-b border-ink-200">
                <th scope="row" className="px-2 py-2 font-semibold">
                  Ea
                </th>
                <td className="px-2 py-2">
                  {formatNumber(arrhenius.Ea / 1000, 4)} kJ/mol ({interval(arrhenius.EaCI95, 1 / 1000)})
                </td>
                <td className="px-2 py-2">{formatNumber(base.content.EaJPerMol / 1000, 4)} kJ/mol</td>
              </tr>
              <tr>
                <th scope="row" className="px-2 py-2 font-semibold">
                  r² of ln k against 1/T
                </th>
                <td className="px-2 py-2">{formatNumber(arrhenius.r2, 6)}</td>
                <td className="px-2 py-2">—</td>
              </tr>
            </tbody>
          </table>
        </div>
        {arrhenius.warnings.length > 0 && (
          <Notice tone="error" title="Read before saving">
            <ul className="ml-5 list-disc">
              {arrhenius.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          </Notice>
        )}
      </section>
      <figure className="flex flex-col gap-2 rounded-lg border-2 border-ink-200 bg-white p-4">
        <h3 className="text-lg font-bold">Arrhenius plot</h3>
        <IntervalChart
          label={`ln k against 1000/T for ${proposal.points.length} released batches, with the fitted line and the current version's line`}
          xLabel="1000 / T (1/K)"
          yLabel={`ln k (k in ${unit})`}
          {...chart}
          formatX={(v) => formatNumber(v, 5)}
          formatY={(v) => formatNumber(v, 4)}
        />
        <figcaption className="text-[0.9rem] text-ink-700">Bars are each batch's 95 % interval on k, drawn on the log scale. The dashed line is the version this proposal starts from.</figcaption>
      </figure>
    </div>
  );
}

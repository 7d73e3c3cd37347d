import { Link } from "react-router";
import { IntervalChart } from "../../components/charts/IntervalChart";
import { BatchStateBadge } from "../../components/BatchStateBadge";
import { formatInUnit, formatNumber } from "../vessels/quantityFormat";
import { controlChartData, toleranceBand, type RatioRow } from "./controlPoints";
import type { TrendsView } from "./types";

const ratioText = (v: number | null) => formatNumber(v, 4);

/** The control chart of k observed / k model per batch, with the tolerance band, and the same numbers as a table. */
export function ControlChart({ trends, rows }: { trends: TrendsView; rows: RatioRow[] }) {
  const tol = trends.model.tolerancePct;
  const band = toleranceBand(tol);
  const data = controlChartData(rows);
  const outside = rows.filter((r) => r.outside);
  return (
    <section aria-labelledby="control-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="control-title" className="text-xl font-bold">
        Observed k against the model, batch by batch
      </h2>
      <p className="text-ink-800">
        Each batch's fitted k divided by the model's k at the temperature that batch ran at (rate model version {trends.model.version}), in batch order and
        grouped by vessel. The band is 1 ± {formatNumber(tol, 3)} %, the model's tolerance.
      </p>
      {data.points.length === 0 ? (
        <p className="font-semibold">No batch of this campaign has a kinetics check on its current traces yet.</p>
      ) : (
        <IntervalChart
          label={`Observed over model rate constant for ${data.points.length} batches of campaign ${trends.campaign.code}, with the ±${tol} % band; ${outside.length} outside it`}
          xLabel="Batch, in campaign order"
          yLabel="k observed / k model"
          points={data.points}
          xTicks={data.ticks}
          xDomain={data.domain}
          segments={data.segments}
          band={{ ...band, label: `Tolerance band ${ratioText(band.low)} to ${ratioText(band.high)}` }}
          formatY={(v) => formatNumber(v, 3)}
          flaggedWord="outside the tolerance band"
        />
      )}
      <p role="status" className="font-semibold">
        {outside.length === 0 ? "No checked batch lies outside the band." : `Outside the band: ${outside.map((r) => r.batch.code).join(", ")}.`}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left">
          <caption className="mb-2 text-left font-semibold">Per batch: observed k over the model's k at its temperature</caption>
          <thead>
            <tr className="border-b-2 border-ink-300">
              {["Batch", "Vessel", "State", "Temperature", "k obs. / k model", "Check", "Band"].map((h) => (
                <th key={h} scope="col" className="px-2 py-2 font-semibold whitespace-nowrap">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.batch.id} className="border-b border-ink-200">
                <th scope="row" className="px-2 py-2 font-semibold whitespace-nowrap">
                  <Link to={`/batches/${r.batch.id}`} className="inline-flex min-h-11 items-center">
                    {r.batch.code}
                  </Link>
                </th>
                <td className="px-2 py-2 whitespace-nowrap">
                  {r.batch.vesselTag}, {formatNumber(r.batch.v0L, 4)} L
                </td>
                <td className="px-2 py-2">
                  <BatchStateBadge state={r.batch.state} />
                </td>
                <td className="px-2 py-2 tabular-nums whitespace-nowrap">{formatInUnit(r.batch.temperatureK, "°C", 4)}</td>
                <td className="px-2 py-2 tabular-nums">
                  {ratioText(r.ratio)}
                  {r.low !== null && r.high !== null && <span className="block text-[0.85rem] whitespace-nowrap text-ink-700">95 %: {ratioText(r.low)} to {ratioText(r.high)}</span>}
                </td>
                <td className="px-2 py-2 whitespace-nowrap">{r.batch.check ? (r.batch.check.verdict === "within" ? "Within" : "Outside") : "Not checked"}</td>
                <td className="px-2 py-2 font-semibold whitespace-nowrap">{r.ratio === null ? "—" : r.outside ? "◇ Outside" : "Inside"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

import { useMemo } from "react";
import type uPlot from "uplot";
import { UPlotChart } from "../../components/charts/UPlotChart";
import { conversionOverlay } from "./conversionSeries";
import type { TrendBatch } from "./types";

/** Every batch's conversion (read from the volume) against time, overlaid; line dashes mark the vessel. */
export function ConversionChart({ batches, campaignCode }: { batches: TrendBatch[]; campaignCode: string }) {
  const overlay = useMemo(() => conversionOverlay(batches), [batches]);
  const count = overlay.series.length;
  return (
    <section aria-labelledby="conversion-title" className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="conversion-title" className="text-xl font-bold">
        Conversion traces, overlaid
      </h2>
      <p className="text-ink-800">Conversion XA read from each batch's logged volume, (V − V0)/(εA·V0), against time from the start of its trace. Each vessel has its own line dash.</p>
      {count === 0 ? (
        <p className="font-semibold">No batch of this campaign has a trace yet.</p>
      ) : (
        <UPlotChart
          label={`Conversion against time for ${count} batch${count === 1 ? "" : "es"} of campaign ${campaignCode}`}
          data={overlay.data as unknown as uPlot.AlignedData}
          series={overlay.series}
          xLabel="Time (min)"
          yLabel="Conversion XA"
          height={360}
        />
      )}
    </section>
  );
}

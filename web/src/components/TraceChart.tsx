import { useMemo } from "react";
import type uPlot from "uplot";
import { UPlotChart } from "./charts/UPlotChart";
import { thinForPlot } from "./charts/thinForPlot";

export interface TraceChartProps {
  /** Seconds from the start of the trace. */
  t: number[];
  /** Logged gas volume, L. */
  V: number[];
  /** The model's volume at the same times, L (empty when there is none). */
  predicted: number[];
  label: string;
}

const SERIES: uPlot.Series[] = [
  { label: "Logged volume (L)", stroke: "#0e5c63", width: 2, points: { show: false } },
  // Dashed as well as another colour, so the two lines are told apart without colour.
  { label: "Model prediction (L)", stroke: "#7a4600", width: 2, dash: [10, 6], points: { show: false } },
];

/** The logged volume against the model's prediction over time (minutes). */
export function TraceChart({ t, V, predicted, label }: TraceChartProps) {
  const data = useMemo(() => {
    const minutes = t.map((s) => s / 60);
    const model = predicted.length === t.length ? predicted : t.map(() => null);
    return thinForPlot([minutes, V, model]).columns as uPlot.AlignedData;
  }, [t, V, predicted]);
  return <UPlotChart label={label} data={data} series={SERIES} xLabel="Time (min)" yLabel="Volume (L)" height={340} />;
}

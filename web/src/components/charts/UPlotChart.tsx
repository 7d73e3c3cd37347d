import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

export interface UPlotChartProps {
  /** Short name of the chart, read out for the drawing itself. */
  label: string;
  /** x values first, then one array per series, all the same length. */
  data: uPlot.AlignedData;
  /** The series after x, in the order of `data`. */
  series: uPlot.Series[];
  xLabel: string;
  yLabel: string;
  height?: number;
}

const AXIS = { stroke: "#23343d", grid: { stroke: "#d3dcdf", width: 1 }, ticks: { stroke: "#b4c0c6", width: 1 } };

/**
 * A uPlot line chart that fills its container's width. The plot is made once per series
 * layout and fed new data with setData, which keeps 100 000-point traces smooth.
 */
export function UPlotChart({ label, data, series, xLabel, yLabel, height = 320 }: UPlotChartProps) {
  const holder = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const layout = JSON.stringify(series.map((s) => s.label)) + xLabel + yLabel;

  useEffect(() => {
    const element = holder.current;
    if (!element) return;
    const options: uPlot.Options = {
      width: Math.max(element.clientWidth, 280),
      height,
      series: [{ label: xLabel }, ...series],
      scales: { x: { time: false } },
      axes: [
        { ...AXIS, label: xLabel, labelFont: "600 15px Public Sans, sans-serif", font: "14px Public Sans, sans-serif" },
        { ...AXIS, label: yLabel, labelFont: "600 15px Public Sans, sans-serif", font: "14px Public Sans, sans-serif", size: 70 },
      ],
      legend: { show: true },
      cursor: { drag: { x: true, y: false } },
    };
    const chart = new uPlot(options, data, element);
    plot.current = chart;
    const resize = new ResizeObserver(() => chart.setSize({ width: Math.max(element.clientWidth, 280), height }));
    resize.observe(element);
    return () => {
      resize.disconnect();
      chart.destroy();
      plot.current = null;
    };
    // The plot is rebuilt only when its series layout changes; data goes through setData below.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [layout, height]);

  useEffect(() => {
    plot.current?.setData(data);
  }, [data]);

  return <div ref={holder} role="img" aria-label={label} className="w-full overflow-hidden" />;
}

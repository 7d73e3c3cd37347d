import type uPlot from "uplot";
import type { PlotColumn } from "../../components/charts/thinForPlot";
import type { TrendBatch } from "./types";

const COLOURS = ["#0e5c63", "#7a4600", "#35464f", "#9e1c1c", "#1f6637", "#083c41", "#c98a1a", "#6b7b83"];
// Each vessel gets its own dash as well as colours, so scales are told apart without colour.
const DASHES: (number[] | undefined)[] = [undefined, [10, 6], [3, 4], [14, 4, 3, 4]];

/**
 * Every batch's conversion on one time axis (minutes) for uPlot: the union of the batches' times,
 * each batch's column holding its own readings and gaps elsewhere (drawn across with spanGaps).
 */
export function conversionOverlay(batches: TrendBatch[]): { data: PlotColumn[]; series: uPlot.Series[] } {
  const drawn = batches.filter((b) => b.conversion.t.length > 0);
  const times = [...new Set(drawn.flatMap((b) => b.conversion.t))].sort((a, b) => a - b);
  const row = new Map(times.map((t, i) => [t, i]));
  const vessels = [...new Set(drawn.map((b) => b.vesselTag))];
  const columns: PlotColumn[] = drawn.map((b) => {
    const col: PlotColumn = new Array(times.length).fill(null);
    b.conversion.t.forEach((t, i) => {
      const x = b.conversion.X[i];
      col[row.get(t) as number] = Number.isFinite(x) ? x : null;
    });
    return col;
  });
  const series: uPlot.Series[] = drawn.map((b, i) => ({
    label: `${b.code} (${b.vesselTag})`,
    stroke: COLOURS[i % COLOURS.length],
    width: 2,
    dash: DASHES[vessels.indexOf(b.vesselTag) % DASHES.length],
    spanGaps: true,
    points: { show: false },
  }));
  return { data: [times.map((t) => t / 60), ...columns], series };
}

/** Above this many points a chart draws every n-th point; uPlot stays smooth well below it. */
export const PLOT_POINT_LIMIT = 200_000;

export type PlotColumn = (number | null)[];

export interface ThinnedSeries {
  columns: PlotColumn[];
  /** 1 when every point is drawn, otherwise the stride used. */
  stride: number;
}

/** Every `stride`-th row of the aligned columns (plus the last), keeping at most `limit` rows. */
export function thinForPlot(columns: PlotColumn[], limit = PLOT_POINT_LIMIT): ThinnedSeries {
  const n = columns.length === 0 ? 0 : columns[0].length;
  const stride = n <= limit ? 1 : Math.ceil(n / limit);
  if (stride === 1) return { columns, stride };
  const count = Math.ceil((n - 1) / stride) + 1;
  const thinned = columns.map((values) => {
    const out: PlotColumn = new Array(count);
    for (let i = 0, j = 0; j < count - 1; i += stride, j++) out[j] = values[i];
    out[count - 1] = values[n - 1];
    return out;
  });
  return { columns: thinned, stride };
}

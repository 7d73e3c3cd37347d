import type { IntervalPoint } from "../../components/charts/IntervalChart";
import type { TrendBatch, TrendsView } from "./types";

/** One batch's observed k over the model's k at its temperature, with the interval scaled the same way. */
export interface RatioRow {
  batch: TrendBatch;
  ratio: number | null;
  low: number | null;
  high: number | null;
  outside: boolean;
}

const scaled = (v: number | null, by: number) => (v === null || !Number.isFinite(v) || !(by > 0) ? null : v / by);

/** The tolerance band on the ratio: 1 ± tolerance %. */
export const toleranceBand = (tolerancePct: number) => ({ low: 1 - tolerancePct / 100, high: 1 + tolerancePct / 100 });

/** Every batch, in campaign order, with its ratio k observed / k model (null when not checked). */
export function ratioRows(trends: TrendsView): RatioRow[] {
  const band = toleranceBand(trends.model.tolerancePct);
  return [...trends.batches]
    .sort((a, b) => a.order - b.order)
    .map((batch) => {
      const ratio = scaled(batch.check?.kObserved ?? null, batch.kModelAtT);
      return {
        batch,
        ratio,
        low: scaled(batch.check?.kObservedCI95[0] ?? null, batch.kModelAtT),
        high: scaled(batch.check?.kObservedCI95[1] ?? null, batch.kModelAtT),
        outside: ratio !== null && (ratio < band.low || ratio > band.high),
      };
    });
}

/** The chart's points (checked batches only, placed 1, 2, 3 … in order) and the vessel stretches under them. */
export function controlChartData(rows: RatioRow[]) {
  const plotted = rows.filter((r) => r.ratio !== null);
  const points: IntervalPoint[] = plotted.map((r, i) => ({ id: r.batch.id, name: r.batch.code, x: i + 1, y: r.ratio as number, low: r.low, high: r.high, flagged: r.outside }));
  const ticks = plotted.map((r, i) => ({ value: i + 1, label: r.batch.code }));
  const segments: { from: number; to: number; label: string }[] = [];
  plotted.forEach((r, i) => {
    const label = `${r.batch.vesselTag} · ${Number(r.batch.v0L.toPrecision(4))} L`;
    const last = segments.at(-1);
    if (last && last.label === label) last.to = i + 1.5;
    else segments.push({ from: i + 0.5, to: i + 1.5, label });
  });
  return { points, ticks, segments, domain: [0.5, Math.max(1, plotted.length) + 0.5] as [number, number] };
}

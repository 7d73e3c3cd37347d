import type { BatchState } from "../../../../shared/machines/batchMoves";

/** One batch of a campaign as the trends see it. */
export interface TrendBatch {
  order: number;
  id: string;
  code: string;
  state: BatchState;
  vesselTag: string;
  v0L: number;
  /** The temperature as run (the logger's mean), else the plan, K. */
  temperatureK: number;
  kModelAtT: number;
  check: { verdict: "within" | "outside"; kObserved: number | null; kObservedCI95: [number | null, number | null]; deviationPct: number | null } | null;
  /** Conversion read from the volume, thinned for drawing. */
  conversion: { t: number[]; X: number[] };
}

/** GET /api/campaigns/:id/trends. */
export interface TrendsView {
  campaign: { id: string; code: string };
  model: { id: string; version: number; tolerancePct: number; kRef: number; TRefK: number; EaJPerMol: number };
  batches: TrendBatch[];
}

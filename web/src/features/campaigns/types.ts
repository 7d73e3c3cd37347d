import type { BatchPlanInput, BatchPlanResult } from "../../../../shared/schemas/campaigns";

/** A planned batch as GET /api/campaigns lists it. */
export interface PlannedBatchView {
  id: string;
  code: string;
  state: string;
  vesselId: string;
  vesselTag: string;
  v0L: number;
  temperatureK: number;
  pressurePa: number;
  /** The operating point as the planner typed it. */
  entered: Pick<BatchPlanInput, "v0" | "temperature" | "pressure">;
  plan: BatchPlanResult;
  createdAt: string;
}

/** A campaign with the approved versions it is pinned to and its planned batches. */
export interface CampaignView {
  id: string;
  code: string;
  process: string;
  createdAt: string;
  rateModel?: { id: string; version: number; status: string; code: string; epsilonA: number };
  masterRecord?: { id: string; version: number; status: string; code: string };
  batches: PlannedBatchView[];
  abilities: { planBatch: boolean };
}

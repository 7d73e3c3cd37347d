import type { BatchListRow } from "../batches/types";
import type { CampaignView } from "../campaigns/types";

/** A released batch that may feed an update of this model, with its campaign. */
export interface CandidateBatch {
  id: string;
  code: string;
  campaignCode: string;
  vesselTag: string;
  v0L: number;
  temperatureK: number | null;
}

/** Released batches whose campaign runs on a version of the model family `modelCode`, in campaign then batch order. */
export function candidateBatches(released: BatchListRow[], campaigns: CampaignView[], modelCode: string): CandidateBatch[] {
  const onModel = new Map(campaigns.filter((c) => c.rateModel?.code === modelCode).map((c) => [c.id, c]));
  return released
    .filter((b) => b.state === "released" && onModel.has(b.campaignId))
    .map((b) => ({
      id: b.id,
      code: b.code,
      campaignCode: b.campaignCode,
      vesselTag: b.vesselTag,
      v0L: b.v0L,
      temperatureK: onModel.get(b.campaignId)?.batches.find((p) => p.id === b.id)?.temperatureK ?? null,
    }))
    .sort((a, b) => a.campaignCode.localeCompare(b.campaignCode) || a.code.localeCompare(b.code));
}

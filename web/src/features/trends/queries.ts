import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import { campaignKeys } from "../campaigns/queries";
import type { TrendsView } from "./types";

/** GET /api/campaigns/:id/trends: every batch's k against the model, and its conversion trace. */
export function trendsQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: [...campaignKeys.detail(campaignId), "trends"] as const,
    queryFn: ({ signal }) => apiGet<TrendsView>(`/api/campaigns/${encodeURIComponent(campaignId)}/trends`, signal),
    staleTime: 30_000,
  });
}

/** Where the campaign's results table downloads as CSV. */
export const resultsCsvHref = (campaignId: string) => `/api/campaigns/${encodeURIComponent(campaignId)}/results.csv`;

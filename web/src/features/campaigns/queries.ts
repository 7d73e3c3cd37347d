import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { CampaignView } from "./types";

/** Query keys for campaigns. */
export const campaignKeys = {
  all: ["campaigns"] as const,
  list: () => [...campaignKeys.all, "list"] as const,
  detail: (id: string) => [...campaignKeys.all, "detail", id] as const,
};

/** GET /api/campaigns: every campaign, newest first, with its batches. */
export function campaignListQueryOptions() {
  return queryOptions({
    queryKey: campaignKeys.list(),
    queryFn: ({ signal }) => apiGet<{ campaigns: CampaignView[] }>("/api/campaigns", signal),
    select: (body) => body.campaigns,
  });
}

/** GET /api/campaigns/:id: one campaign with its batches. */
export function campaignQueryOptions(id: string) {
  return queryOptions({
    queryKey: campaignKeys.detail(id),
    queryFn: ({ signal }) => apiGet<{ campaign: CampaignView }>(`/api/campaigns/${encodeURIComponent(id)}`, signal),
    select: (body) => body.campaign,
  });
}

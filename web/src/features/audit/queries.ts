import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { AuditEvent, AuditVerifyResult } from "../../api/types";

export interface AuditFilter {
  entityType?: string;
  entityId?: string;
  limit?: number;
}

/** Query keys for the audit trail (quality and admin). */
export const auditKeys = {
  all: ["audit"] as const,
  events: (filter: AuditFilter) => [...auditKeys.all, "events", filter] as const,
  verify: () => [...auditKeys.all, "verify"] as const,
};

function auditEventsPath(filter: AuditFilter): string {
  const params = new URLSearchParams();
  if (filter.entityType) params.set("entityType", filter.entityType);
  if (filter.entityId) params.set("entityId", filter.entityId);
  if (filter.limit !== undefined) params.set("limit", String(filter.limit));
  const query = params.toString();
  return query ? `/api/audit?${query}` : "/api/audit";
}

/** GET /api/audit: audit events, optionally for one entity, newest as the server orders them. */
export function auditEventsQueryOptions(filter: AuditFilter = {}) {
  return queryOptions({
    queryKey: auditKeys.events(filter),
    queryFn: ({ signal }) => apiGet<{ events: AuditEvent[] }>(auditEventsPath(filter), signal),
    select: (body) => body.events,
  });
}

/** GET /api/audit/verify: re-checks the whole audit trail for tampering or gaps. */
export function auditVerifyQueryOptions() {
  return queryOptions({
    queryKey: auditKeys.verify(),
    queryFn: ({ signal }) => apiGet<AuditVerifyResult>("/api/audit/verify", signal),
    staleTime: 0,
  });
}

import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { MasterRecordVersionView } from "../../../../shared/schemas/masterRecords";

/** Query keys for master records and their versions. */
export const masterRecordKeys = {
  all: ["master-records"] as const,
  list: () => [...masterRecordKeys.all, "list"] as const,
  versionsOf: (recordId: string) => [...masterRecordKeys.all, "record", recordId] as const,
  version: (id: string) => [...masterRecordKeys.all, "version", id] as const,
};

type Versions = { versions: MasterRecordVersionView[] };

/** GET /api/master-records: every version of every master record. */
export function masterRecordListQueryOptions() {
  return queryOptions({
    queryKey: masterRecordKeys.list(),
    queryFn: ({ signal }) => apiGet<Versions>("/api/master-records", signal),
    select: (body) => body.versions,
  });
}

/** GET /api/master-records/:id/versions: the versions of one master record, newest first. */
export function masterRecordVersionsQueryOptions(recordId: string) {
  return queryOptions({
    queryKey: masterRecordKeys.versionsOf(recordId),
    queryFn: ({ signal }) => apiGet<Versions>(`/api/master-records/${encodeURIComponent(recordId)}/versions`, signal),
    select: (body) => body.versions,
  });
}

/** GET /api/master-records/versions/:id: one version with its signatures and abilities. */
export function masterRecordVersionQueryOptions(id: string) {
  return queryOptions({
    queryKey: masterRecordKeys.version(id),
    queryFn: ({ signal }) => apiGet<{ version: MasterRecordVersionView }>(`/api/master-records/versions/${encodeURIComponent(id)}`, signal),
    select: (body) => body.version,
  });
}

import { useQuery } from "@tanstack/react-query";
import { ApprovalQueue } from "../../components/ApprovalQueue";
import { QueryState } from "../../components/QueryState";
import { masterRecordListQueryOptions } from "../masterRecords/queries";
import { rateModelListQueryOptions } from "../rateModels/queries";

/** Quality's list of rate-model and master-record drafts it may approve (never its own). */
export function PendingApprovals() {
  const models = useQuery(rateModelListQueryOptions());
  const records = useQuery(masterRecordListQueryOptions());
  const waiting = [
    ...(models.data ?? []).filter((v) => v.abilities.approve).map((v) => ({ ...v, href: `/rate-models/versions/${v.id}`, kind: "Rate model" })),
    ...(records.data ?? []).filter((v) => v.abilities.approve).map((v) => ({ ...v, href: `/master-records/versions/${v.id}`, kind: "Master record" })),
  ];
  const hrefs = new Map(waiting.map((v) => [v.id, v.href]));
  return (
    <QueryState
      isPending={models.isPending || records.isPending}
      error={models.error ?? records.error}
      onRetry={() => {
        void models.refetch();
        void records.refetch();
      }}
      what="the drafts waiting for approval"
    >
      <ApprovalQueue
        title="Drafts waiting for your approval"
        kind="Draft"
        id="home"
        versions={waiting}
        hrefFor={(id) => hrefs.get(id) ?? "/"}
      />
    </QueryState>
  );
}

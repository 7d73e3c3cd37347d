import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { DataTable } from "../components/DataTable";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { StatusBadge } from "../components/StatusBadge";
import { batchColumns } from "../features/campaigns/batchColumns";
import { PlanBatchForm } from "../features/campaigns/PlanBatchForm";
import { campaignQueryOptions } from "../features/campaigns/queries";
import type { CampaignView } from "../features/campaigns/types";
import { masterRecordVersionQueryOptions } from "../features/masterRecords/queries";
import { rateModelVersionQueryOptions } from "../features/rateModels/queries";
import { formatNumber } from "../features/vessels/quantityFormat";
import { vesselListQueryOptions } from "../features/vessels/queries";

/** One campaign: the versions it is pinned to, its planned batches, and the plan form. */
export default function CampaignDetail() {
  const { campaignId = "" } = useParams();
  const campaign = useQuery(campaignQueryOptions(campaignId));
  const c = campaign.data;
  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/campaigns", label: "Campaigns" }, { label: c?.code ?? "Campaign" }]} />
      <QueryState isPending={campaign.isPending} error={campaign.error} onRetry={() => void campaign.refetch()} what="the campaign">
        {c && (
          <>
            <PageIntro title={`Campaign ${c.code}`}>
              <p>{c.process}</p>
            </PageIntro>
            <ul className="flex flex-wrap gap-x-6">
              <li>
                <Link to={`/campaigns/${c.id}/trends`} className="inline-flex min-h-11 items-center font-semibold">
                  Trends: k against the model, conversion traces
                </Link>
              </li>
              <li>
                <a href={`/api/campaigns/${encodeURIComponent(c.id)}/results.csv`} download className="inline-flex min-h-11 items-center font-semibold">
                  Download the results as CSV
                </a>
              </li>
            </ul>
            <PinnedVersions campaign={c} />
            <section aria-labelledby="batches-title" className="flex flex-col gap-3">
              <h2 id="batches-title" className="text-xl font-bold">
                Planned batches
              </h2>
              <DataTable caption="Planned batches" data={c.batches} columns={batchColumns} getRowId={(b) => b.id} emptyMessage="No batches planned yet." filterLabel="Filter batches" />
            </section>
            {c.abilities.planBatch && <PlanSection campaign={c} />}
          </>
        )}
      </QueryState>
    </div>
  );
}

function PinnedVersions({ campaign }: { campaign: CampaignView }) {
  const { rateModel, masterRecord } = campaign;
  return (
    <dl className="grid gap-x-6 gap-y-1 rounded-lg border-2 border-ink-200 bg-white p-5 sm:grid-cols-[max-content_1fr]">
      <dt className="font-semibold">Rate model</dt>
      <dd className="flex flex-wrap items-center gap-2">
        {rateModel ? (
          <>
            <Link to={`/rate-models/versions/${rateModel.id}`}>
              {rateModel.code} version {rateModel.version}
            </Link>
            <StatusBadge status={rateModel.status} /> εA {formatNumber(rateModel.epsilonA, 4)}
          </>
        ) : (
          "—"
        )}
      </dd>
      <dt className="font-semibold">Master record</dt>
      <dd className="flex flex-wrap items-center gap-2">
        {masterRecord ? (
          <>
            <Link to={`/master-records/versions/${masterRecord.id}`}>
              {masterRecord.code} version {masterRecord.version}
            </Link>
            <StatusBadge status={masterRecord.status} />
          </>
        ) : (
          "—"
        )}
      </dd>
    </dl>
  );
}

function PlanSection({ campaign }: { campaign: CampaignView }) {
  const [planned, setPlanned] = useState<string | null>(null);
  const vessels = useQuery(vesselListQueryOptions());
  const model = useQuery({ ...rateModelVersionQueryOptions(campaign.rateModel?.id ?? ""), enabled: Boolean(campaign.rateModel) });
  const record = useQuery({ ...masterRecordVersionQueryOptions(campaign.masterRecord?.id ?? ""), enabled: Boolean(campaign.masterRecord) });
  const pending = vessels.isPending || model.isPending || record.isPending;
  const error = vessels.error ?? model.error ?? record.error;
  return (
    <section aria-labelledby="plan-title" className="flex flex-col gap-4">
      <h2 id="plan-title" className="text-xl font-bold">
        Plan a batch
      </h2>
      <div aria-live="polite">{planned && <Notice tone="success">Batch {planned} was planned.</Notice>}</div>
      <QueryState
        isPending={pending}
        error={error}
        onRetry={() => {
          void vessels.refetch();
          void model.refetch();
          void record.refetch();
        }}
        what="the vessels, rate model and master record"
      >
        {vessels.data && model.data && record.data && (
          <PlanBatchForm
            campaignId={campaign.id}
            vessels={vessels.data}
            model={{ epsilonA: model.data.derived.epsilonA, yA0: model.data.derived.yA0 }}
            record={record.data.content}
            onPlanned={setPlanned}
          />
        )}
      </QueryState>
    </section>
  );
}

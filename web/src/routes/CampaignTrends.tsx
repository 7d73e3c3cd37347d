import { useMemo } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { ConversionChart } from "../features/trends/ConversionChart";
import { ControlChart } from "../features/trends/ControlChart";
import { rateModelVersionQueryOptions } from "../features/rateModels/queries";
import { ratioRows } from "../features/trends/controlPoints";
import { resultsCsvHref, trendsQueryOptions } from "../features/trends/queries";
import type { TrendsView } from "../features/trends/types";
import { formatNumber } from "../features/vessels/quantityFormat";

/** A campaign's trends (/campaigns/:campaignId/trends): k against the model per batch, and the conversion traces. */
export default function CampaignTrends() {
  const { campaignId = "" } = useParams();
  const trends = useQuery(trendsQueryOptions(campaignId));
  const code = trends.data?.campaign.code;
  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/campaigns", label: "Campaigns" }, { to: `/campaigns/${campaignId}`, label: code ?? "Campaign" }, { label: "Trends" }]} />
      <QueryState isPending={trends.isPending} error={trends.error} onRetry={() => void trends.refetch()} what="the campaign trends">
        {trends.data && <TrendsBody trends={trends.data} />}
      </QueryState>
    </div>
  );
}

function TrendsBody({ trends }: { trends: TrendsView }) {
  const rows = useMemo(() => ratioRows(trends), [trends]);
  const { model } = trends;
  const version = useQuery(rateModelVersionQueryOptions(model.id));
  const kUnit = version.data?.derived.kUnit ?? "";
  return (
    <>
      <PageIntro title={`Trends of campaign ${trends.campaign.code}`}>
        <p>
          Rate model <Link to={`/rate-models/versions/${model.id}`}>version {model.version}</Link>: kRef {formatNumber(model.kRef, 4)} {kUnit} at {formatNumber(model.TRefK - 273.15, 5)} °C,
          Ea {formatNumber(model.EaJPerMol / 1000, 4)} kJ/mol, tolerance ±{formatNumber(model.tolerancePct, 3)} %.
        </p>
      </PageIntro>
      <p>
        <a href={resultsCsvHref(trends.campaign.id)} download className="inline-flex min-h-11 items-center font-semibold">
          Download the results as CSV
        </a>
      </p>
      <ControlChart trends={trends} rows={rows} />
      <ConversionChart batches={rows.map((r) => r.batch)} campaignCode={trends.campaign.code} />
    </>
  );
}

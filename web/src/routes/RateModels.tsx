import { useQuery } from "@tanstack/react-query";
import { ApprovalQueue } from "../components/ApprovalQueue";
import { ButtonLink } from "../components/ButtonLink";
import { DataTable } from "../components/DataTable";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { rateModelColumns } from "../features/rateModels/rateModelColumns";
import { rateModelListQueryOptions } from "../features/rateModels/queries";
import { useSession } from "../features/session/useSession";

/** Every rate-model version: engineers start models, quality sees the drafts it can approve. */
export default function RateModels() {
  const { user } = useSession();
  const versions = useQuery(rateModelListQueryOptions());

  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Rate models">
        <p>
          The kinetic models batches are planned and checked with. Engineers draft versions; a
          version is used only once someone in quality has approved it with their signature.
        </p>
      </PageIntro>
      {user?.roles.includes("engineer") && (
        <ButtonLink to="/rate-models/new" className="self-start">
          New rate model
        </ButtonLink>
      )}
      <QueryState isPending={versions.isPending} error={versions.error} onRetry={() => void versions.refetch()} what="the rate models">
        {user?.roles.includes("quality") && (
          <ApprovalQueue
            title="Drafts waiting for your approval"
            id="rate-models"
            kind="Rate model"
            versions={(versions.data ?? []).filter((v) => v.abilities.approve)}
            hrefFor={(id) => `/rate-models/versions/${id}`}
          />
        )}
        <DataTable
          caption="Rate-model versions"
          data={versions.data ?? []}
          columns={rateModelColumns}
          getRowId={(v) => v.id}
          emptyMessage="No rate models yet."
          filterLabel="Filter rate models"
        />
      </QueryState>
    </div>
  );
}

import { useQuery } from "@tanstack/react-query";
import { ApprovalQueue } from "../components/ApprovalQueue";
import { ButtonLink } from "../components/ButtonLink";
import { DataTable } from "../components/DataTable";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { masterRecordColumns } from "../features/masterRecords/masterRecordColumns";
import { masterRecordListQueryOptions } from "../features/masterRecords/queries";
import { useSession } from "../features/session/useSession";

/** Every master-record version: engineers start records, quality sees the drafts it can approve. */
export default function MasterRecords() {
  const { user } = useSession();
  const versions = useQuery(masterRecordListQueryOptions());

  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Master records">
        <p>
          The step-by-step instructions and entries each batch record is made from. Engineers draft
          versions; a version is used only once someone in quality has approved it with their signature.
        </p>
      </PageIntro>
      {user?.roles.includes("engineer") && (
        <ButtonLink to="/master-records/new" className="self-start">
          New master record
        </ButtonLink>
      )}
      <QueryState isPending={versions.isPending} error={versions.error} onRetry={() => void versions.refetch()} what="the master records">
        {user?.roles.includes("quality") && (
          <ApprovalQueue
            title="Drafts waiting for your approval"
            id="master-records"
            kind="Master record"
            versions={(versions.data ?? []).filter((v) => v.abilities.approve)}
            hrefFor={(id) => `/master-records/versions/${id}`}
          />
        )}
        <DataTable
          caption="Master-record versions"
          data={versions.data ?? []}
          columns={masterRecordColumns}
          getRowId={(v) => v.id}
          emptyMessage="No master records yet."
          filterLabel="Filter master records"
        />
      </QueryState>
    </div>
  );
}

import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useNavigate } from "react-router";
import { Button } from "../components/Button";
import { DataTable } from "../components/DataTable";
import { Dialog } from "../components/Dialog";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { campaignColumns } from "../features/campaigns/campaignColumns";
import { CampaignForm } from "../features/campaigns/CampaignForm";
import { campaignListQueryOptions } from "../features/campaigns/queries";
import { useSession } from "../features/session/useSession";

/** The campaigns, each pinned to approved versions; engineers open new ones. */
export default function Campaigns() {
  const { user } = useSession();
  const navigate = useNavigate();
  const campaigns = useQuery(campaignListQueryOptions());
  const [creating, setCreating] = useState(false);

  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Campaigns">
        <p>
          A campaign runs batches on one approved master record and one approved rate model. Open a
          campaign to plan its batches.
        </p>
      </PageIntro>
      {user?.roles.includes("engineer") && (
        <Button className="self-start" onClick={() => setCreating(true)}>
          Open a campaign
        </Button>
      )}
      <QueryState isPending={campaigns.isPending} error={campaigns.error} onRetry={() => void campaigns.refetch()} what="the campaigns">
        <DataTable
          caption="Campaigns"
          data={campaigns.data ?? []}
          columns={campaignColumns}
          getRowId={(c) => c.id}
          emptyMessage="No campaigns yet."
          filterLabel="Filter campaigns"
        />
      </QueryState>
      <Dialog open={creating} title="Open a campaign" onClose={() => setCreating(false)}>
        <CampaignForm
          onCancel={() => setCreating(false)}
          onDone={(campaign) => {
            setCreating(false);
            navigate(`/campaigns/${campaign.id}`);
          }}
        />
      </Dialog>
    </div>
  );
}

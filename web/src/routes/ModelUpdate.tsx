import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate, useParams } from "react-router";
import { ApiError } from "../api/client";
import { Breadcrumb } from "../components/Breadcrumb";
import { Button } from "../components/Button";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { RoleGate } from "../components/RoleGate";
import type { RateModelVersionView } from "../../../shared/schemas/rateModels";
import { errorMessage } from "../lib/serverFieldErrors";
import { batchListQueryOptions } from "../features/batches/queries";
import { campaignListQueryOptions } from "../features/campaigns/queries";
import { BatchPicker } from "../features/modelUpdates/BatchPicker";
import { candidateBatches, type CandidateBatch } from "../features/modelUpdates/candidateBatches";
import { useProposalMutation } from "../features/modelUpdates/mutations";
import { ProposalResult } from "../features/modelUpdates/ProposalResult";
import type { ProposalView } from "../features/modelUpdates/types";
import { rateModelVersionQueryOptions } from "../features/rateModels/queries";

/** The engineer's model update (/rate-models/versions/:versionId/update): fit kRef and Ea from released batches, then save a draft. */
export default function ModelUpdate() {
  const { versionId = "" } = useParams();
  const version = useQuery(rateModelVersionQueryOptions(versionId));
  const released = useQuery(batchListQueryOptions("released"));
  const campaigns = useQuery(campaignListQueryOptions());
  const base = version.data;
  const candidates = useMemo(() => (base && released.data && campaigns.data ? candidateBatches(released.data, campaigns.data, base.code) : null), [base, released.data, campaigns.data]);
  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/rate-models", label: "Rate models" }, { to: `/rate-models/versions/${versionId}`, label: base ? `${base.code} version ${base.version}` : "Version" }, { label: "Update from released batches" }]} />
      <QueryState
        isPending={version.isPending || released.isPending || campaigns.isPending}
        error={version.error ?? released.error ?? campaigns.error}
        onRetry={() => {
          void version.refetch();
          void released.refetch();
          void campaigns.refetch();
        }}
        what="the rate model and its released batches"
      >
        {base && candidates && (
          <>
            <PageIntro title={`Update ${base.code} from released batches`}>
              <p>
                k is fitted to each chosen batch at the temperature it ran at, then kRef and Ea by Arrhenius. Starting from version {base.version}; a saved proposal
                becomes a draft version that quality approves like any other.
              </p>
            </PageIntro>
            <RoleGate role="engineer">
              <UpdateForm key={base.id} base={base} candidates={candidates} />
            </RoleGate>
          </>
        )}
      </QueryState>
    </div>
  );
}

type Fitted = { ids: string[]; proposal: ProposalView };

function UpdateForm({ base, candidates }: { base: RateModelVersionView; candidates: CandidateBatch[] }) {
  const navigate = useNavigate();
  const mutation = useProposalMutation(base.id);
  const [chosen, setChosen] = useState<string[]>([]);
  const [pickError, setPickError] = useState<string | undefined>();
  const [failure, setFailure] = useState<{ text: string; draftId?: string } | null>(null);
  const [fitted, setFitted] = useState<Fitted | null>(null);
  const stale = fitted !== null && fitted.ids.join() !== chosen.join();

  const fail = (error: unknown) => {
    if (error instanceof ApiError && error.field === "batchIds") return setPickError(error.message.replace(/^batchIds: /, ""));
    const draftId = error instanceof ApiError && typeof error.details.draftId === "string" ? error.details.draftId : undefined;
    setFailure({ text: errorMessage(error), draftId });
  };

  const fit = async () => {
    setFailure(null);
    setPickError(undefined);
    if (chosen.length < 2) return setPickError("Choose at least two released batches.");
    try {
      const proposal = await mutation.mutateAsync({ batchIds: chosen, save: false });
      setFitted({ ids: chosen, proposal });
    } catch (error) {
      fail(error);
    }
  };

  const save = async () => {
    if (!fitted) return;
    setFailure(null);
    try {
      const result = await mutation.mutateAsync({ batchIds: fitted.ids, save: true });
      if (result.draft) navigate(`/rate-models/versions/${result.draft.id}`);
    } catch (error) {
      fail(error);
    }
  };

  if (candidates.length < 2) {
    return <Notice title="Not enough released batches">An update needs at least two released batches from campaigns on {base.code}; {candidates.length === 0 ? "there are none yet" : "there is one so far"}.</Notice>;
  }

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="pick-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
        <h2 id="pick-title" className="text-xl font-bold">
          Choose the batches
        </h2>
        <BatchPicker candidates={candidates} chosen={chosen} onChange={setChosen} error={pickError} />
        <Button className="self-start" busy={mutation.isPending} onClick={() => void fit()}>
          Fit the proposal
        </Button>
      </section>
      {fitted && (
        <section aria-labelledby="proposal-title" className="flex flex-col gap-4">
          <h2 id="proposal-title" className="text-2xl font-bold">
            The proposal
          </h2>
          {stale && <Notice title="The choice has changed">These results are for the batches chosen before. Fit again to see the current choice.</Notice>}
          <ProposalResult proposal={fitted.proposal} base={base} />
          <div className="flex flex-col gap-2">
            <Button className="min-h-14 self-start px-6 text-lg" busy={mutation.isPending} disabled={stale} onClick={() => void save()}>
              Save as draft version
            </Button>
            <p className="text-ink-700">The draft records the {fitted.ids.length} batches it was fitted from; nothing is used until quality approves it.</p>
          </div>
        </section>
      )}
      <div aria-live="polite" className="empty:hidden">
        {failure && (
          <Notice tone="error">
            <p>{failure.text}</p>
            {failure.draftId && (
              <p>
                <Link to={`/rate-models/versions/${failure.draftId}`}>Open the draft that is already there</Link>
              </p>
            )}
          </Notice>
        )}
      </div>
    </div>
  );
}

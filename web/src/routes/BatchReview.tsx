import { useQuery } from "@tanstack/react-query";
import { useParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { Caution } from "../components/Caution";
import { Notice } from "../components/Notice";
import { QueryState } from "../components/QueryState";
import { batchQueryOptions } from "../features/batches/queries";
import type { BatchView } from "../features/batches/types";
import { ExceptionsPanel } from "../features/review/ExceptionsPanel";
import { KineticsCheckPanel } from "../features/review/KineticsCheckPanel";
import { reviewQueryOptions } from "../features/review/queries";
import { ReleaseChecklist } from "../features/review/ReleaseChecklist";
import { ReleaseDecision } from "../features/review/ReleaseDecision";
import { ReviewHeader } from "../features/review/ReviewHeader";
import type { ReviewView } from "../features/review/types";

/** Quality's review of an executed batch (/batches/:id/review): exceptions first, then the kinetics check, then release or rejection. */
export default function BatchReview() {
  const { id = "" } = useParams();
  return <ReviewScreen key={id} batchId={id} />;
}

function ReviewScreen({ batchId }: { batchId: string }) {
  const batch = useQuery(batchQueryOptions(batchId));
  const review = useQuery(reviewQueryOptions(batchId));
  const view = batch.data;
  return (
    <div className="flex flex-col gap-8">
      <Breadcrumb crumbs={[{ to: "/batches", label: "Batches" }, { to: `/batches/${batchId}`, label: view ? view.batch.code : "Batch" }, { label: "Review" }]} />
      <QueryState
        isPending={batch.isPending || review.isPending}
        error={batch.error ?? review.error}
        onRetry={() => {
          void batch.refetch();
          void review.refetch();
        }}
        what="the batch review"
      >
        {view && review.data && <ReviewBody view={view} review={review.data} onStale={() => void batch.refetch()} />}
      </QueryState>
    </div>
  );
}

function ReviewBody({ view, review, onStale }: { view: BatchView; review: ReviewView; onStale: () => void }) {
  const isQuality = view.facts.roles.includes("quality");
  const inReview = view.batch.state === "review";
  return (
    <>
      <ReviewHeader view={view} check={review.check} />
      {!inReview && view.batch.state !== "released" && view.batch.state !== "rejected" && (
        <Notice title="Not in review yet">This batch is still being executed; exceptions are signed off and the batch released once it has been sent for review.</Notice>
      )}
      {inReview && !isQuality && <Notice>You can read this review. Signing off exceptions, releasing and rejecting need the quality role.</Notice>}
      <ExceptionsPanel view={view} exceptions={review.exceptions} canReview={isQuality && inReview} />
      <KineticsCheckPanel view={view} check={review.check} />
      <section aria-labelledby="release-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
        <h2 id="release-title" className="text-2xl font-bold">
          Release or reject
        </h2>
        <Caution title="Caution: release of material">
          <p>
            Releasing material is the decision of the responsible person under your site's procedures and local codes. Isobatch records that decision with
            its signature; it does not make it, and the checks on this screen do not replace it.
          </p>
        </Caution>
        <ReleaseChecklist view={view} canPerform={isQuality && inReview} />
        <ReleaseDecision view={view} onStale={onStale} />
      </section>
    </>
  );
}

import { QueryState } from "../../components/QueryState";
import { BatchQueue, DeviationQueue, VerificationQueue } from "./QueuePanel";
import { useQueues } from "./useQueues";

/** The operator's work: batches in progress. */
export function OperatorQueues() {
  const queues = useQueues();
  return (
    <QueryState isPending={queues.isPending} error={queues.error} onRetry={() => void queues.refetch()} what="your work list">
      {queues.data && <BatchQueue id="queue-in-progress" title="Batches in progress" batches={queues.data.inProgress} empty="No batch is charging, running, sampling or on hold. Start one from the Batches list." />}
    </QueryState>
  );
}

/** The supervisor's work: signatures due, held batches and deviations to investigate. */
export function SupervisorQueues() {
  const queues = useQueues();
  return (
    <QueryState isPending={queues.isPending} error={queues.error} onRetry={() => void queues.refetch()} what="your work list">
      {queues.data && (
        <div className="grid items-start gap-4 lg:grid-cols-2">
          <VerificationQueue items={queues.data.awaitingVerification} />
          <BatchQueue id="queue-held" title="Batches on hold" batches={queues.data.held} empty="No batch is on hold." />
          <DeviationQueue id="queue-investigate" title="Deviations to investigate" items={queues.data.deviationsToInvestigate} empty="No open deviation waits for an investigation." />
        </div>
      )}
    </QueryState>
  );
}

/** Quality's work: batches in review and deviations to close. */
export function QualityQueues() {
  const queues = useQueues();
  return (
    <QueryState isPending={queues.isPending} error={queues.error} onRetry={() => void queues.refetch()} what="your work list">
      {queues.data && (
        <div className="grid items-start gap-4 lg:grid-cols-2">
          <BatchQueue id="queue-review" title="Batches in review" batches={queues.data.inReview} empty="No batch record waits for review." hrefFor={(b) => `/batches/${b.id}/review`} />
          <DeviationQueue id="queue-close" title="Deviations to close" items={queues.data.deviationsToClose} empty="No investigated deviation waits for closing." />
        </div>
      )}
    </QueryState>
  );
}

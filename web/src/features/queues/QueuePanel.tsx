import type { ReactNode } from "react";
import { Link } from "react-router";
import { BatchStateBadge } from "../../components/BatchStateBadge";
import { SeverityLabel } from "../deviations/DeviationStatusBadge";
import type { QueuedBatch, QueuedDeviation, QueuedVerification } from "./queries";

function Panel({ id, title, count, children }: { id: string; title: string; count: number; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id={id} className="text-xl font-bold">
        {title} <span className="text-ink-700">({count})</span>
      </h2>
      {children}
    </section>
  );
}

const Empty = ({ text }: { text: string }) => <p className="mt-1 text-ink-700">{text}</p>;

/** A work list of batches, each linking to its batch page (or `hrefFor`'s screen) with its state. */
export function BatchQueue({ id, title, batches, empty, hrefFor = (b) => `/batches/${b.id}` }: { id: string; title: string; batches: QueuedBatch[]; empty: string; hrefFor?: (b: QueuedBatch) => string }) {
  return (
    <Panel id={id} title={title} count={batches.length}>
      {batches.length === 0 ? (
        <Empty text={empty} />
      ) : (
        <ul className="mt-2 flex flex-col gap-1">
          {batches.map((b) => (
            <li key={b.id} className="flex flex-wrap items-center gap-3">
              <Link to={hrefFor(b)} className="inline-flex min-h-11 items-center text-lg font-semibold">
                {b.code}
              </Link>
              <BatchStateBadge state={b.state} />
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}

/** Critical steps waiting for the viewer's verification. */
export function VerificationQueue({ items }: { items: QueuedVerification[] }) {
  return (
    <Panel id="queue-verification" title="Steps waiting for your verification" count={items.length}>
      {items.length === 0 ? (
        <Empty text="No critical step waits for a second person just now." />
      ) : (
        <ul className="mt-2 flex flex-col gap-1">
          {items.map((v) => (
            <li key={`${v.batchId}-${v.stepKey}`}>
              <Link to={`/batches/${v.batchId}#step-${v.stepKey}-title`} className="inline-flex min-h-11 items-center font-semibold">
                {v.batchCode}: {v.title}
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}

/** Deviations waiting for the viewer (to investigate or to close). */
export function DeviationQueue({ id, title, items, empty }: { id: string; title: string; items: QueuedDeviation[]; empty: string }) {
  return (
    <Panel id={id} title={title} count={items.length}>
      {items.length === 0 ? (
        <Empty text={empty} />
      ) : (
        <ul className="mt-2 flex flex-col gap-1">
          {items.map((d) => (
            <li key={d.id} className="flex flex-wrap items-center gap-x-3">
              <Link to={`/batches/${d.batchId}`} className="inline-flex min-h-11 items-center font-semibold">
                {d.batchCode}: {d.title}
              </Link>
              <SeverityLabel severity={d.severity} />
            </li>
          ))}
        </ul>
      )}
      <Link to="/deviations" className="mt-2 inline-flex min-h-11 items-center">
        All deviations
      </Link>
    </Panel>
  );
}

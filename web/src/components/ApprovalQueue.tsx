import { Link } from "react-router";

export interface QueuedVersion {
  id: string;
  code: string;
  title: string;
  version: number;
  createdBy: { name: string };
  /** Overrides the queue's kind for this entry, in a mixed list. */
  kind?: string;
}

export interface ApprovalQueueProps {
  title: string;
  /** What kind of document, e.g. "Rate model", read before each code. */
  kind: string;
  /** Distinguishes the heading id when several queues share a screen. */
  id: string;
  versions: QueuedVersion[];
  hrefFor: (id: string) => string;
}

/** A list of draft versions the viewer may approve, each linking to its screen. */
export function ApprovalQueue({ title, kind, id, versions, hrefFor }: ApprovalQueueProps) {
  const headingId = `approval-queue-${id}`;
  return (
    <section aria-labelledby={headingId} className="rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id={headingId} className="text-xl font-bold">
        {title}
      </h2>
      {versions.length === 0 ? (
        <p className="mt-1 text-ink-700">None at the moment.</p>
      ) : (
        <ul className="mt-2 flex flex-col gap-1">
          {versions.map((v) => (
            <li key={v.id}>
              <Link to={hrefFor(v.id)} className="inline-flex min-h-11 items-center font-semibold">
                {v.kind ?? kind} {v.code} version {v.version}
              </Link>{" "}
              — {v.title}, drafted by {v.createdBy.name}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

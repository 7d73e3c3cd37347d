import { formatDateTime } from "../lib/formatDateTime";
import { StatusBadge } from "./StatusBadge";

export interface VersionMetaProps {
  status: string;
  createdBy: { name: string };
  createdAt: string;
  approvedAt: string | null;
  revision: number;
}

/** Status, author and dates of a versioned document, as a short definition list. */
export function VersionMeta({ status, createdBy, createdAt, approvedAt, revision }: VersionMetaProps) {
  return (
    <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
      <dt className="font-semibold">Status</dt>
      <dd>
        <StatusBadge status={status} />
      </dd>
      <dt className="font-semibold">Drafted by</dt>
      <dd>
        {createdBy.name}, {formatDateTime(createdAt)}
      </dd>
      <dt className="font-semibold">Approved</dt>
      <dd>{approvedAt ? formatDateTime(approvedAt) : "Not yet"}</dd>
      <dt className="font-semibold">Draft revision</dt>
      <dd>{revision}</dd>
    </dl>
  );
}

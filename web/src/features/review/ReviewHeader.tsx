import { Link } from "react-router";
import { BatchStateBadge } from "../../components/BatchStateBadge";
import type { BatchView } from "../batches/types";
import type { ReviewCheckView } from "./types";

/** The kinetics verdict in words, with a shape beside them. */
export function verdictWords(check: ReviewCheckView | null): { marker: string; text: string; classes: string } {
  if (!check) return { marker: "◇", text: "Kinetics check not run on the current traces", classes: "border-alarm-800 bg-alarm-50 text-alarm-800" };
  if (check.verdict === "within") return { marker: "✓", text: "Kinetics within the rate model", classes: "border-ok-800 bg-ok-50 text-ok-800" };
  return { marker: "✕", text: "Kinetics outside the rate model", classes: "border-alarm-800 bg-alarm-50 text-alarm-800" };
}

const batchPath = (id: string) => `/api/batches/${encodeURIComponent(id)}`;

/** The review screen's header: batch, state, kinetics verdict, pinned versions and the record's files. */
export function ReviewHeader({ view, check }: { view: BatchView; check: ReviewCheckView | null }) {
  const { batch, campaign, vessel, rateModel, masterRecord } = view;
  const verdict = verdictWords(check);
  return (
    <header className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-3xl font-bold">Review of batch {batch.code}</h1>
        <BatchStateBadge state={batch.state} large />
        <span className={`inline-flex items-center gap-1.5 rounded-sm border-2 px-3 py-0.5 text-lg font-semibold ${verdict.classes}`}>
          <span aria-hidden="true">{verdict.marker}</span>
          {verdict.text}
        </span>
      </div>
      <dl className="grid gap-x-6 gap-y-1 rounded-lg border-2 border-ink-200 bg-white p-4 sm:grid-cols-[max-content_1fr] lg:grid-cols-[max-content_1fr_max-content_1fr]">
        <dt className="font-semibold">Campaign</dt>
        <dd>
          <Link to={`/campaigns/${campaign.id}`}>{campaign.code}</Link> — {campaign.process}
        </dd>
        <dt className="font-semibold">Vessel</dt>
        <dd>{vessel.tag}</dd>
        <dt className="font-semibold">Rate model</dt>
        <dd>
          <Link to={`/rate-models/versions/${rateModel.id}`}>Version {rateModel.version}</Link>
        </dd>
        <dt className="font-semibold">Master record</dt>
        <dd>
          <Link to={`/master-records/versions/${masterRecord.id}`}>Version {masterRecord.version}</Link>
        </dd>
      </dl>
      <ul className="flex flex-wrap gap-x-6">
        <li>
          <Link to={`/batches/${batch.id}`} className="inline-flex min-h-11 items-center font-semibold">
            Batch page
          </Link>
        </li>
        <li>
          <a href={`${batchPath(batch.id)}/record.pdf`} target="_blank" rel="noopener" className="inline-flex min-h-11 items-center font-semibold">
            Executed batch record (PDF)
          </a>
        </li>
        <li>
          <a href={`${batchPath(batch.id)}/trace.csv`} download className="inline-flex min-h-11 items-center font-semibold">
            Trace as CSV
          </a>
        </li>
      </ul>
    </header>
  );
}

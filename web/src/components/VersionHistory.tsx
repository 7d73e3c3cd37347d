import { Link } from "react-router";
import { StatusBadge } from "./StatusBadge";

export interface VersionSummary {
  id: string;
  version: number;
  status: string;
}

/** The versions of one document, newest first, each linking to its screen. */
export function VersionHistory({ versions, currentId, hrefFor }: { versions: VersionSummary[]; currentId: string; hrefFor: (id: string) => string }) {
  if (versions.length < 2) return null;
  return (
    <section aria-labelledby="version-history-title" className="rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="version-history-title" className="text-xl font-bold">
        All versions
      </h2>
      <ul className="mt-2 flex flex-col gap-1">
        {versions.map((v) => (
          <li key={v.id} className="flex flex-wrap items-center gap-3">
            {v.id === currentId ? (
              <span className="inline-flex min-h-11 items-center font-semibold" aria-current="page">
                Version {v.version} (shown)
              </span>
            ) : (
              <Link to={hrefFor(v.id)} className="inline-flex min-h-11 items-center font-semibold">
                Version {v.version}
              </Link>
            )}
            <StatusBadge status={v.status} />
          </li>
        ))}
      </ul>
    </section>
  );
}

import type { ReactNode } from "react";

export interface CautionProps {
  title?: string;
  children?: ReactNode;
}

/** The standing caution for work on pressurised vessels; later screens add their own specifics. */
export function Caution({ title = "Caution: pressurised vessel", children }: CautionProps) {
  return (
    <aside
      aria-label={title}
      className="rounded-md border-2 border-caution-500 bg-caution-50 px-4 py-3 text-caution-800"
    >
      <p className="flex items-center gap-2 font-bold">
        <span aria-hidden="true" className="inline-flex h-7 w-7 items-center justify-center rounded-sm bg-caution-400 text-ink-950">
          !
        </span>
        {title}
      </p>
      <div className="mt-1 text-ink-950">
        {children ?? (
          <p>
            The vessel holds gas under pressure and may be hot. Follow your site's permit and
            isolation procedures, keep within the vessel's MAWP and its relief settings, and
            defer to local codes and to licensed engineers where anything here disagrees with
            them.
          </p>
        )}
      </div>
    </aside>
  );
}

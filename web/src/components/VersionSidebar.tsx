import type { SignatureView } from "../../../shared/schemas/common";
import { SignatureList } from "./SignatureList";
import { VersionHistory, type VersionSummary } from "./VersionHistory";
import { VersionMeta, type VersionMetaProps } from "./VersionMeta";

interface VersionSidebarProps {
  /** Prefix for the headings' ids, unique on the page. */
  idPrefix: string;
  version: VersionMetaProps & { id: string; signatures: SignatureView[] };
  versions: VersionSummary[];
  hrefFor: (id: string) => string;
}

/** Beside a versioned document: its record (status, author, dates), its signatures and its other versions. */
export function VersionSidebar({ idPrefix, version, versions, hrefFor }: VersionSidebarProps) {
  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby={`${idPrefix}-record-title`} className="rounded-lg border-2 border-ink-200 bg-white p-5">
        <h2 id={`${idPrefix}-record-title`} className="mb-2 text-xl font-bold">
          Record
        </h2>
        <VersionMeta {...version} />
      </section>
      <section aria-labelledby={`${idPrefix}-signatures-title`} className="flex flex-col gap-2">
        <h2 id={`${idPrefix}-signatures-title`} className="text-xl font-bold">
          Signatures
        </h2>
        <SignatureList signatures={version.signatures} emptyMessage="Not signed yet." />
      </section>
      <VersionHistory versions={versions} currentId={version.id} hrefFor={hrefFor} />
    </div>
  );
}

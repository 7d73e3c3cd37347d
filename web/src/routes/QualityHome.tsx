import { PageIntro } from "../components/PageIntro";
import { PlannedList } from "../components/PlannedList";
import { AuditIntegrityPanel } from "../features/audit/AuditIntegrityPanel";
import { RecentAuditTable } from "../features/audit/RecentAuditTable";

/** Quality's home: completed batch records to review and release, and the audit trail. */
export default function QualityHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Quality">
        <p>Completed batch records waiting for your review and release will be listed here.</p>
      </PageIntro>
      <div className="grid gap-4 lg:grid-cols-2">
        <PlannedList
          title="Ready for release"
          description="Batch records with every step signed, waiting for a release decision."
        />
        <AuditIntegrityPanel />
      </div>
      <RecentAuditTable />
    </div>
  );
}

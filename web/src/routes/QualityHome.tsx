import { PageIntro } from "../components/PageIntro";
import { MasterDataLinks } from "../components/MasterDataLinks";
import { AuditIntegrityPanel } from "../features/audit/AuditIntegrityPanel";
import { RecentAuditTable } from "../features/audit/RecentAuditTable";
import { QualityQueues } from "../features/queues/RoleQueues";
import { PendingApprovals } from "../features/signatures/PendingApprovals";

/** Quality's home: completed batch records to review and release, and the audit trail. */
export default function QualityHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Quality">
        <p>Batch records in review, deviations waiting for closing, drafts to approve and the audit trail.</p>
      </PageIntro>
      <QualityQueues />
      <PendingApprovals />
      <AuditIntegrityPanel />
      <MasterDataLinks />
      <RecentAuditTable />
    </div>
  );
}

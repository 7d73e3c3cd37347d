import { useNavigate } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { PageIntro } from "../components/PageIntro";
import { RoleGate } from "../components/RoleGate";
import { MasterRecordForm } from "../features/masterRecords/MasterRecordForm";
import { emptyMasterRecord } from "../features/masterRecords/masterRecordFormValues";

/** Starts a new master record; its version 1 is saved as a draft for quality to approve. */
export default function MasterRecordNew() {
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/master-records", label: "Master records" }, { label: "New master record" }]} />
      <PageIntro title="New master record">
        <p>Build the steps operators will follow. Version 1 is saved as a draft and can be changed until someone in quality approves it.</p>
      </PageIntro>
      <RoleGate role="engineer">
        <MasterRecordForm
          mode="create"
          initial={emptyMasterRecord()}
          submitLabel="Save draft version 1"
          onSaved={(version) => navigate(`/master-records/versions/${version.id}`)}
          onCancel={() => navigate("/master-records")}
        />
      </RoleGate>
    </div>
  );
}

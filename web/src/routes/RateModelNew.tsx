import { useNavigate } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { PageIntro } from "../components/PageIntro";
import { RoleGate } from "../components/RoleGate";
import { RateModelForm } from "../features/rateModels/RateModelForm";
import { EMPTY_RATE_MODEL } from "../features/rateModels/rateModelFormValues";

/** Starts a new rate model; its version 1 is saved as a draft for quality to approve. */
export default function RateModelNew() {
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/rate-models", label: "Rate models" }, { label: "New rate model" }]} />
      <PageIntro title="New rate model">
        <p>Version 1 is saved as a draft. It can be changed until someone in quality approves it.</p>
      </PageIntro>
      <RoleGate role="engineer">
        <RateModelForm
          mode="create"
          initial={EMPTY_RATE_MODEL}
          submitLabel="Save draft version 1"
          onSaved={(version) => navigate(`/rate-models/versions/${version.id}`)}
          onCancel={() => navigate("/rate-models")}
        />
      </RoleGate>
    </div>
  );
}

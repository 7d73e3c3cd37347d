import { PageIntro } from "../components/PageIntro";
import { SupervisorQueues } from "../features/queues/RoleQueues";

/** The supervisor's home: signatures due, held batches and deviations to investigate. */
export default function SupervisorHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Supervisor">
        <p>Critical steps waiting for your verification, batches on hold and deviations to investigate. The lists update by themselves.</p>
      </PageIntro>
      <SupervisorQueues />
    </div>
  );
}

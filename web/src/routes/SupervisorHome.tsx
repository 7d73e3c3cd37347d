import { PageIntro } from "../components/PageIntro";
import { PlannedList } from "../components/PlannedList";

/** The supervisor's home: records waiting for an e-signature and open deviations. */
export default function SupervisorHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Supervisor">
        <p>Steps and batch records waiting for your e-signature will be listed here.</p>
      </PageIntro>
      <div className="grid gap-4 lg:grid-cols-2">
        <PlannedList
          title="Waiting for your signature"
          description="Executed steps that need a supervisor's e-signature before the batch moves on."
        />
        <PlannedList
          title="Open deviations"
          description="Deviations raised on batches you supervise, until they are closed."
        />
      </div>
    </div>
  );
}

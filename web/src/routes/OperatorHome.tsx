import { Caution } from "../components/Caution";
import { PageIntro } from "../components/PageIntro";
import { PlannedList } from "../components/PlannedList";

/** The operator's home: batches being run and the steps waiting for this person. */
export default function OperatorHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Operator">
        <p>Your batches in progress and the steps waiting for you will be listed here.</p>
      </PageIntro>
      <Caution />
      <div className="grid gap-4 lg:grid-cols-2">
        <PlannedList
          title="Batches in progress"
          description="Each batch you are running, with its vessel, current step and the time it started."
        />
        <PlannedList
          title="Steps waiting for you"
          description="Steps ready to execute and record, oldest first."
        />
      </div>
    </div>
  );
}

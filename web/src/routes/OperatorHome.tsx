import { Caution } from "../components/Caution";
import { PageIntro } from "../components/PageIntro";
import { OperatorQueues } from "../features/queues/RoleQueues";

/** The operator's home: batches being run. */
export default function OperatorHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Operator">
        <p>Your batches in progress. Open one to record its steps; the list updates by itself.</p>
      </PageIntro>
      <Caution />
      <OperatorQueues />
    </div>
  );
}

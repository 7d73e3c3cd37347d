import { PageIntro } from "../components/PageIntro";
import { PlannedList } from "../components/PlannedList";

/** The engineer's home: the approved rate models and drafts under review. */
export default function EngineerHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Engineer">
        <p>The approved rate models, and the drafts waiting for approval, will be listed here.</p>
      </PageIntro>
      <div className="grid gap-4 lg:grid-cols-2">
        <PlannedList
          title="Approved rate models"
          description="Models in use for batch steps, with their version and who approved them."
        />
        <PlannedList
          title="Drafts"
          description="Models you are fitting or revising, until they are approved."
        />
      </div>
    </div>
  );
}

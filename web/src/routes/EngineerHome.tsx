import { MasterDataLinks } from "../components/MasterDataLinks";
import { PageIntro } from "../components/PageIntro";
import { EngineerModelPanels } from "../features/rateModels/EngineerModelPanels";

/** The engineer's home: the approved rate models and drafts under review. */
export default function EngineerHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Engineer">
        <p>The approved rate models, the drafts waiting for approval, and the master data you maintain.</p>
      </PageIntro>
      <EngineerModelPanels />
      <MasterDataLinks />
    </div>
  );
}

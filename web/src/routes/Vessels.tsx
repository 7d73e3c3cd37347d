import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Button } from "../components/Button";
import { DataTable } from "../components/DataTable";
import { Dialog } from "../components/Dialog";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { useSession } from "../features/session/useSession";
import { vesselListQueryOptions } from "../features/vessels/queries";
import { vesselColumns, type VesselAction } from "../features/vessels/vesselColumns";
import { VesselForm } from "../features/vessels/VesselForm";
import { VesselStatusForm } from "../features/vessels/VesselStatusForm";

/** The vessel register: engineers register and edit vessels, quality takes them out of service. */
export default function Vessels() {
  const { user } = useSession();
  const vessels = useQuery(vesselListQueryOptions());
  const [creating, setCreating] = useState(false);
  const [action, setAction] = useState<VesselAction | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const columns = useMemo(
    () =>
      vesselColumns((next) => {
        setDone(null);
        setAction(next);
      }),
    [],
  );
  const isEngineer = user?.roles.includes("engineer") ?? false;
  const acted = action?.vessel;

  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Vessels">
        <p>
          The batch vessels and their pressure and volume ratings. Values are shown in the units
          they were entered in; every change is kept in the audit trail.
        </p>
      </PageIntro>
      <div aria-live="polite">{done && <Notice tone="success">{done}</Notice>}</div>
      {isEngineer && (
        <Button
          className="self-start"
          onClick={() => {
            setDone(null);
            setCreating(true);
          }}
        >
          Register a vessel
        </Button>
      )}
      <QueryState isPending={vessels.isPending} error={vessels.error} onRetry={() => void vessels.refetch()} what="the vessels">
        <DataTable
          caption="Vessels"
          data={vessels.data ?? []}
          columns={columns}
          getRowId={(vessel) => vessel.id}
          emptyMessage="No vessels are registered yet."
          filterLabel="Filter vessels"
          initialSorting={[{ id: "tag", desc: false }]}
        />
      </QueryState>

      <Dialog open={creating} title="Register a vessel" onClose={() => setCreating(false)}>
        <VesselForm
          onCancel={() => setCreating(false)}
          onDone={(vessel) => {
            setCreating(false);
            setDone(`Vessel ${vessel.tag} was registered.`);
          }}
        />
      </Dialog>
      <Dialog open={action?.kind === "edit"} title={acted ? `Edit vessel ${acted.tag}` : ""} onClose={() => setAction(null)}>
        {action?.kind === "edit" && (
          <VesselForm
            key={`${action.vessel.id}-${action.vessel.revision}`}
            vessel={action.vessel}
            onCancel={() => setAction(null)}
            onDone={(vessel) => {
              setAction(null);
              setDone(`Vessel ${vessel.tag} was changed (revision ${vessel.revision}).`);
            }}
          />
        )}
      </Dialog>
      <Dialog
        open={action?.kind === "status"}
        title={acted ? (acted.status === "in-service" ? `Take ${acted.tag} out of service` : `Return ${acted.tag} to service`) : ""}
        onClose={() => setAction(null)}
      >
        {action?.kind === "status" && (
          <VesselStatusForm
            key={action.vessel.id}
            vessel={action.vessel}
            onCancel={() => setAction(null)}
            onDone={() => {
              setDone(`The status of ${action.vessel.tag} was changed.`);
              setAction(null);
            }}
          />
        )}
      </Dialog>
    </div>
  );
}

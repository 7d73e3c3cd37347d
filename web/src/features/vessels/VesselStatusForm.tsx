import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { Notice } from "../../components/Notice";
import { schemaMessage } from "../../components/SchemaField";
import { errorMessage } from "../../lib/serverFieldErrors";
import { VesselStatusSchema, type VesselView } from "../../../../shared/schemas/vessels";
import { ReasonField } from "../people/ReasonField";
import { useChangeVesselStatusMutation } from "./mutations";
import { FormActions } from "../../components/FormActions";

type StatusValues = z.input<typeof VesselStatusSchema>;

/** Takes a vessel out of service, or returns it to service, with a reason (quality). */
export function VesselStatusForm({ vessel, onDone, onCancel }: { vessel: VesselView; onDone: () => void; onCancel: () => void }) {
  const change = useChangeVesselStatusMutation();
  const next = vessel.status === "in-service" ? "out-of-service" : "in-service";
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<StatusValues, unknown, z.output<typeof VesselStatusSchema>>({
    resolver: zodResolver(VesselStatusSchema),
    defaultValues: { status: next, reason: "" },
  });

  const onSubmit = handleSubmit((values) => {
    change.mutate({ id: vessel.id, ...values }, { onSuccess: onDone });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <p>
        {next === "out-of-service"
          ? `No new batch can be planned in ${vessel.tag} while it is out of service.`
          : `${vessel.tag} will be available for new batches again.`}
      </p>
      <div aria-live="assertive">{change.error && <Notice tone="error">{errorMessage(change.error)}</Notice>}</div>
      <ReasonField id="vessel-status-reason" error={schemaMessage(errors.reason?.message)} registration={register("reason")} />
      <FormActions submitLabel={next === "out-of-service" ? "Take out of service" : "Return to service"} busy={change.isPending} variant={next === "out-of-service" ? "danger" : "primary"} onCancel={onCancel} />
    </form>
  );
}

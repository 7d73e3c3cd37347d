import { useQuery } from "@tanstack/react-query";
import { Button } from "../../components/Button";
import { Notice } from "../../components/Notice";
import { errorMessage } from "../../lib/serverFieldErrors";
import { auditVerifyQueryOptions } from "./queries";

function entries(count: number): string {
  return `${count} ${count === 1 ? "entry" : "entries"}`;
}

/** Runs the server's audit-trail check and shows whether every entry is intact. */
export function AuditIntegrityPanel() {
  const verify = useQuery(auditVerifyQueryOptions());
  const result = verify.data;

  return (
    <section
      aria-labelledby="audit-integrity-title"
      className="flex flex-col gap-3 rounded-lg border-2 border-ink-200 bg-white p-5"
    >
      <h2 id="audit-integrity-title" className="text-xl font-bold">
        Audit trail integrity
      </h2>
      <div aria-live="polite">
        {verify.isPending && <p className="text-ink-600">Checking the audit trail…</p>}
        {verify.isError && (
          <Notice tone="error" title="The check could not be run">
            {errorMessage(verify.error)}
          </Notice>
        )}
        {result?.ok === true && (
          <Notice tone="success" title="Intact">
            All {entries(result.checked)} checked; none has been altered or removed.
          </Notice>
        )}
        {result?.ok === false && (
          <Notice tone="error" title={`Broken at entry ${result.brokenAt.seq}`}>
            {result.brokenAt.reason} ({entries(result.checked)} checked.) Tell quality and the
            system owner before relying on records from this point on.
          </Notice>
        )}
      </div>
      <Button
        variant="secondary"
        className="self-start"
        busy={verify.isFetching}
        onClick={() => void verify.refetch()}
      >
        Check again
      </Button>
    </section>
  );
}

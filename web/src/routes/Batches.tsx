import { useId, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { DataTable } from "../components/DataTable";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { SelectInput } from "../components/SelectInput";
import { BATCH_STATES, type BatchState } from "../../../shared/machines/batchMoves";
import { batchColumns } from "../features/batches/batchColumns";
import { STATE_WORDS } from "../features/batches/batchStates";
import { batchListQueryOptions } from "../features/batches/queries";

type StateFilter = BatchState | "all";

/** Every batch, filtered by state; each opens its batch page. */
export default function Batches() {
  const filterId = useId();
  const [state, setState] = useState<StateFilter>("all");
  const batches = useQuery(batchListQueryOptions(state));
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Batches">
        <p>Planned, running and finished batches of every campaign. Open one to execute its steps or read its record.</p>
      </PageIntro>
      <div className="flex flex-col gap-1 self-start">
        <label htmlFor={filterId} className="font-semibold">
          State
        </label>
        <SelectInput id={filterId} value={state} onChange={(e) => setState(e.target.value as StateFilter)}>
          <option value="all">All states</option>
          {BATCH_STATES.map((s) => (
            <option key={s} value={s}>
              {STATE_WORDS[s]}
            </option>
          ))}
        </SelectInput>
      </div>
      <QueryState isPending={batches.isPending} error={batches.error} onRetry={() => void batches.refetch()} what="the batches">
        <DataTable
          caption={state === "all" ? "Batches" : `Batches that are ${STATE_WORDS[state].toLowerCase()}`}
          data={batches.data ?? []}
          columns={batchColumns}
          getRowId={(b) => b.id}
          emptyMessage={state === "all" ? "No batches are planned yet." : `No batch is ${STATE_WORDS[state].toLowerCase()}.`}
          filterLabel="Filter batches"
        />
      </QueryState>
    </div>
  );
}

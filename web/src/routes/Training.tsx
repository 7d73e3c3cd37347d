import { useId, useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Button } from "../components/Button";
import { DataTable } from "../components/DataTable";
import { Dialog } from "../components/Dialog";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { SelectInput } from "../components/SelectInput";
import { useSession } from "../features/session/useSession";
import { trainingListQueryOptions } from "../features/training/queries";
import { trainingColumns } from "../features/training/trainingColumns";
import { RecordTrainingForm } from "../features/training/RecordTrainingForm";
import { WithdrawTrainingForm } from "../features/training/WithdrawTrainingForm";
import type { TrainingRecordView } from "../../../shared/schemas/training";

/**
 * Training records (/training): admins and supervisors record and withdraw, quality reads
 * everyone's, everyone else sees their own.
 */
export default function Training() {
  const { user } = useSession();
  const roles = user?.roles ?? [];
  const recorder = roles.includes("admin") || roles.includes("supervisor");
  const seesAll = recorder || roles.includes("quality");
  const filterId = useId();
  const [personId, setPersonId] = useState("");
  const [recording, setRecording] = useState(false);
  const [withdrawing, setWithdrawing] = useState<TrainingRecordView | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const list = useQuery(trainingListQueryOptions(seesAll && personId ? { personId } : {}));
  const columns = useMemo(
    () => trainingColumns({ showPerson: seesAll, onWithdraw: recorder ? (record) => (setDone(null), setWithdrawing(record)) : undefined }),
    [seesAll, recorder],
  );
  const people = list.data?.people ?? [];

  return (
    <div className="flex flex-col gap-6">
      <PageIntro title={seesAll ? "Training" : "My training"}>
        <p>
          {seesAll
            ? "Who is trained on which master record version, and until when. A person performs or verifies a batch's steps only with current training on its version."
            : "Your training on each master record version. You perform or verify a batch's steps only while your training on its version is current; a supervisor or admin records it."}
        </p>
        {list.data && <p className="text-[0.95rem] text-ink-700">Dates are judged in UTC; today is {list.data.today}.</p>}
      </PageIntro>
      <div aria-live="polite" className="empty:hidden">
        {done && <Notice tone="success">{done}</Notice>}
      </div>
      {seesAll && (
        <div className="flex flex-wrap items-end gap-4">
          <div className="flex flex-col gap-1">
            <label htmlFor={filterId} className="font-semibold">
              Person
            </label>
            <SelectInput id={filterId} value={personId} onChange={(e) => setPersonId(e.target.value)}>
              <option value="">Everyone</option>
              {people.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </SelectInput>
          </div>
          {recorder && (
            <Button onClick={() => (setDone(null), setRecording(true))} disabled={!list.data}>
              Record training
            </Button>
          )}
        </div>
      )}
      <QueryState isPending={list.isPending} error={list.error} onRetry={() => void list.refetch()} what="the training records">
        {list.data?.truncated && <Notice>Only the newest {list.data.records.length} records are shown. Choose a person to see all of theirs.</Notice>}
        <DataTable
          caption={seesAll ? "Training records" : "My training records"}
          data={list.data?.records ?? []}
          columns={columns}
          getRowId={(r) => r.id}
          emptyMessage={seesAll ? "No training is recorded yet." : "No training is recorded for you yet. Ask a supervisor."}
          filterLabel="Filter training records"
        />
      </QueryState>

      <Dialog open={recording} title="Record training" onClose={() => setRecording(false)}>
        {recording && user && (
          <RecordTrainingForm
            people={people}
            selfId={user.id}
            onCancel={() => setRecording(false)}
            onRecorded={(record) => {
              setRecording(false);
              setDone(`Training recorded: ${record.person.name} on ${record.masterRecord.code} version ${record.masterRecord.version}, valid until ${record.validUntil}.`);
            }}
          />
        )}
      </Dialog>
      <Dialog open={withdrawing !== null} title="Withdraw training" onClose={() => setWithdrawing(null)}>
        {withdrawing && (
          <WithdrawTrainingForm
            key={withdrawing.id}
            record={withdrawing}
            onCancel={() => setWithdrawing(null)}
            onDone={() => {
              setDone(`The training of ${withdrawing.person.name} on ${withdrawing.masterRecord.code} version ${withdrawing.masterRecord.version} is withdrawn.`);
              setWithdrawing(null);
            }}
          />
        )}
      </Dialog>
    </div>
  );
}

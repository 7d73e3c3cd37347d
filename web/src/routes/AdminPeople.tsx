import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router";
import { Button } from "../components/Button";
import { DataTable } from "../components/DataTable";
import { Dialog } from "../components/Dialog";
import { Notice } from "../components/Notice";
import { PageIntro } from "../components/PageIntro";
import { QueryState } from "../components/QueryState";
import { CreatePersonForm } from "../features/people/CreatePersonForm";
import { PersonActionForm } from "../features/people/PersonActionForm";
import { peopleColumns } from "../features/people/peopleColumns";
import { actionDoneMessage, actionTitle, type PersonAction } from "../features/people/personActions";
import { peopleListQueryOptions } from "../features/people/queries";

/** The administrator's accounts screen: list, create, and change accounts with a reason. */
export default function AdminPeople() {
  const people = useQuery(peopleListQueryOptions());
  const [creating, setCreating] = useState(false);
  const [action, setAction] = useState<PersonAction | null>(null);
  const [done, setDone] = useState<string | null>(null);
  // The state setters are stable, so the columns never need rebuilding.
  const columns = useMemo(
    () =>
      peopleColumns((next) => {
        setDone(null);
        setAction(next);
      }),
    [],
  );

  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link to="/admin">Administrator</Link> <span aria-hidden="true">›</span> People
      </p>
      <PageIntro title="People">
        <p>Everyone who can sign in to Isobatch. Each change asks for a reason and is recorded in the audit trail.</p>
      </PageIntro>
      <div aria-live="polite">{done && <Notice tone="success">{done}</Notice>}</div>
      <Button
        className="self-start"
        onClick={() => {
          setDone(null);
          setCreating(true);
        }}
      >
        Add a person
      </Button>
      <QueryState
        isPending={people.isPending}
        error={people.error}
        onRetry={() => void people.refetch()}
        what="the accounts"
      >
        <DataTable
          caption="Accounts"
          data={people.data ?? []}
          columns={columns}
          getRowId={(person) => person.id}
          emptyMessage="There are no accounts yet."
          filterLabel="Filter accounts"
          initialSorting={[{ id: "name", desc: false }]}
        />
      </QueryState>

      <Dialog open={creating} title="Add a person" onClose={() => setCreating(false)}>
        <CreatePersonForm
          onCancel={() => setCreating(false)}
          onCreated={(person) => {
            setCreating(false);
            setDone(`An account for ${person.name} was created. They must choose a new password at their first sign-in.`);
          }}
        />
      </Dialog>

      <Dialog open={action !== null} title={action ? actionTitle(action) : ""} onClose={() => setAction(null)}>
        {action && (
          <PersonActionForm
            key={`${action.kind}-${action.person.id}`}
            action={action}
            onCancel={() => setAction(null)}
            onDone={() => {
              setDone(actionDoneMessage(action));
              setAction(null);
            }}
          />
        )}
      </Dialog>
    </div>
  );
}

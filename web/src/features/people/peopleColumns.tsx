import { createColumnHelper } from "@tanstack/react-table";
import type { Person } from "../../api/types";
import { describeRoles } from "../session/roles";
import { formatDateTime } from "../../lib/formatDateTime";
import { ACTION_BUTTON_LABELS, availableActions, type PersonAction } from "./personActions";

const column = createColumnHelper<Person>();

/** Plain-word account states; shown as text so they never rely on colour alone. */
export function personStates(person: Person): string[] {
  const states = [person.active ? "Active" : "Deactivated"];
  if (person.locked) states.push("Locked");
  if (person.mustChangePassword) states.push("Must change password");
  if (person.failedSignIns > 0) {
    states.push(`${person.failedSignIns} failed sign-in${person.failedSignIns === 1 ? "" : "s"}`);
  }
  return states;
}

function StateBadges({ person }: { person: Person }) {
  return (
    <ul className="flex flex-wrap gap-1">
      {personStates(person).map((state) => (
        <li
          key={state}
          className={`rounded-sm border px-2 text-[0.85rem] font-semibold whitespace-nowrap ${
            state === "Active"
              ? "border-ok-800 bg-ok-50 text-ok-800"
              : state === "Locked" || state === "Deactivated"
                ? "border-alarm-800 bg-alarm-50 text-alarm-800"
                : state === "Must change password"
                  ? "border-caution-500 bg-caution-50 text-caution-800"
                  : "border-ink-400 bg-white text-ink-800"
          }`}
        >
          {state}
        </li>
      ))}
    </ul>
  );
}

/** Columns of the accounts table; `onAction` opens the dialog for a row action. */
export function peopleColumns(onAction: (action: PersonAction) => void) {
  return [
    // Name and email share a cell (and the filter text) to keep the row actions in view.
    column.accessor((person) => `${person.name} ${person.email}`, {
      id: "name",
      header: "Person",
      cell: (info) => (
        <>
          <span className="block font-semibold">{info.row.original.name}</span>
          <span className="block min-w-60 text-[0.9rem] text-ink-700 [overflow-wrap:anywhere]">{info.row.original.email}</span>
        </>
      ),
    }),
    column.accessor((person) => describeRoles(person.roles), { id: "roles", header: "Roles" }),
    column.accessor((person) => personStates(person).join(", "), {
      id: "state",
      header: "State",
      cell: (info) => <StateBadges person={info.row.original} />,
    }),
    column.accessor((person) => person.lastSignInAt ?? "", {
      id: "lastSignInAt",
      header: "Last sign-in",
      cell: (info) => formatDateTime(info.row.original.lastSignInAt),
    }),
    column.display({
      id: "actions",
      header: "Actions",
      cell: (info) => {
        const person = info.row.original;
        return (
          <div className="flex w-72 flex-wrap gap-2">
            {availableActions(person).map((kind) => (
              <button
                key={kind}
                type="button"
                onClick={() => onAction({ kind, person })}
                className="min-h-11 rounded-md border-2 border-ink-400 bg-white px-3 font-semibold whitespace-nowrap hover:bg-ink-100"
              >
                {ACTION_BUTTON_LABELS[kind]}
                <span className="sr-only"> for {person.name}</span>
              </button>
            ))}
          </div>
        );
      },
    }),
  ];
}

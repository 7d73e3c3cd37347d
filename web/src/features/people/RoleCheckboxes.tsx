import { ROLES, type Role } from "../../api/types";
import { ROLE_LABELS } from "../session/roles";

export interface RoleCheckboxesProps {
  idPrefix: string;
  value: Role[];
  onChange: (roles: Role[]) => void;
  error?: string;
}

/** A labelled group of role checkboxes; keeps the chosen roles in the standard order. */
export function RoleCheckboxes({ idPrefix, value, onChange, error }: RoleCheckboxesProps) {
  const toggle = (role: Role, checked: boolean) => {
    const next = new Set(value);
    if (checked) next.add(role);
    else next.delete(role);
    onChange(ROLES.filter((candidate) => next.has(candidate)));
  };

  return (
    <fieldset
      aria-describedby={error ? `${idPrefix}-error` : undefined}
      aria-invalid={error ? true : undefined}
      className="flex flex-col gap-1"
    >
      <legend className="mb-1 font-semibold">Roles</legend>
      <div className="flex flex-wrap gap-x-5">
        {ROLES.map((role) => (
          <label
            key={role}
            htmlFor={`${idPrefix}-${role}`}
            className="inline-flex min-h-11 cursor-pointer items-center gap-2"
          >
            <input
              id={`${idPrefix}-${role}`}
              type="checkbox"
              checked={value.includes(role)}
              onChange={(event) => toggle(role, event.target.checked)}
              className="h-6 w-6 accent-fen-700"
            />
            {ROLE_LABELS[role]}
          </label>
        ))}
      </div>
      {error && (
        <p id={`${idPrefix}-error`} className="font-semibold text-alarm-800">
          {error}
        </p>
      )}
    </fieldset>
  );
}

import type { Person } from "../../api/types";

/** The changes an administrator can make to one account from its row. */
export type PersonActionKind = "roles" | "deactivate" | "reactivate" | "unlock" | "reset-password";

export interface PersonAction {
  kind: PersonActionKind;
  person: Person;
}

/** The dialog title for an action on a person. */
export function actionTitle({ kind, person }: PersonAction): string {
  switch (kind) {
    case "roles":
      return `Assign roles to ${person.name}`;
    case "deactivate":
      return `Deactivate ${person.name}`;
    case "reactivate":
      return `Reactivate ${person.name}`;
    case "unlock":
      return `Unlock ${person.name}`;
    case "reset-password":
      return `Reset the password of ${person.name}`;
  }
}

/** The confirmation shown once an action has gone through. */
export function actionDoneMessage({ kind, person }: PersonAction): string {
  switch (kind) {
    case "roles":
      return `The roles of ${person.name} were changed.`;
    case "deactivate":
      return `${person.name} was deactivated and can no longer sign in.`;
    case "reactivate":
      return `${person.name} was reactivated and can sign in again.`;
    case "unlock":
      return `${person.name} was unlocked.`;
    case "reset-password":
      return `The password of ${person.name} was reset. They must choose a new one at their next sign-in.`;
  }
}

/** The actions offered for a person in their current state. */
export function availableActions(person: Person): PersonActionKind[] {
  const kinds: PersonActionKind[] = ["roles"];
  kinds.push(person.active ? "deactivate" : "reactivate");
  if (person.locked) kinds.push("unlock");
  kinds.push("reset-password");
  return kinds;
}

/** The short button text for each action. */
export const ACTION_BUTTON_LABELS: Record<PersonActionKind, string> = {
  roles: "Roles",
  deactivate: "Deactivate",
  reactivate: "Reactivate",
  unlock: "Unlock",
  "reset-password": "Reset password",
};

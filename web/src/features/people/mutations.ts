import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiPost, apiPut } from "../../api/client";
import type { Person, Role } from "../../api/types";
import { auditKeys } from "../audit/queries";
import { peopleKeys } from "./queries";

export interface CreatePersonInput {
  email: string;
  name: string;
  roles: Role[];
  temporaryPassword: string;
  reason: string;
}

export interface PersonChangeInput {
  personId: string;
  reason: string;
}

type PersonResponse = { person: Person };

/** Shared wiring: every account change refreshes the people list and the audit trail. */
function usePersonChange<TInput>(send: (input: TInput) => Promise<PersonResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: peopleKeys.all }),
        queryClient.invalidateQueries({ queryKey: auditKeys.all }),
      ]);
    },
  });
}

function personPath(personId: string, action: string): string {
  return `/api/people/${encodeURIComponent(personId)}/${action}`;
}

/** POST /api/people: creates an account with a temporary password. */
export function useCreatePersonMutation() {
  return usePersonChange((input: CreatePersonInput) =>
    apiPost<PersonResponse>("/api/people", input),
  );
}

/** PUT /api/people/:id/roles: replaces a person's roles. */
export function useAssignRolesMutation() {
  return usePersonChange(({ personId, roles, reason }: PersonChangeInput & { roles: Role[] }) =>
    apiPut<PersonResponse>(personPath(personId, "roles"), { roles, reason }),
  );
}

/** POST /api/people/:id/deactivate: stops a person from signing in. */
export function useDeactivatePersonMutation() {
  return usePersonChange(({ personId, reason }: PersonChangeInput) =>
    apiPost<PersonResponse>(personPath(personId, "deactivate"), { reason }),
  );
}

/** POST /api/people/:id/reactivate: lets a deactivated person sign in again. */
export function useReactivatePersonMutation() {
  return usePersonChange(({ personId, reason }: PersonChangeInput) =>
    apiPost<PersonResponse>(personPath(personId, "reactivate"), { reason }),
  );
}

/** POST /api/people/:id/unlock: clears a lock left by failed sign-ins. */
export function useUnlockPersonMutation() {
  return usePersonChange(({ personId, reason }: PersonChangeInput) =>
    apiPost<PersonResponse>(personPath(personId, "unlock"), { reason }),
  );
}

/** POST /api/people/:id/reset-password: sets a temporary password to be changed at sign-in. */
export function useResetPasswordMutation() {
  return usePersonChange(
    ({ personId, temporaryPassword, reason }: PersonChangeInput & { temporaryPassword: string }) =>
      apiPost<PersonResponse>(personPath(personId, "reset-password"), { temporaryPassword, reason }),
  );
}

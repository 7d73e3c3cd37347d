import { useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { apiDelete, apiPost } from "../../api/client";
import type { SessionState, SessionUser } from "../../api/types";
import { sessionKeys } from "./queries";

export interface SignInInput {
  email: string;
  password: string;
}

export interface ChangePasswordInput {
  currentPassword: string;
  newPassword: string;
}

/** Forget everything cached for the previous person, keeping only the session entry. */
function clearPersonalData(queryClient: QueryClient): void {
  queryClient.removeQueries({
    predicate: (query) => query.queryKey[0] !== sessionKeys.all[0],
  });
}

/** POST /api/session: signs in and stores the new session and CSRF token. */
export function useSignInMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => apiPost<SessionState>("/api/session", input),
    onSuccess: async (session) => {
      clearPersonalData(queryClient);
      queryClient.setQueryData(sessionKeys.current(), session);
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

/** DELETE /api/session: signs out and fetches the fresh anonymous session. */
export function useSignOutMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: sessionKeys.signOut(),
    mutationFn: () => apiDelete("/api/session"),
    onSettled: async () => {
      clearPersonalData(queryClient);
      queryClient.setQueryData<SessionState>(sessionKeys.current(), (old) =>
        old ? { ...old, user: null } : old,
      );
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

/** POST /api/session/password: changes the signed-in person's own password. */
export function useChangePasswordMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ChangePasswordInput) =>
      apiPost<{ user: SessionUser }>("/api/session/password", input),
    onSuccess: async ({ user }) => {
      queryClient.setQueryData<SessionState>(sessionKeys.current(), (old) =>
        old ? { ...old, user } : old,
      );
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

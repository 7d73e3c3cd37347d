import type { QueryClient } from "@tanstack/react-query";
import { SESSION_EXPIRED_MESSAGE, type SessionBridge } from "../api/client";
import type { SessionState } from "../api/types";
import { sessionKeys, sessionQueryOptions } from "../features/session/queries";
import { setSignInNotice } from "./signInNotice";

/** The part of the data router the bridge needs. */
interface Navigator {
  navigate: (to: string, options?: { replace?: boolean; state?: unknown }) => unknown;
  state: { location: { pathname: string } };
}

/** Wires the API client to the session query cache and to the router. */
export function createSessionBridge(queryClient: QueryClient, router: Navigator): SessionBridge {
  return {
    getCsrfToken: async () => (await queryClient.ensureQueryData(sessionQueryOptions())).csrfToken,

    refreshCsrfToken: async () => {
      await queryClient.fetchQuery({ ...sessionQueryOptions(), staleTime: 0 });
    },

    onSessionExpired: () => {
      const from = router.state.location.pathname;
      if (from === "/sign-in") return;
      setSignInNotice(SESSION_EXPIRED_MESSAGE);
      // Clear the person first, so the sign-in screen does not bounce them straight back.
      queryClient.setQueryData<SessionState>(sessionKeys.current(), (old) =>
        old ? { ...old, user: null } : old,
      );
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
      void router.navigate("/sign-in", {
        replace: true,
        state: { from },
      });
      void queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },

    onPasswordChangeRequired: () => {
      void queryClient.invalidateQueries({ queryKey: sessionKeys.all });
      if (router.state.location.pathname !== "/change-password") {
        void router.navigate("/change-password", { replace: true });
      }
    },
  };
}

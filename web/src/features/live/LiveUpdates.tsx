import { useEffect, type ReactNode } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { useSession } from "../session/useSession";
import { invalidateAfterGap, invalidateForChange, parseLiveChange } from "./liveChanges";

const RECONNECT_MS = 5_000;

/**
 * Keeps one server-sent-event stream (GET /api/live) open while someone is signed in and turns
 * each change into query invalidations, so every screen shows new work without a reload.
 */
export function LiveUpdates({ children }: { children: ReactNode }) {
  const queryClient = useQueryClient();
  const { user } = useSession();
  const userId = user?.id ?? null;
  const blocked = user?.mustChangePassword ?? true;

  useEffect(() => {
    if (!userId || blocked || typeof EventSource === "undefined") return;
    let source: EventSource | null = null;
    let retry: ReturnType<typeof setTimeout> | undefined;
    let opened = false;
    let stopped = false;

    const connect = () => {
      source = new EventSource("/api/live", { withCredentials: true });
      source.addEventListener("open", () => {
        if (opened) invalidateAfterGap(queryClient);
        opened = true;
      });
      source.addEventListener("change", (event) => {
        const change = parseLiveChange((event as MessageEvent).data);
        if (change) invalidateForChange(queryClient, change);
      });
      source.addEventListener("error", () => {
        // The browser retries a dropped stream itself; a refused one (e.g. 401) is closed for good.
        if (source?.readyState === EventSource.CLOSED && !stopped) {
          source.close();
          retry = setTimeout(connect, RECONNECT_MS);
        }
      });
    };
    connect();
    return () => {
      stopped = true;
      if (retry) clearTimeout(retry);
      source?.close();
    };
  }, [queryClient, userId, blocked]);

  return <>{children}</>;
}

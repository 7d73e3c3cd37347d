import type pg from "pg";
import { sql } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { listenOn, type NotificationListener } from "./notificationListener.js";

/** The PostgreSQL channel every change is announced on. */
export const LIVE_CHANNEL = "isobatch_changes";

export interface Change {
  /** For "training", the id is the trainee's: their batch pages may now allow or refuse steps. */
  kind: "batch" | "deviation" | "queue" | "training";
  id: string;
}

/** Announces a change when the caller's transaction commits (PostgreSQL NOTIFY), to every app server. */
export async function announce(tx: DbOrTx, change: Change): Promise<void> {
  await tx.execute(sql`select pg_notify(${LIVE_CHANNEL}, ${JSON.stringify(change)})`);
}

/**
 * Hands each announced change to the subscribers (the server-sent-event streams), listening on
 * one dedicated connection from the first subscription on (`listenOn` reconnects by itself).
 */
export function createChangeFeed(pool: pg.Pool, log: { warn: (o: object, m: string) => void }) {
  const subscribers = new Set<(c: Change) => void>();
  let listener: NotificationListener | undefined;
  const deliver = (payload: string) => {
    let change: Change;
    try {
      change = JSON.parse(payload) as Change;
    } catch {
      return; // not ours
    }
    for (const s of subscribers) s(change);
  };

  return {
    subscribe(fn: (c: Change) => void) {
      subscribers.add(fn);
      listener ??= listenOn(pool, LIVE_CHANNEL, { onNotification: deliver }, log, 2000);
      return () => subscribers.delete(fn);
    },
    close() {
      listener?.close();
      listener = undefined;
    },
  };
}

export type ChangeFeed = ReturnType<typeof createChangeFeed>;

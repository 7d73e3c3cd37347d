import type pg from "pg";
import { sql } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";

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
 * Listens on one dedicated connection and hands each change to the subscribers (the
 * server-sent-event streams). Reconnects by itself when the database comes back.
 */
export function createChangeFeed(pool: pg.Pool, log: { warn: (o: object, m: string) => void }) {
  const subscribers = new Set<(c: Change) => void>();
  let client: pg.PoolClient | undefined;
  let closed = false;
  let retry: NodeJS.Timeout | undefined;

  async function connect() {
    if (closed || client) return;
    try {
      const c = await pool.connect();
      client = c;
      c.on("notification", (msg) => {
        if (!msg.payload) return;
        try {
          const change = JSON.parse(msg.payload) as Change;
          for (const s of subscribers) s(change);
        } catch {
          /* not ours */
        }
      });
      c.on("error", () => {
        client = undefined;
        c.release(true);
        schedule();
      });
      await c.query(`LISTEN ${LIVE_CHANNEL}`);
    } catch (err) {
      client = undefined;
      log.warn({ err: (err as Error).message }, "live updates: cannot listen yet; retrying");
      schedule();
    }
  }
  const schedule = () => {
    if (!closed) retry = setTimeout(connect, 2000);
  };

  return {
    subscribe(fn: (c: Change) => void) {
      subscribers.add(fn);
      void connect();
      return () => subscribers.delete(fn);
    },
    close() {
      closed = true;
      if (retry) clearTimeout(retry);
      client?.release(true);
      client = undefined;
    },
  };
}

export type ChangeFeed = ReturnType<typeof createChangeFeed>;

import type pg from "pg";

export interface NotificationHandlers {
  /** One notification's payload ("" when it had none). */
  onNotification(payload: string): void;
  /** True once LISTEN holds; false when the connection is lost or the listener closed. */
  onListening?(listening: boolean): void;
}

export interface NotificationListener {
  close(): void;
}

/**
 * One dedicated connection LISTENing on `channel` (a fixed name of ours, never user input). It
 * reconnects by itself, `retryMs` after the connection is lost or cannot be had; what was
 * announced meanwhile is not heard, which `onListening(false)` lets the caller allow for.
 */
export function listenOn(pool: pg.Pool, channel: string, handlers: NotificationHandlers, log: { warn: (o: object, m: string) => void }, retryMs: number): NotificationListener {
  let client: pg.PoolClient | undefined;
  let closed = false;
  let retry: NodeJS.Timeout | undefined;

  const schedule = () => {
    if (!closed) retry = setTimeout(connect, retryMs);
  };
  const lost = (c: pg.PoolClient, err?: unknown) => {
    if (client !== c) return;
    client = undefined;
    handlers.onListening?.(false);
    c.release(true);
    if (!closed) log.warn({ channel, err: err instanceof Error ? err.message : undefined }, "lost the connection listening for database announcements; listening again shortly");
    schedule();
  };

  async function connect() {
    if (closed || client) return;
    let c: pg.PoolClient | undefined;
    try {
      c = await pool.connect();
      const mine = c;
      client = c;
      c.on("notification", (msg) => {
        if (msg.channel === channel) handlers.onNotification(msg.payload ?? "");
      });
      c.on("error", (err) => lost(mine, err));
      c.on("end", () => lost(mine));
      await c.query(`LISTEN ${channel}`);
      if (!closed && client === c) handlers.onListening?.(true);
    } catch (err) {
      if (c) return lost(c, err);
      log.warn({ channel, err: (err as Error).message }, "cannot listen for database announcements yet; retrying");
      schedule();
    }
  }
  void connect();

  return {
    close() {
      closed = true;
      if (retry) clearTimeout(retry);
      const c = client;
      client = undefined;
      c?.release(true);
      handlers.onListening?.(false);
    },
  };
}

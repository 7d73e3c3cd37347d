import { afterAll, beforeAll, describe, expect, inject, it, vi } from "vitest";
import pg from "pg";
import { listenOn } from "../../../server/services/notificationListener.js";
import { createChangeFeed, type Change } from "../../../server/services/live.js";

// The one listening connection the live change feed and the session cache both use.
const quiet = { warn: () => undefined };
let pool: pg.Pool;
let outside: pg.Client;
beforeAll(async () => {
  pool = new pg.Pool({ connectionString: inject("databaseUrl"), max: 3 });
  outside = new pg.Client({ connectionString: inject("databaseUrl") });
  await outside.connect();
});
afterAll(async () => {
  await outside.end();
  await pool.end();
});

const until = (done: () => boolean) => vi.waitUntil(done, { timeout: 5000, interval: 10 });

describe("listenOn", () => {
  it("hands over its channel's payloads, says when it listens, and listens again after losing its connection", async () => {
    const channel = "isobatch_listener_test";
    const heard: string[] = [];
    const states: boolean[] = [];
    const listener = listenOn(pool, channel, { onNotification: (p) => heard.push(p), onListening: (l) => states.push(l) }, quiet, 50);
    try {
      await until(() => states.at(-1) === true);
      await outside.query("select pg_notify($1, 'one'), pg_notify('isobatch_other_channel', 'not ours')", [channel]);
      await until(() => heard.length === 1);
      await outside.query("select pg_terminate_backend(pid) from pg_stat_activity where query = $1", [`LISTEN ${channel}`]);
      await until(() => states.at(-1) === false);
      await until(() => states.at(-1) === true);
      await outside.query("select pg_notify($1, 'two')", [channel]);
      await until(() => heard.length === 2);
      expect(heard).toEqual(["one", "two"]);
      expect(states).toEqual([true, false, true]);
    } finally {
      listener.close();
    }
    expect(states.at(-1)).toBe(false);
  });
});

describe("the live change feed", () => {
  it("gives each subscriber the changes announced after it subscribed, and ignores payloads not its own", async () => {
    const feed = createChangeFeed(pool, quiet);
    const got: Change[] = [];
    feed.subscribe((c) => got.push(c));
    try {
      const id = `batch-${Date.now()}`;
      // Announced until heard: the feed starts listening on the first subscription.
      await until(() => {
        if (got.some((c) => c.id === id)) return true;
        void outside.query("select pg_notify('isobatch_changes', 'not json'), pg_notify('isobatch_changes', $1)", [JSON.stringify({ kind: "batch", id })]);
        return false;
      });
      expect(got.filter((c) => c.id === id)[0]).toEqual({ kind: "batch", id });
    } finally {
      feed.close();
    }
  });
});

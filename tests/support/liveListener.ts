import type pg from "pg";
import { LIVE_CHANNEL } from "../../server/services/live.js";

/** Listens on the live-change channel; `heard` collects each payload until `stop()`. */
export async function listenForChanges(pool: pg.Pool): Promise<{ heard: string[]; stop: () => void }> {
  const client = await pool.connect();
  const heard: string[] = [];
  client.on("notification", (m) => heard.push(m.payload ?? ""));
  await client.query(`listen ${LIVE_CHANNEL}`);
  return { heard, stop: () => client.release() };
}

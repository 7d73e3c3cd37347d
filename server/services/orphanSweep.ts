import { inArray } from "drizzle-orm";
import type { Db } from "../db/client.js";
import { files } from "../db/schema.js";
import type { StorageService } from "./storage.js";

/**
 * Removes objects that no files row names and that are older than `minAgeMs` (younger ones may
 * still be uploads on their way to their row). Such orphans are left when the store kept an
 * object but its answer was lost, or the server stopped between storing and recording.
 */
export async function sweepOrphanObjects(db: Db, storage: StorageService, minAgeMs: number, now = Date.now()): Promise<string[]> {
  const objects = (await storage.list()).filter((o) => now - o.lastModified.getTime() >= minAgeMs);
  const removed: string[] = [];
  for (let i = 0; i < objects.length; i += 500) {
    const keys = objects.slice(i, i + 500).map((o) => o.key);
    const known = new Set((await db.select({ key: files.storageKey }).from(files).where(inArray(files.storageKey, keys))).map((r) => r.key));
    for (const key of keys.filter((k) => !known.has(k))) {
      await storage.remove(key);
      removed.push(key);
    }
  }
  return removed;
}

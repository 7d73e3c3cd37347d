import { asc, eq } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { batchTraces } from "../db/schema.js";
import type { Trace } from "../../shared/kinetics/trace.js";

/**
 * All of a batch's trace files as one trace, in time order. A later file adds readings; a reading
 * at a time already covered by an earlier file is left out rather than replacing it.
 */
export async function combinedTrace(db: DbOrTx, batchId: string): Promise<Trace & { files: number }> {
  const rows = await db.select().from(batchTraces).where(eq(batchTraces.batchId, batchId)).orderBy(asc(batchTraces.addedAt));
  const points: { t: number; V: number; T?: number; P?: number }[] = [];
  const seen = new Set<number>();
  for (const r of rows) {
    r.t.forEach((t, i) => {
      if (seen.has(t)) return;
      seen.add(t);
      points.push({ t, V: r.V[i], T: r.T?.[i], P: r.P?.[i] });
    });
  }
  points.sort((a, b) => a.t - b.t);
  const hasT = points.length > 0 && points.every((p) => p.T !== undefined && p.T !== null);
  const hasP = points.length > 0 && points.every((p) => p.P !== undefined && p.P !== null);
  return {
    t: points.map((p) => p.t),
    V: points.map((p) => p.V),
    ...(hasT ? { T: points.map((p) => p.T!) } : {}),
    ...(hasP ? { P: points.map((p) => p.P!) } : {}),
    files: rows.length,
  };
}

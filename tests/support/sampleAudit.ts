import { sql } from "drizzle-orm";
import type { Db } from "../../server/db/client.js";

export interface SampleAuditReport {
  /** Sample rows stored for the batches looked at. */
  stored: number;
  /** Acknowledged (2xx) sample ids that have no row. */
  missing: string[];
  /** Stored sample rows (acknowledged or not) without their "sample-recorded" audit row. */
  withoutAudit: string[];
}

/** Compares the acknowledged sample ids with batch_samples and their audit rows, for the given batches. */
export async function checkSampleAudit(db: Db, batchIds: string[], acknowledged: Iterable<string>): Promise<SampleAuditReport> {
  if (batchIds.length === 0) return { stored: 0, missing: [...acknowledged], withoutAudit: [] };
  const ids = sql.join(batchIds.map((id) => sql`${id}::uuid`), sql`, `);
  const result = await db.execute<{ id: string; audited: boolean }>(sql`
    select s.id::text as id, exists (
      select 1 from audit_events a
      where a.action = 'sample-recorded' and a.entity_type = 'batch'
        and a.entity_id = s.batch_id::text and a.after->>'sampleId' = s.id::text
    ) as audited
    from batch_samples s where s.batch_id in (${ids})`);
  const stored = new Set(result.rows.map((r) => r.id));
  return {
    stored: stored.size,
    missing: [...new Set(acknowledged)].filter((id) => !stored.has(id)),
    withoutAudit: result.rows.filter((r) => !r.audited).map((r) => r.id),
  };
}

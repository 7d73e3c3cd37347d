import { sql } from "drizzle-orm";
import type { Db } from "../db/client.js";

export type AuditChainReport = { ok: true; checked: number } | { ok: false; checked: number; brokenAt: { seq: number; reason: string } };

/**
 * Walks the whole chain in the database: each row's stored hash must equal the digest of its
 * content, its prev_hash must equal the previous row's hash, and no sequence number may be missing.
 */
export async function verifyAuditChain(db: Db): Promise<AuditChainReport> {
  const result = await db.execute<{ seq: string; problem: string | null; checked: string }>(sql`
    with walked as (
      select seq, hash, prev_hash, audit_event_digest(a) as digest,
             lag(hash) over (order by seq) as previous_hash,
             lag(seq) over (order by seq) as previous_seq
      from audit_events a
    ), problems as (
      select seq,
        case
          when previous_seq is null and seq <> 1 then 'the chain does not start at 1: rows before ' || seq || ' are missing'
          when previous_seq is not null and seq <> previous_seq + 1 then 'row ' || (previous_seq + 1) || ' is missing'
          when prev_hash <> coalesce(previous_hash, '') then 'its link to the previous row does not match'
          when hash <> digest then 'its content no longer matches its hash'
        end as problem
      from walked
    )
    select (select count(*) from audit_events)::text as checked, seq::text, problem
    from problems where problem is not null order by seq limit 1`);
  const rows = result.rows;
  if (rows.length === 0) {
    const count = await db.execute<{ n: string }>(sql`select count(*)::text as n from audit_events`);
    return { ok: true, checked: Number(count.rows[0].n) };
  }
  return { ok: false, checked: Number(rows[0].checked), brokenAt: { seq: Number(rows[0].seq), reason: rows[0].problem! } };
}

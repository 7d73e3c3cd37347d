import { randomUUID } from "node:crypto";
import type pg from "pg";
import { LIVE_CHANNEL } from "../services/live.js";
import { conflict, HttpError } from "../http/errors.js";
import type { SignedInPerson } from "../policies/access.js";

// Samples are the floor's most frequent write. One statement (so one transaction and one round
// trip) locks the batch row, checks its state, writes the sample and its audit row (the chain
// trigger runs as for any audit row) and announces the change; named, so it is planned once per
// connection.
const WRITE_SAMPLE = {
  name: "write_sample",
  text: `
    with target as (select id, state from batches where id = $1 for update),
    sample as (
      insert into batch_samples (id, batch_id, sampled_at, volume_l, lab_result, file_id, taken_by)
      select $2::uuid, target.id, $3::timestamptz, $4::double precision, $5::text, $6::uuid, $7::uuid
      from target where target.state in ('running', 'sampling')
      returning id, recorded_at),
    audited as (
      insert into audit_events (actor_id, actor_name, action, entity_type, entity_id, after)
      select $7::uuid, $8::text, 'sample-recorded', 'batch', $1::text, $9::jsonb from sample
      returning seq),
    announced as (select pg_notify($10::text, $11::text) from audited)
    select target.state, sample.recorded_at, (select count(*) from announced) as announced
    from target left join sample on true`,
};

export interface SampleInput {
  sampledAt: Date;
  volumeL: number;
  labResult: string | null;
  fileId: string | null;
}

/** Writes a sample of a running or sampling batch with its audit row; 404 or 409 in words otherwise. */
export async function writeSample(pool: pg.Pool, person: SignedInPerson, batchId: string, input: SampleInput) {
  const sample = { id: randomUUID(), batchId, ...input, takenBy: person.id };
  const after = { sampleId: sample.id, sampledAt: sample.sampledAt.toISOString(), volumeL: sample.volumeL, labResult: sample.labResult, fileId: sample.fileId };
  const values = [batchId, sample.id, after.sampledAt, sample.volumeL, sample.labResult, sample.fileId, person.id, person.name, JSON.stringify(after), LIVE_CHANNEL, JSON.stringify({ kind: "batch", id: batchId })];
  const result = await pool.query<{ state: string; recorded_at: Date | null }>({ ...WRITE_SAMPLE, values });
  const [row] = result.rows;
  if (!row) throw new HttpError(404, "not-found", "That batch was not found.");
  if (!row.recorded_at) throw conflict("wrong-phase", `Samples are recorded while the batch is running or sampling; it is ${row.state}.`);
  return { ...sample, recordedAt: row.recorded_at };
}

-- The audit trail is append-only and hash-chained. Each row's hash covers its own content and
-- the previous row's hash, so any later change to a row, or a removed row, breaks the chain.
CREATE FUNCTION audit_event_digest(e audit_events) RETURNS text
LANGUAGE sql STABLE AS $$
  SELECT encode(sha256(convert_to(concat_ws('|',
    e.prev_hash,
    e.seq::text,
    to_char(e.occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"'),
    coalesce(e.actor_id::text, ''),
    e.actor_name,
    e.action,
    e.entity_type,
    e.entity_id,
    coalesce(e.before::text, 'null'),
    coalesce(e.after::text, 'null'),
    coalesce(e.reason, '')
  ), 'UTF8')), 'hex')
$$;
--> statement-breakpoint
CREATE FUNCTION audit_events_chain() RETURNS trigger
LANGUAGE plpgsql AS $$
DECLARE
  last_row record;
BEGIN
  -- One writer at a time extends the chain; the lock ends with the transaction.
  PERFORM pg_advisory_xact_lock(hashtext('audit_events_chain'));
  SELECT seq, hash INTO last_row FROM audit_events ORDER BY seq DESC LIMIT 1;
  NEW.seq := coalesce(last_row.seq, 0) + 1;
  NEW.prev_hash := coalesce(last_row.hash, '');
  NEW.occurred_at := clock_timestamp();
  NEW.hash := audit_event_digest(NEW);
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER audit_events_chain BEFORE INSERT ON audit_events
FOR EACH ROW EXECUTE FUNCTION audit_events_chain();
--> statement-breakpoint
CREATE FUNCTION audit_events_refuse_change() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'audit_events is append-only: % is not allowed', TG_OP
    USING ERRCODE = 'insufficient_privilege';
END
$$;
--> statement-breakpoint
CREATE TRIGGER audit_events_append_only BEFORE UPDATE OR DELETE ON audit_events
FOR EACH ROW EXECUTE FUNCTION audit_events_refuse_change();
--> statement-breakpoint
CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
FOR EACH STATEMENT EXECUTE FUNCTION audit_events_refuse_change();

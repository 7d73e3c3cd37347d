-- Entries are never overwritten: a correction is a new row. Traces and attachments likewise stay.
CREATE TRIGGER step_entries_append_only BEFORE UPDATE OR DELETE ON step_entries
FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
--> statement-breakpoint
CREATE TRIGGER batch_traces_append_only BEFORE UPDATE OR DELETE ON batch_traces
FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
--> statement-breakpoint
CREATE TRIGGER batch_attachments_append_only BEFORE UPDATE OR DELETE ON batch_attachments
FOR EACH ROW EXECUTE FUNCTION refuse_record_change();

-- Check results and released records are kept as run and as issued.
CREATE TRIGGER kinetics_checks_append_only BEFORE UPDATE OR DELETE ON kinetics_checks
FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
--> statement-breakpoint
CREATE TRIGGER batch_record_documents_append_only BEFORE UPDATE OR DELETE ON batch_record_documents
FOR EACH ROW EXECUTE FUNCTION refuse_record_change();

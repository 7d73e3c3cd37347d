-- A training record is never deleted. The one change allowed is its withdrawal, once: the three
-- withdrawal columns go from empty to filled and nothing else in the row moves.
CREATE FUNCTION training_records_guard() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'UPDATE'
     AND OLD.withdrawn_at IS NULL AND OLD.withdrawn_by IS NULL AND OLD.withdraw_reason IS NULL
     AND NEW.withdrawn_at IS NOT NULL AND NEW.withdrawn_by IS NOT NULL AND NEW.withdraw_reason IS NOT NULL
     AND (NEW.id, NEW.person_id, NEW.master_record_version_id, NEW.trained_on, NEW.valid_until, NEW.note, NEW.recorded_by, NEW.recorded_at)
         IS NOT DISTINCT FROM (OLD.id, OLD.person_id, OLD.master_record_version_id, OLD.trained_on, OLD.valid_until, OLD.note, OLD.recorded_by, OLD.recorded_at)
  THEN
    RETURN NEW;
  END IF;
  IF TG_OP = 'UPDATE' THEN
    RAISE EXCEPTION 'training_records: a record is only ever withdrawn, once; nothing else in it changes'
      USING ERRCODE = 'insufficient_privilege';
  END IF;
  RAISE EXCEPTION 'training_records are never removed (%): withdraw the record instead', TG_OP
    USING ERRCODE = 'insufficient_privilege';
END
$$;
--> statement-breakpoint
CREATE TRIGGER training_records_guard BEFORE UPDATE OR DELETE ON training_records
FOR EACH ROW EXECUTE FUNCTION training_records_guard();
--> statement-breakpoint
CREATE TRIGGER training_records_no_truncate BEFORE TRUNCATE ON training_records
FOR EACH STATEMENT EXECUTE FUNCTION training_records_guard();

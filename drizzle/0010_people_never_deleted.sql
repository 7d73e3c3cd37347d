-- A person is never deleted (they may have signed records); accounts are deactivated instead,
-- so an id is never freed for reuse.
CREATE FUNCTION refuse_person_delete() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'people are never deleted: deactivate the account instead'
    USING ERRCODE = 'insufficient_privilege';
END
$$;
--> statement-breakpoint
CREATE TRIGGER people_never_deleted BEFORE DELETE ON people
FOR EACH ROW EXECUTE FUNCTION refuse_person_delete();
--> statement-breakpoint
CREATE TRIGGER people_never_truncated BEFORE TRUNCATE ON people
FOR EACH STATEMENT EXECUTE FUNCTION refuse_person_delete();

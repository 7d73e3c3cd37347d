-- App servers keep recently read sessions in memory. Whatever can change what a session grants
-- (the session row itself, or its person: deactivated, locked, roles, password) is announced on
-- commit, so every server forgets its copy before the next request. 's' + sid, 'p' + person id,
-- or '*' for everything.
CREATE FUNCTION announce_session_change() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_LEVEL = 'STATEMENT' THEN
    PERFORM pg_notify('isobatch_sessions', '*');
  ELSIF TG_TABLE_NAME = 'people' THEN
    PERFORM pg_notify('isobatch_sessions', 'p' || OLD.id::text);
  ELSE
    PERFORM pg_notify('isobatch_sessions', 's' || OLD.sid);
  END IF;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER session_changed AFTER UPDATE OR DELETE ON "session"
FOR EACH ROW EXECUTE FUNCTION announce_session_change();
--> statement-breakpoint
CREATE TRIGGER session_truncated AFTER TRUNCATE ON "session"
FOR EACH STATEMENT EXECUTE FUNCTION announce_session_change();
--> statement-breakpoint
CREATE TRIGGER person_changed AFTER UPDATE ON people
FOR EACH ROW EXECUTE FUNCTION announce_session_change();

import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import type pg from "pg";
import type { Role } from "../../shared/schemas/roles.js";

/** The person a session belongs to, as read together with the session. */
export interface SessionPerson {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  mustChangePassword: boolean;
  active: boolean;
  lockedAt: Date | null;
}

interface Row {
  sess: session.SessionData;
  id: string | null;
  email: string;
  name: string;
  roles: Role[];
  must_change_password: boolean;
  active: boolean;
  locked_at: Date | null;
}

// One round trip per request: the session and its person, read now (so a deactivation or a
// lock takes effect on the next request), by a named statement planned once per connection.
const READ = {
  name: "session_with_person",
  text: `select s.sess, p.id, p.email, p.name, p.roles, p.must_change_password, p.active, p.locked_at
         from "session" s left join people p on p.id = (s.sess #>> '{passport,user}')::uuid
         where s.sid = $1 and s.expire >= now()`,
};

/** Where the person read with the session waits for passport, on the request itself. */
const PERSON = Symbol("session person");
type WithPerson = { [PERSON]?: SessionPerson | null };

/**
 * Sessions in the `session` table (connect-pg-simple writes them). The expiry is written with
 * each save (idle time is tracked in the session itself), so the per-request touch is off.
 * The person read with the session is moved onto the request (never into the stored session);
 * `personReadWith(req)` hands it to passport's deserializer.
 */
export function createSessionStore(pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  class SessionStore extends PgStore {
    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void) {
      pool.query<Row>({ ...READ, values: [sid] }).then(
        (result) => {
          const row = result.rows[0];
          if (!row) return fn(null, null);
          const sess = row.sess as session.SessionData & WithPerson;
          sess[PERSON] = row.id ? { id: row.id, email: row.email, name: row.name, roles: row.roles, mustChangePassword: row.must_change_password, active: row.active, lockedAt: row.locked_at } : null;
          fn(null, sess);
        },
        (err) => fn(err),
      );
    }
    // express-session builds the request's session from what get() returned, here.
    override createSession(req: Express.Request, sess: session.SessionData & WithPerson) {
      (req as Express.Request & WithPerson)[PERSON] = sess[PERSON];
      delete sess[PERSON];
      return super.createSession(req as Parameters<session.Store["createSession"]>[0], sess);
    }
  }
  const store = new SessionStore({ pool, tableName: "session", createTableIfMissing: false, pruneSessionInterval: 15 * 60, disableTouch: true });
  return {
    store,
    /** The person read with this request's session; undefined when it was not read that way. */
    personReadWith(req: Express.Request): SessionPerson | null | undefined {
      return (req as Express.Request & WithPerson)[PERSON];
    },
  };
}

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

/**
 * Sessions in the `session` table (connect-pg-simple writes them). The expiry is written with
 * each save (idle time is tracked in the session itself), so the per-request touch is off.
 * `takePerson(sid)` hands the person read with the session to passport's deserializer, once.
 */
export function createSessionStore(pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  const readPeople = new Map<string, SessionPerson | null>();
  class SessionStore extends PgStore {
    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void) {
      pool.query<Row>({ ...READ, values: [sid] }).then(
        (result) => {
          const row = result.rows[0];
          if (!row) return fn(null, null);
          readPeople.set(sid, row.id ? { id: row.id, email: row.email, name: row.name, roles: row.roles, mustChangePassword: row.must_change_password, active: row.active, lockedAt: row.locked_at } : null);
          fn(null, row.sess);
        },
        (err) => fn(err),
      );
    }
  }
  const store = new SessionStore({ pool, tableName: "session", createTableIfMissing: false, pruneSessionInterval: 15 * 60, disableTouch: true });
  return {
    store,
    /** The person read with this session in the current request; undefined when not read. */
    takePerson(sid: string): SessionPerson | null | undefined {
      const person = readPeople.get(sid);
      readPeople.delete(sid);
      return person;
    },
  };
}

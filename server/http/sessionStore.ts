import session from "express-session";
import connectPgSimple from "connect-pg-simple";
import type pg from "pg";
import type { Role } from "../../shared/schemas/roles.js";
import { listenForSessionChanges, type SessionCache } from "./sessionCache.js";

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
  sess: string;
  expires_ms: number;
  id: string | null;
  email: string;
  name: string;
  roles: Role[];
  must_change_password: boolean;
  active: boolean;
  locked_at: Date | null;
}

// The session and its person in one round trip, by a named statement planned once per
// connection; the session as text, so the cache keeps what it parses for each request.
const READ = {
  name: "session_with_person",
  text: `select s.sess::text as sess, extract(epoch from s.expire::timestamptz) * 1000 as expires_ms, p.id, p.email, p.name, p.roles, p.must_change_password, p.active, p.locked_at
         from "session" s left join people p on p.id = (s.sess #>> '{passport,user}')::uuid
         where s.sid = $1 and s.expire >= now()`,
};

/** Where the person read with the session waits for passport, on the request itself. */
const PERSON = Symbol("session person");
type WithPerson = { [PERSON]?: SessionPerson | null };

/**
 * Sessions in the `session` table (connect-pg-simple writes them). The expiry is written with
 * each save (idle time is tracked in the session itself), so the per-request touch is off.
 * A session read is reused for a few seconds (`SessionCache`) while the database's announcements
 * of session and person changes are being heard, so a sign-out, deactivation or lock still takes
 * effect on the next request. The person read with the session is moved onto the request (never
 * into the stored session); `personReadWith(req)` hands it to passport's deserializer.
 */
export function createSessionStore(pool: pg.Pool, cache: SessionCache, log: { warn: (o: object, m: string) => void }) {
  const listener = listenForSessionChanges(pool, cache, log);
  const PgStore = connectPgSimple(session);
  const toRequest = (json: string, person: SessionPerson | null) => {
    const sess = JSON.parse(json) as session.SessionData & WithPerson;
    sess[PERSON] = person;
    return sess;
  };
  // A write's session is forgotten before it starts and again once it is done (the callback this
  // returns), so no read made in between is kept.
  const forgottenAround = (sid: string, fn?: (err?: unknown) => void) => {
    cache.forgetSession(sid);
    return (err?: unknown) => {
      cache.forgetSession(sid);
      fn?.(err);
    };
  };
  class SessionStore extends PgStore {
    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void) {
      const copy = cache.get(sid, Date.now());
      if (copy) return fn(null, toRequest(copy.json, copy.person));
      const token = cache.beginRead();
      pool.query<Row>({ ...READ, values: [sid] }).then(
        (result) => {
          const row = result.rows[0];
          if (!row) return fn(null, null);
          const person = row.id ? { id: row.id, email: row.email, name: row.name, roles: row.roles, mustChangePassword: row.must_change_password, active: row.active, lockedAt: row.locked_at } : null;
          cache.keep(token, sid, { json: row.sess, person, expiresAt: Number(row.expires_ms) }, Date.now());
          fn(null, toRequest(row.sess, person));
        },
        (err) => fn(err),
      );
    }
    override set(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void) {
      super.set(sid, sess, forgottenAround(sid, fn));
    }
    override destroy(sid: string, fn?: (err?: unknown) => void) {
      super.destroy(sid, forgottenAround(sid, fn));
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
    close() {
      listener.close();
      (store as unknown as { close(): void }).close();
    },
  };
}

import type pg from "pg";
import { listenOn, type NotificationListener } from "../services/notificationListener.js";
import type { SessionPerson } from "./sessionStore.js";

/** The PostgreSQL channel that session and person changes are announced on (migration 0013). */
export const SESSION_CHANNEL = "isobatch_sessions";

/** A session row as read from the database, with its person. */
export interface CachedSession {
  /** The stored session as JSON text; parsed afresh for every request, which may change it. */
  json: string;
  person: SessionPerson | null;
  /** When the stored session expires (ms since the epoch). */
  expiresAt: number;
}

interface Entry extends CachedSession {
  storedAt: number;
}

/** No copy is older than 5 s even if an announcement were missed; at most 10 000 are held. */
export const SESSION_CACHE_LIMITS: SessionCacheOptions = { maxAgeMs: 5_000, maxEntries: 10_000 };

export interface SessionCacheOptions {
  /** No copy older than this is used, whatever the announcements say. */
  maxAgeMs: number;
  maxEntries: number;
}

/**
 * Sessions read in the last few seconds, so a busy client's requests do not each read the same
 * session row. A copy is used only while this server listens for the database's announcements
 * of session and person changes (sign-out, deactivation, lock, roles, password), and is dropped
 * the moment one concerns it; with the listener down every request reads the database. Changes
 * made through this server also forget their copies as soon as they commit, without waiting for
 * the announcement (`forgetPerson`, `forgetSession`).
 *
 * A read that was under way when anything was forgotten is not kept (the generation moved on),
 * so a copy can never be older than the last announcement this server heard.
 */
export class SessionCache {
  private readonly entries = new Map<string, Entry>();
  private generation = 0;
  private listening = false;

  constructor(private readonly opts: SessionCacheOptions) {}

  /** True while announcements are being heard, so copies may be used. */
  get active(): boolean {
    return this.listening;
  }

  get size(): number {
    return this.entries.size;
  }

  /** The copy of a session still current at `now`, if there is one. */
  get(sid: string, now: number): CachedSession | undefined {
    const entry = this.entries.get(sid);
    if (entry === undefined) return undefined;
    if (!this.listening || now - entry.storedAt > this.opts.maxAgeMs || now > entry.expiresAt) {
      this.entries.delete(sid);
      return undefined;
    }
    return entry;
  }

  /** Call before reading a session from the database; hand the token to `keep`. */
  beginRead(): number {
    return this.generation;
  }

  /** Keeps what a read returned, unless something was forgotten while it was under way. */
  keep(token: number, sid: string, session: CachedSession, now: number): void {
    if (!this.listening || token !== this.generation) return;
    if (session.person) Object.freeze(session.person.roles);
    if (this.entries.size >= this.opts.maxEntries) this.entries.delete(this.entries.keys().next().value as string);
    this.entries.set(sid, { ...session, storedAt: now });
  }

  forgetSession(sid: string): void {
    this.generation++;
    this.entries.delete(sid);
  }

  forgetPerson(personId: string): void {
    this.generation++;
    for (const [sid, entry] of this.entries) if (entry.person?.id === personId) this.entries.delete(sid);
  }

  forgetAll(): void {
    this.generation++;
    this.entries.clear();
  }

  /** Called by the listener: copies are used only while it hears announcements. */
  setListening(listening: boolean): void {
    this.listening = listening;
    this.forgetAll();
  }

  /** Applies one announcement: 's' + sid, 'p' + person id, anything else forgets everything. */
  hear(payload: string): void {
    if (payload.startsWith("s")) this.forgetSession(payload.slice(1));
    else if (payload.startsWith("p")) this.forgetPerson(payload.slice(1));
    else this.forgetAll();
  }
}

/**
 * Applies the database's session announcements to the cache. The cache is in use only while the
 * listener holds, and starts empty each time (announcements made meanwhile were not heard).
 */
export function listenForSessionChanges(pool: pg.Pool, cache: SessionCache, log: { warn: (o: object, m: string) => void }, retryMs = 1000): NotificationListener {
  return listenOn(pool, SESSION_CHANNEL, { onNotification: (payload) => cache.hear(payload), onListening: (listening) => cache.setListening(listening) }, log, retryMs);
}

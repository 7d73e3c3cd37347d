import { describe, expect, it } from "vitest";
import { SessionCache, type CachedSession } from "../../../server/http/sessionCache.js";

const person = (id: string) => ({ id, email: `${id}@test.example`, name: id, roles: ["operator" as const], mustChangePassword: false, active: true, lockedAt: null });
const session = (personId: string, expiresAt = 10_000): CachedSession => ({ json: `{"passport":{"user":"${personId}"}}`, person: person(personId), expiresAt });

function listeningCache(maxAgeMs = 1000, maxEntries = 100) {
  const cache = new SessionCache({ maxAgeMs, maxEntries });
  cache.setListening(true);
  return cache;
}

describe("SessionCache", () => {
  it("keeps a read and gives it back until it is older than its limit or its session expires", () => {
    const cache = listeningCache(1000);
    cache.keep(cache.beginRead(), "s1", session("p1", 5_000), 0);
    expect(cache.get("s1", 999)?.person?.id).toBe("p1");
    expect(cache.get("s1", 1001)).toBeUndefined();
    cache.keep(cache.beginRead(), "s2", session("p2", 500), 0);
    expect(cache.get("s2", 400)).toBeDefined();
    expect(cache.get("s2", 501)).toBeUndefined();
  });

  it("keeps nothing while not listening, and drops everything when listening stops or starts", () => {
    const cache = new SessionCache({ maxAgeMs: 1000, maxEntries: 100 });
    cache.keep(cache.beginRead(), "s1", session("p1"), 0);
    expect(cache.get("s1", 1)).toBeUndefined();
    cache.setListening(true);
    cache.keep(cache.beginRead(), "s1", session("p1"), 0);
    expect(cache.get("s1", 1)).toBeDefined();
    cache.setListening(false);
    expect(cache.get("s1", 1)).toBeUndefined();
    expect(cache.size).toBe(0);
  });

  it("does not keep a read that was under way when anything was forgotten", () => {
    const cache = listeningCache();
    const token = cache.beginRead();
    cache.hear("sother");
    cache.keep(token, "s1", session("p1"), 0);
    expect(cache.get("s1", 1)).toBeUndefined();
  });

  it("forgets by session, by person and entirely, as announced", () => {
    const cache = listeningCache();
    for (const [sid, p] of [["a", "p1"], ["b", "p1"], ["c", "p2"], ["d", "p3"]]) cache.keep(cache.beginRead(), sid, session(p), 0);
    cache.hear("sc");
    expect(cache.get("c", 1)).toBeUndefined();
    expect(cache.get("d", 1)).toBeDefined();
    cache.hear("pp1");
    expect(cache.get("a", 1)).toBeUndefined();
    expect(cache.get("b", 1)).toBeUndefined();
    expect(cache.get("d", 1)).toBeDefined();
    cache.hear("*");
    expect(cache.size).toBe(0);
  });

  it("holds at most its limit of sessions, dropping the oldest first", () => {
    const cache = listeningCache(1000, 2);
    for (const sid of ["a", "b", "c"]) cache.keep(cache.beginRead(), sid, session("p"), 0);
    expect(cache.size).toBe(2);
    expect(cache.get("a", 1)).toBeUndefined();
    expect(cache.get("c", 1)).toBeDefined();
  });

  it("hands out roles that cannot be changed in place", () => {
    const cache = listeningCache();
    cache.keep(cache.beginRead(), "s1", session("p1"), 0);
    expect(() => (cache.get("s1", 1)!.person!.roles as string[]).push("admin")).toThrow(TypeError);
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pino } from "pino";
import { Client, startTestApp, type TestApp } from "../../support/testApp.js";
import { buildPerson } from "../../factories.js";

// The access log keeps session tokens, CSRF tokens and passwords out of the log
// (OWASP ASVS 4.0.3 V7.1.1: no credentials in logs, session tokens only in an irreversible form).

const lines: Record<string, unknown>[] = [];
let t: TestApp;
beforeAll(async () => {
  const log = pino({ level: "info" }, { write: (line: string) => void lines.push(JSON.parse(line)) });
  t = await startTestApp({ log });
});
afterAll(() => t.close());

const linesFor = (method: string, path: string) => lines.filter((l) => l.method === method && l.path === path);

describe("access log", () => {
  it("writes one line per answered request with method, path, status, time and person, and nothing secret", async () => {
    const person = await buildPerson(t.database.db, { roles: ["operator"] });
    const client = new Client(t.app);
    const signIn = await client.signIn(person.email, person.password);
    expect(signIn.status).toBe(200);
    const cookie = String(signIn.headers["set-cookie"]).split(";")[0].split("=")[1];
    expect(cookie.length).toBeGreaterThan(10);

    lines.length = 0;
    const mine = await client.get("/api/session?tab=mine");
    expect(mine.status).toBe(200);
    const refused = await client.post("/api/vessels", { name: "" });
    expect(refused.status).toBeGreaterThanOrEqual(400);
    await client.get("/api/health");

    const [read] = linesFor("GET", "/api/session");
    expect(read).toMatchObject({ level: 30, status: 200, personId: person.id });
    expect(typeof read.ms).toBe("number");
    const [post] = linesFor("POST", "/api/vessels");
    expect(post).toMatchObject({ level: 40, status: refused.status, personId: person.id });
    expect(linesFor("GET", "/api/health")).toHaveLength(0);

    const everything = JSON.stringify(lines);
    expect(everything).not.toContain(decodeURIComponent(cookie).slice(2, 20));
    expect(everything).not.toContain(cookie);
    expect(everything).not.toContain(client.csrf);
    expect(everything).not.toContain("tab=mine");
    expect(everything).not.toMatch(/cookie|x-csrf-token/i);
  });

  it("never logs the password or e-mail sent to sign in, right or wrong", async () => {
    const person = await buildPerson(t.database.db);
    lines.length = 0;
    const wrong = await new Client(t.app).signIn(person.email, "not-the-password-7q");
    expect(wrong.status).toBe(401);
    const right = await new Client(t.app).signIn(person.email, person.password);
    expect(right.status).toBe(200);
    expect(linesFor("POST", "/api/session").map((l) => l.status)).toEqual([401, 200]);
    const everything = JSON.stringify(lines);
    expect(everything).not.toContain(person.password);
    expect(everything).not.toContain("not-the-password-7q");
    expect(everything).not.toContain(person.email);
  });
});

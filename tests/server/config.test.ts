import { describe, expect, it } from "vitest";
import { loadEnv } from "../../server/config.js";

describe("configuration", () => {
  it("uses the documented defaults", () => {
    const env = loadEnv({});
    expect(env).toMatchObject({ PORT: 3000, HOST: "127.0.0.1", DB_PORT: 54329, SESSION_IDLE_MINUTES: 15, LOCKOUT_THRESHOLD: 5, SEED_DEMO: true });
  });

  it("stops with a message naming each bad variable", () => {
    expect(() => loadEnv({ PORT: "eighty", SEED_DEMO: "maybe" })).toThrow(/PORT[\s\S]*SEED_DEMO|SEED_DEMO[\s\S]*PORT/);
    expect(() => loadEnv({ SESSION_IDLE_MINUTES: "-1" })).toThrow(/SESSION_IDLE_MINUTES/);
  });

  it("turns the demo off with SEED_DEMO=false", () => {
    expect(loadEnv({ SEED_DEMO: "false" }).SEED_DEMO).toBe(false);
  });
});

import { defineConfig } from "vitest/config";

// Two projects: the pure shared library needs no services; everything that touches the
// server shares one set of throw-away services started by the global setup.
export default defineConfig({
  test: {
    testTimeout: 30_000,
    hookTimeout: 120_000,
    projects: [
      { test: { name: "shared", include: ["tests/shared/**/*.test.ts"], environment: "node" } },
      {
        test: {
          name: "server",
          include: ["tests/server/**/*.test.ts", "tests/browser/**/*.test.ts"],
          globalSetup: ["tests/globalSetup.ts"],
          pool: "forks",
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});

import express from "express";
import pg from "pg";
import type { Server } from "node:http";

export interface BareEndpoint {
  url: string;
  /** Rows the endpoint has written. */
  count(): Promise<number>;
  close(): Promise<void>;
}

/**
 * The floor to compare with: Express and pg on the same database, one INSERT into a scratch
 * table per request, with no session, validation, audit row or notification.
 */
export async function startBareEndpoint(databaseUrl: string, poolSize = 20): Promise<BareEndpoint> {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: poolSize, connectionTimeoutMillis: 5000 });
  // Idle connections are dropped when the benchmark stops its database; that is not a failure.
  pool.on("error", () => undefined);
  await pool.query("create table if not exists bench_scratch (id uuid primary key default gen_random_uuid(), batch_id text not null, body jsonb not null, at timestamptz not null default now())");
  const app = express();
  app.use(express.json());
  app.post("/bare/batches/:id/samples", async (req, res) => {
    try {
      const result = await pool.query<{ id: string }>("insert into bench_scratch (batch_id, body) values ($1, $2) returning id", [req.params.id, req.body]);
      res.status(201).json({ id: result.rows[0].id });
    } catch {
      res.status(503).json({ error: { code: "database-unavailable" } });
    }
  });
  const server = await new Promise<Server>((ok) => {
    const s = app.listen(0, "127.0.0.1", () => ok(s));
  });
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    count: async () => Number((await pool.query<{ n: string }>("select count(*)::text as n from bench_scratch")).rows[0].n),
    close: async () => {
      const closed = new Promise<void>((ok) => server.close(() => ok()));
      server.closeAllConnections();
      await closed;
      await pool.end();
    },
  };
}

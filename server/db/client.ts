import pg from "pg";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { fileURLToPath } from "node:url";
import * as schema from "./schema.js";
import { releaseClientsOnFailedBegin } from "./releaseOnFailedBegin.js";

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };
/** A transaction handle, as `db.transaction` passes it. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either the database or a transaction: helpers that must join the caller's transaction take this. */
export type DbOrTx = Db | Tx;

export interface Database {
  pool: pg.Pool;
  db: Db;
  close(): Promise<void>;
}

/** Opens a connection pool; a dropped connection is logged, never fatal. */
export function createDatabase(url: string, onPoolError: (err: Error) => void = () => undefined, max = 10): Database {
  releaseClientsOnFailedBegin();
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 5000, idleTimeoutMillis: 30_000 });
  pool.on("error", onPoolError);
  // pg-pool listens for errors only on idle clients; a checked-out one that loses its connection would otherwise throw an uncaught 'error'.
  pool.on("connect", (client) => client.on("error", onPoolError));
  const db = drizzle(pool, { schema });
  return { pool, db, close: () => pool.end() };
}

export const migrationsFolder = fileURLToPath(new URL("../../drizzle", import.meta.url));

/** Applies the migrations in drizzle/ that have not run yet. */
export async function runMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}

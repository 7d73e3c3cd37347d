import { NodePgSession } from "drizzle-orm/node-postgres/session";
import { isDbUnavailable } from "../http/errors.js";

// drizzle-orm 0.45's pool transaction runs BEGIN outside its try/finally, so a BEGIN that fails
// (the database went away between connect and begin) never releases its client: after a few
// outages the pool is exhausted and closing it hangs. This wraps the pool case so the client is
// always released — and destroyed when the connection itself failed, so it is not reused.
let patched = false;

/** Installs the wrapper once per process. */
export function releaseClientsOnFailedBegin(): void {
  if (patched) return;
  patched = true;
  const proto = NodePgSession.prototype as unknown as {
    client: { connect?: () => Promise<{ release(err?: Error | boolean): void }> };
    dialect: unknown;
    schema: unknown;
    options: unknown;
    transaction: (fn: unknown, config?: unknown) => Promise<unknown>;
  };
  const original = proto.transaction;
  proto.transaction = async function (this: typeof proto, fn: unknown, config?: unknown) {
    const isPool = typeof this.client.connect === "function" && Object.getPrototypeOf(this.client).constructor.name.includes("Pool");
    if (!isPool) return original.call(this, fn, config);
    const client = await this.client.connect!();
    // On a single client, the original neither connects nor releases: this wrapper does both.
    const session = new (NodePgSession as unknown as new (...a: unknown[]) => typeof proto)(client, this.dialect, this.schema, this.options);
    try {
      const result = await original.call(session, fn, config);
      client.release();
      return result;
    } catch (err) {
      const broken = isDbUnavailable(err) || isDbUnavailable((err as { cause?: unknown })?.cause);
      client.release(broken ? (err as Error) : undefined);
      throw err;
    }
  };
}

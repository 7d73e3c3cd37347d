import { mkdirSync, createWriteStream } from "node:fs";
import { join, resolve } from "node:path";
import { randomUUID } from "node:crypto";
import { pipeline } from "node:stream/promises";
import { SMTPServer } from "smtp-server";

/** A local SMTP server that accepts every message and saves it as an .eml file. */
export interface MailCatcher {
  host: string;
  port: number;
  directory: string;
  stop(): Promise<void>;
}

/** Starts the catcher on 127.0.0.1:`port` (0 picks a free port). */
export async function startMailCatcher(directory: string, port: number): Promise<MailCatcher> {
  const dir = resolve(directory);
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, callback) {
      // Timestamped names keep the folder in arrival order.
      const file = join(dir, `${new Date().toISOString().replace(/[:.]/g, "-")}-${randomUUID().slice(0, 8)}.eml`);
      pipeline(stream, createWriteStream(file)).then(() => callback(), (err) => callback(err as Error));
    },
  });
  await new Promise<void>((ok, fail) => {
    server.once("error", fail);
    server.listen(port, "127.0.0.1", () => ok());
  });
  const address = server.server.address();
  const actualPort = typeof address === "object" && address ? address.port : port;
  let stopped = false;
  return {
    host: "127.0.0.1",
    port: actualPort,
    directory: dir,
    stop: () =>
      new Promise<void>((ok) => {
        if (stopped) return ok();
        stopped = true;
        server.close(() => ok());
      }),
  };
}

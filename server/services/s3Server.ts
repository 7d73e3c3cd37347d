import { mkdirSync } from "node:fs";
import { resolve } from "node:path";
import S3rver from "s3rver";

/** A local S3-compatible file store (s3rver) bound to loopback. */
export interface LocalS3 {
  endpoint: string;
  port: number;
  stop(): Promise<void>;
}

/** Starts s3rver on 127.0.0.1 with its objects under `directory`. */
export async function startLocalS3(directory: string, port: number): Promise<LocalS3> {
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({ address: "127.0.0.1", port, directory: resolve(directory), silent: true, resetOnClose: false });
  const address = await server.run();
  const actualPort = typeof address === "object" && address ? (address as { port: number }).port : port;
  let stopped = false;
  return {
    endpoint: `http://127.0.0.1:${actualPort}`,
    port: actualPort,
    stop: async () => {
      if (stopped) return;
      stopped = true;
      await server.close();
    },
  };
}

import { createServer, connect, type Socket } from "node:net";

export interface CuttingProxy {
  url: string;
  /** True once a PUT answer has been cut. */
  cut(): boolean;
  close(): Promise<void>;
}

/**
 * A loopback TCP relay in front of an HTTP server. The first time the server starts answering a
 * PUT, the relay drops both sides before a byte of the answer passes and calls `onCut`: the
 * server has done the work, the client never hears so. Everything else passes through.
 */
export async function startCuttingProxy(targetPort: number, onCut: () => void): Promise<CuttingProxy> {
  let armed = true;
  const sockets = new Set<Socket>();
  const server = createServer((client) => {
    const upstream = connect(targetPort, "127.0.0.1");
    sockets.add(client).add(upstream);
    let sawPut = false;
    const drop = () => {
      client.destroy();
      upstream.destroy();
    };
    client.on("data", (chunk) => {
      if (chunk.toString("latin1", 0, 4) === "PUT ") sawPut = true;
      upstream.write(chunk);
    });
    upstream.on("data", (chunk) => {
      const interim = chunk.toString("latin1", 0, 12) === "HTTP/1.1 100";
      if (armed && sawPut && !interim) {
        armed = false;
        drop();
        onCut();
        return;
      }
      client.write(chunk);
    });
    for (const s of [client, upstream]) {
      s.on("error", drop);
      s.on("close", () => {
        sockets.delete(s);
        drop();
      });
    }
  });
  await new Promise<void>((ok) => server.listen(0, "127.0.0.1", () => ok()));
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    cut: () => !armed,
    close: () =>
      new Promise<void>((ok) => {
        for (const s of sockets) s.destroy();
        server.close(() => ok());
      }),
  };
}

import { spawn, type ChildProcess } from "node:child_process";
import { connect } from "node:net";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("../..", import.meta.url));

export interface AppProcess {
  url: string;
  child: ChildProcess;
  /** The last lines the process wrote, for a failure message. */
  output(): string;
  /** Sends `signal` to the process group (npx, tsx and the server) and waits until the port is free. */
  kill(signal: NodeJS.Signals): Promise<void>;
}

const portIsFree = (port: number) =>
  new Promise<boolean>((ok) => {
    const s = connect(port, "127.0.0.1");
    s.once("connect", () => {
      s.destroy();
      ok(false);
    });
    s.once("error", () => ok(true));
  });

/** Starts `npx tsx server/index.ts` in its own process group with `env`, and waits for /api/health to answer 200. */
export async function startAppProcess(port: number, env: Record<string, string>, readyWithinMs = 60_000): Promise<AppProcess> {
  const child = spawn("npx", ["tsx", "server/index.ts"], {
    cwd: root,
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
    env: { ...process.env, ...env, HOST: "127.0.0.1", PORT: String(port), ISOBATCH_SERVE_WEB: "false", AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true" },
  });
  const lines: string[] = [];
  const keep = (d: Buffer) => {
    lines.push(d.toString());
    if (lines.length > 40) lines.shift();
  };
  child.stdout!.on("data", keep);
  child.stderr!.on("data", keep);
  const exited = new Promise<void>((ok) => child.once("exit", () => ok()));
  const url = `http://127.0.0.1:${port}`;
  const app: AppProcess = {
    url,
    child,
    output: () => lines.join(""),
    kill: async (signal) => {
      if (child.exitCode === null && child.signalCode === null) process.kill(-child.pid!, signal);
      await exited;
      const deadline = Date.now() + 15_000;
      while (!(await portIsFree(port))) {
        if (Date.now() > deadline) throw new Error(`port ${port} still answers after ${signal}`);
        await new Promise((r) => setTimeout(r, 100));
      }
    },
  };
  const deadline = Date.now() + readyWithinMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app exited at start (${child.exitCode}):\n${app.output()}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.status === 200) return app;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  await app.kill("SIGKILL");
  throw new Error(`the app did not become healthy within ${readyWithinMs} ms:\n${app.output()}`);
}

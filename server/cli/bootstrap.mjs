#!/usr/bin/env node
// The README's commands land here first. Plain Node with no packages, because on a fresh
// clone nothing is installed yet: install what is missing, then hand over.
//   node server/cli/bootstrap.mjs start | dev | test [vitest args…]
import { spawn, execFileSync } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { join } from "node:path";

const root = fileURLToPath(new URL("../..", import.meta.url));
const bin = (name) => join(root, "node_modules", ".bin", name);
const say = (line) => console.log(`[isobatch] ${line}`);
const isRoot = process.getuid?.() === 0;
// Node 20 is this project's runtime; the AWS SDK's notice about its future minimum is known.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";

function ensureNodeModules() {
  const marker = join(root, "node_modules", ".package-lock.json");
  const lock = join(root, "package-lock.json");
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs && existsSync(bin("tsx"))) return;
  say("installing npm packages (npm ci)…");
  execFileSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
}

function aptInstall(pkgs) {
  if (!isRoot) throw new Error(`Debian packages are needed: run \`apt-get install -y ${pkgs.join(" ")}\` as root.`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  say(`installing Debian's ${pkgs.join(", ")} (apt-get)…`);
  execFileSync("apt-get", ["update"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "--no-install-recommends", ...pkgs], { stdio: "inherit", env });
}

// The browser tests drive Debian's chromium; the executed-record test renders a PDF page with pdftoppm.
function ensureTestTools() {
  const missing = [["/usr/bin/chromium", "chromium"], ["/usr/bin/pdftoppm", "poppler-utils"]].filter(([file]) => !existsSync(file)).map(([, pkg]) => pkg);
  if (missing.length) aptInstall(missing);
}

/** Runs a command in the foreground; the child gets Ctrl-C with the rest of the group. */
function run(cmd, args, env = {}) {
  return new Promise((ok) => {
    const child = spawn(cmd, args, { cwd: root, stdio: "inherit", env: { ...process.env, ...env } });
    const forward = (sig) => () => child.kill(sig);
    // The terminal sends Ctrl-C to the whole group; we only wait for the child to finish.
    process.on("SIGINT", () => undefined);
    process.on("SIGTERM", forward("SIGTERM"));
    child.on("exit", (code, signal) => ok(code ?? (signal ? 1 : 0)));
  });
}

const [command = "start", ...rest] = process.argv.slice(2);
ensureNodeModules();
let code = 0;
if (command === "start") {
  say("building the web app (vite build)…");
  execFileSync(bin("vite"), ["build", "--logLevel", "warn"], { cwd: root, stdio: "inherit" });
  code = await run(bin("tsx"), ["server/index.ts"], { NODE_ENV: process.env.NODE_ENV ?? "production" });
} else if (command === "dev") {
  const api = spawn(bin("tsx"), ["watch", "server/index.ts"], { cwd: root, stdio: "inherit", env: { ...process.env, ISOBATCH_SERVE_WEB: "false" } });
  code = await run(bin("vite"), ["--strictPort"]);
  api.kill("SIGINT");
} else if (command === "test") {
  ensureTestTools();
  code = await run(bin("vitest"), ["run", ...rest]);
} else {
  console.error(`unknown command "${command}": use start, dev or test`);
  code = 2;
}
process.exit(code);

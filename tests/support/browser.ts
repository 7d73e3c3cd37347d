import { chromium, type Browser } from "playwright-core";
import { existsSync, statSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import type { Server } from "node:http";
import type { Express } from "express";
import { startTestApp, type TestApp } from "./testApp.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
export const webDist = join(root, "dist", "web");

function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return newest;
}

/** Builds the web app with Vite unless dist/web is newer than every source file. */
export async function ensureWebBuilt(): Promise<void> {
  const index = join(webDist, "index.html");
  if (existsSync(index) && statSync(index).mtimeMs > Math.max(newestMtime(join(root, "web")), newestMtime(join(root, "shared")))) return;
  const { build } = await import("vite");
  await build({ configFile: join(root, "vite.config.ts"), logLevel: "warn" });
}

/** Debian's chromium, headless, with no reach outside this machine. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-dev-shm-usage"],
  });
}

/** Serves an Express app on a free loopback port; returns its base URL. */
export function listen(app: Express): Promise<{ url: string; server: Server }> {
  return new Promise((ok) => {
    const server = app.listen(0, "127.0.0.1", () => {
      const address = server.address();
      ok({ url: `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`, server });
    });
  });
}

/** A test app serving the built web client, and a browser to drive it. */
export interface BrowserApp {
  t: TestApp;
  base: string;
  browser: Browser;
  close(): Promise<void>;
}

/** Builds the client if needed, starts a test app serving it on loopback and launches chromium. */
export async function startBrowserApp(): Promise<BrowserApp> {
  await ensureWebBuilt();
  const t = await startTestApp({ settings: { webDist } });
  const { url, server } = await listen(t.app);
  const browser = await launchChromium();
  return {
    t,
    base: url,
    browser,
    close: async () => {
      await browser.close();
      server.close();
      await t.close();
    },
  };
}

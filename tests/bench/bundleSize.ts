// Bundle-size check: what the sign-in page fetches before it can show anything, gzipped.
// Run: npx tsx tests/bench/bundleSize.ts — builds the web app first if dist/web is missing or stale.
import { existsSync, readFileSync, readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";

const root = fileURLToPath(new URL("../..", import.meta.url));
const dist = join(root, "dist", "web");
const indexHtml = join(dist, "index.html");
const manifestPath = join(dist, ".vite", "manifest.json");
// The sign-in screen's module, as Vite's manifest names it (relative to the web/ root).
const SIGN_IN_MODULE = "src/routes/SignIn.tsx";
// 1 KB = 1000 bytes, as in Vite's own build report.
const BUDGET_BYTES = 150_000;

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
type Manifest = Record<string, ManifestChunk>;

function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

/** Runs `vite build` unless dist/web and its manifest are newer than every source it is built from. */
async function ensureFreshBuild(): Promise<void> {
  const sources = Math.max(newestMtime(join(root, "web")), newestMtime(join(root, "shared")), newestMtime(join(root, "vite.config.ts")));
  if (existsSync(indexHtml) && existsSync(manifestPath) && statSync(indexHtml).mtimeMs > sources) return;
  console.log("dist/web is missing or older than the sources: running vite build …");
  const { build } = await import("vite");
  await build({ configFile: join(root, "vite.config.ts"), logLevel: "warn" });
  if (!existsSync(manifestPath)) throw new Error("The build wrote no .vite/manifest.json; vite.config.ts needs build.manifest: true.");
}

/** Manifest keys of a chunk and everything it imports statically, in load order. */
function staticClosure(manifest: Manifest, key: string, seen = new Set<string>()): string[] {
  if (seen.has(key)) return [];
  seen.add(key);
  const chunk = manifest[key];
  if (!chunk) throw new Error(`The manifest has no chunk ${key}.`);
  return [key, ...(chunk.imports ?? []).flatMap((k) => staticClosure(manifest, k, seen))];
}

/** The script and module-preload URLs that index.html itself names. */
function scriptsNamedByIndex(html: string): string[] {
  const urls: string[] = [];
  for (const m of html.matchAll(/<script[^>]*type="module"[^>]*src="([^"]+)"/g)) urls.push(m[1]);
  for (const m of html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g)) urls.push(m[1]);
  return urls.map((u) => u.replace(/^\//, ""));
}

const gzipBytes = (file: string) => gzipSync(readFileSync(join(dist, file))).length;
const kb = (bytes: number) => (bytes / 1000).toFixed(1).padStart(7);

await ensureFreshBuild();
const manifest = JSON.parse(readFileSync(manifestPath, "utf8")) as Manifest;
const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
if (!entryKey) throw new Error("The manifest names no entry chunk.");

const firstLoad = staticClosure(manifest, entryKey);
// When the sign-in screen is its own lazy chunk, the router fetches it before painting the page.
if (manifest[SIGN_IN_MODULE]?.isDynamicEntry) firstLoad.push(...staticClosure(manifest, SIGN_IN_MODULE, new Set(firstLoad)));
const firstFiles = new Set(firstLoad.map((k) => manifest[k].file));
for (const url of scriptsNamedByIndex(readFileSync(indexHtml, "utf8"))) {
  if (!firstFiles.has(url)) {
    console.log(`index.html also loads ${url}, which the manifest walk missed; counting it.`);
    firstFiles.add(url);
  }
}

console.log("\nJavaScript the sign-in page loads first (gzip, default level):");
console.log(`${"file".padEnd(44)} ${"raw KB".padStart(7)} ${"gzip KB".padStart(7)}`);
let total = 0;
for (const file of firstFiles) {
  const gz = gzipBytes(file);
  total += gz;
  console.log(`${file.padEnd(44)} ${kb(statSync(join(dist, file)).size)} ${kb(gz)}`);
}
console.log(`${"total".padEnd(44)} ${"".padStart(7)} ${kb(total)}`);

console.log("\nLater screens: extra JavaScript each route chunk fetches on first visit (gzip):");
const routeKeys = Object.keys(manifest).filter((k) => manifest[k].isDynamicEntry && k.startsWith("src/routes/")).sort();
for (const key of routeKeys) {
  const extra = staticClosure(manifest, key).map((k) => manifest[k].file).filter((f) => !firstFiles.has(f));
  const bytes = extra.reduce((sum, f) => sum + gzipBytes(f), 0);
  console.log(`${key.replace("src/routes/", "").padEnd(32)} ${String(extra.length).padStart(2)} chunks ${kb(bytes)} KB`);
}

const pass = total <= BUDGET_BYTES;
console.log(`\n${pass ? "PASS" : "MISS"}: sign-in first load ${(total / 1000).toFixed(1)} KB gzip against a budget of ${BUDGET_BYTES / 1000} KB.`);
if (!pass) process.exitCode = 1;

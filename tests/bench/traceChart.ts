// Trace chart benchmark: time from mounting the project's TraceChart to the browser showing it,
// with a 100 000-point trace beside an empty chart of the same size. Prints its figures.
// Run: npx tsx tests/bench/traceChart.ts
import { createServer, type Server } from "node:http";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { extname, join, normalize } from "node:path";
import { fileURLToPath } from "node:url";
import react from "@vitejs/plugin-react";
import { build } from "vite";
import { chromium, type Browser } from "playwright-core";

const pageDir = fileURLToPath(new URL("./chartPage", import.meta.url));
const POINTS = 100_000;
const RUNS = 11;
const TYPES: Record<string, string> = { ".html": "text/html", ".js": "text/javascript", ".css": "text/css" };

interface Reading {
  points: number;
  mountToPaintMs: number;
  inkedPixels: number;
}

/** Builds the bench page (production mode, as the app ships) into a fresh temp folder. */
async function buildPage(): Promise<string> {
  const outDir = mkdtempSync(join(tmpdir(), "isobatch-chart-bench-"));
  await build({ configFile: false, root: pageDir, base: "./", logLevel: "warn", plugins: [react()], build: { outDir, emptyOutDir: true } });
  return outDir;
}

/** Serves a folder on a free loopback port. */
function serve(dir: string): Promise<{ server: Server; url: string }> {
  const server = createServer((req, res) => {
    const asked = normalize(decodeURIComponent(new URL(req.url ?? "/", "http://x").pathname));
    const file = join(dir, asked === "/" ? "index.html" : asked);
    let body: Buffer;
    try {
      body = readFileSync(file);
    } catch {
      res.writeHead(404).end();
      return;
    }
    res.writeHead(200, { "Content-Type": TYPES[extname(file)] ?? "application/octet-stream" }).end(body);
  });
  return new Promise((ok) => server.listen(0, "127.0.0.1", () => {
    const address = server.address();
    ok({ server, url: `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}/` });
  }));
}

async function measure(browser: Browser, url: string, points: number): Promise<Reading> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  await page.goto(`${url}?points=${points}`);
  await page.waitForFunction(() => window.chartBench !== undefined, undefined, { timeout: 60_000 });
  const reading = (await page.evaluate(() => window.chartBench)) as Reading;
  await page.close();
  if (errors.length > 0) throw new Error(`The bench page failed: ${errors.join("; ")}`);
  return reading;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const ms = (value: number) => value.toFixed(1).padStart(8);

const outDir = await buildPage();
const { server, url } = await serve(outDir);
const browser = await chromium.launch({
  executablePath: "/usr/bin/chromium",
  args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
});
try {
  await measure(browser, url, POINTS); // warm the browser's cache and the page's code path once
  // uPlot draws no axes for zero points, so two points stand for "axes and grid, no real trace".
  const rows: { label: string; points: number; readings: Reading[] }[] = [
    { label: "empty chart", points: 0, readings: [] },
    { label: "2 points", points: 2, readings: [] },
    { label: `${POINTS.toLocaleString("en")} points`, points: POINTS, readings: [] },
  ];
  // Interleave the cases so drift in the machine's load touches all alike.
  for (let run = 0; run < RUNS; run++) for (const row of rows) row.readings.push(await measure(browser, url, row.points));
  console.log(`TraceChart, 1200 × 340 px, headless Chromium without GPU, ${RUNS} fresh page loads each.`);
  console.log("Time from mounting the chart to the first frame shown after uPlot drew it (ms):");
  console.log(`${"chart".padEnd(16)} ${"median".padStart(8)} ${"best".padStart(8)} ${"worst".padStart(8)} ${"inked px".padStart(9)}`);
  for (const { label, readings } of rows) {
    const times = readings.map((r) => r.mountToPaintMs);
    console.log(`${label.padEnd(16)} ${ms(median(times))} ${ms(Math.min(...times))} ${ms(Math.max(...times))} ${String(readings[0].inkedPixels).padStart(9)}`);
  }
  const medianOf = (row: (typeof rows)[number]) => median(row.readings.map((r) => r.mountToPaintMs));
  const [empty, axesOnly, full] = rows;
  console.log(`${full.label} take ${(medianOf(full) - medianOf(empty)).toFixed(1)} ms (median) more than the empty chart, ${(medianOf(full) - medianOf(axesOnly)).toFixed(1)} ms more than ${axesOnly.label}.`);
  if (full.readings.some((r) => r.inkedPixels <= empty.readings[0].inkedPixels)) {
    console.log("WARNING: a full chart inked no more pixels than the empty one; the trace was not drawn.");
    process.exitCode = 1;
  }
} finally {
  await browser.close();
  server.close();
  rmSync(outDir, { recursive: true, force: true });
}

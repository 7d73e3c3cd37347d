import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { createRequire } from "node:module";
import type { TestApp } from "../support/testApp.js";
import { buildPerson, buildPlannedBatch, type BuiltPerson } from "../factories.js";
import { BatchDriver, firstOrderCsv } from "../support/batchDriver.js";
import { startBrowserApp, type BrowserApp } from "../support/browser.js";
import type { Role } from "../../shared/schemas/roles.js";

// Checked with axe-core (the open-source WCAG 2.x rule engine, run as a general-purpose
// reference library); only its "serious" and "critical" findings fail a screen.
const axePath = createRequire(import.meta.url).resolve("axe-core/axe.min.js");
const BLOCKING = new Set(["serious", "critical"]);

let t: TestApp;
let browser: Browser;
let rig: BrowserApp;
let base: string;
const people = {} as Record<Role, BuiltPerson>;
let campaignId: string;
let runningBatchId: string;
let reviewBatchId: string;

beforeAll(async () => {
  rig = await startBrowserApp();
  ({ t, base, browser } = rig);
  const db = t.database.db;
  for (const role of ["operator", "supervisor", "quality", "engineer", "admin"] as Role[]) {
    people[role] = await buildPerson(db, { roles: [role], name: `Axe ${role}` });
  }
  // Demo-like data: one campaign with a planned batch, a batch running with a trace logged and a
  // deviation raised, and a batch in review, so lists, the campaign and batch pages have content.
  const planned = await buildPlannedBatch(db);
  campaignId = planned.campaign.id;
  const sameCampaign = { campaign: planned.campaign, rateModel: planned.rateModel, masterRecord: planned.masterRecord, engineer: planned.engineer };
  runningBatchId = (await buildPlannedBatch(db, { campaign: sameCampaign })).batch.id;
  reviewBatchId = (await buildPlannedBatch(db, { campaign: sameCampaign })).batch.id;
  const driver = new BatchDriver(t.app, db);
  await driver.add("op", ["operator"]);
  await driver.add("sup", ["supervisor"]);
  await driver.chargeAndRun(reviewBatchId);
  await driver.runToReview(reviewBatchId, 2.0e-3);
  await driver.chargeAndRun(runningBatchId);
  const file = await driver.upload("op", firstOrderCsv(8e-4, 22, { n: 30 }));
  expect((await driver.clients.op.post(`/api/batches/${runningBatchId}/traces`, { fileId: file.id })).status).toBe(201);
  const raised = await driver.clients.op.post(`/api/batches/${runningBatchId}/deviations`, { title: "Seal weeping", description: "Slight weep at the piston seal during the leak test.", severity: "major", stepKey: "reliefCheck" });
  expect(raised.status).toBe(201);
}, 180_000);

afterAll(() => rig?.close());

/** Waits until the screen shows its heading and nothing on it is still loading. */
async function waitForScreen(page: Page): Promise<string> {
  await page.waitForFunction(
    () => {
      const heading = document.querySelector("h1");
      const loading = [...document.querySelectorAll('[role="status"]')].some((e) => /loading/i.test(e.textContent ?? ""));
      return heading !== null && !loading;
    },
    undefined,
    { timeout: 20_000 },
  );
  await page.evaluate(() => document.fonts.ready);
  return (await page.locator("h1").first().innerText()).trim();
}

/** Runs axe over the page; returns one line per serious or critical violation. */
async function blockingViolations(page: Page, where: string): Promise<string[]> {
  // The app's CSP allows no injected script, so pages here are opened with bypassCSP.
  await page.addScriptTag({ path: axePath });
  const violations = await page.evaluate(async () => {
    const result = await (window as unknown as { axe: { run(): Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: unknown[] }[] }[] }> } }).axe.run();
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => JSON.stringify(n.target)) }));
  });
  return violations.filter((v) => BLOCKING.has(v.impact ?? "")).map((v) => `${where}: ${v.id} (${v.impact}) ${v.help} at ${v.targets.join(", ")}`);
}

async function signIn(person: BuiltPerson): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 }, bypassCSP: true });
  await page.goto(base + "/sign-in");
  await page.getByLabel("Email").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 15_000 });
  return page;
}

/** Visits each path as `role` and gathers the blocking violations of every screen. */
async function checkScreens(role: Role, paths: string[]): Promise<string[]> {
  const page = await signIn(people[role]);
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  const found: string[] = [];
  for (const path of paths) {
    await page.goto(base + path);
    const heading = await waitForScreen(page);
    expect(heading, `${path} should be a real screen`).not.toMatch(/page not found/i);
    found.push(...(await blockingViolations(page, `${role} ${path}`)));
  }
  await page.close();
  expect(errors, `page errors as ${role}`).toEqual([]);
  return found;
}

const SCREENS: Record<Role, () => string[]> = {
  operator: () => ["/operator", "/batches", `/batches/${runningBatchId}`, "/training"],
  supervisor: () => ["/supervisor", `/batches/${runningBatchId}`, "/deviations", "/training"],
  quality: () => ["/quality", "/deviations", `/batches/${reviewBatchId}/review`, "/rate-models", "/master-records", "/training"],
  engineer: () => ["/engineer", "/vessels", "/rate-models", "/master-records", "/campaigns", `/campaigns/${campaignId}`, `/campaigns/${campaignId}/trends`, "/analysis"],
  admin: () => ["/admin", "/admin/people", "/admin/mail", "/training"],
};

describe("accessibility of the main screens (axe-core, no serious or critical violations)", () => {
  it("sign-in", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 }, bypassCSP: true });
    await page.goto(base + "/sign-in");
    await waitForScreen(page);
    const found = await blockingViolations(page, "/sign-in");
    await page.close();
    expect(found).toEqual([]);
  });

  it("kinetics analysis with the demo trace checked", async () => {
    const page = await signIn(people.engineer);
    await page.goto(base + "/analysis");
    await waitForScreen(page);
    await page.getByRole("button", { name: /Use the invented HF-24 demo trace/ }).click();
    await page.getByRole("button", { name: "Check the trace" }).click();
    await page.locator("#kin-verdict-title").waitFor({ timeout: 60_000 });
    await waitForScreen(page);
    const found = await blockingViolations(page, "engineer /analysis (checked)");
    await page.close();
    expect(found).toEqual([]);
  }, 120_000);

  it("training: the record form open, and an untrained operator's batch page with the steps blocked", async () => {
    const page = await signIn(people.supervisor);
    await page.goto(base + "/training");
    await waitForScreen(page);
    await page.getByRole("button", { name: "Record training" }).click();
    await page.getByRole("dialog").getByLabel("Valid until").waitFor();
    const found = await blockingViolations(page, "supervisor /training (record form)");
    await page.close();

    const untrained = await buildPerson(t.database.db, { roles: ["operator"], name: "Axe untrained operator", untrained: true });
    const floor = await signIn(untrained);
    await floor.goto(base + `/batches/${runningBatchId}`);
    await waitForScreen(floor);
    await floor.getByText(/You have no training record for master record/).first().waitFor();
    found.push(...(await blockingViolations(floor, "untrained operator batch page")));
    await floor.close();
    expect(found).toEqual([]);
  }, 120_000);

  for (const role of Object.keys(SCREENS) as Role[]) {
    it(`${role} screens`, async () => {
      expect(await checkScreens(role, SCREENS[role]())).toEqual([]);
    }, 120_000);
  }
});

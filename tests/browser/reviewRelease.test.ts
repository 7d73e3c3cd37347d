import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import type { TestApp } from "../support/testApp.js";
import { buildPlannedBatch } from "../factories.js";
import { BatchDriver } from "../support/batchDriver.js";
import { startBrowserApp, type BrowserApp } from "../support/browser.js";

let t: TestApp;
let d: BatchDriver;
let browser: Browser;
let rig: BrowserApp;
let base: string;

// The demo model's k at 250 °C, 1/s; the driver's trace is the closed-form first-order rise
// V = V0(1 + εA(1 − e^(−kt))) at this k (common practice), so the check must find it within.
const K = 2.0e-3;

beforeAll(async () => {
  rig = await startBrowserApp();
  ({ t, base, browser } = rig);
  d = new BatchDriver(t.app, t.database.db);
  await d.add("op", ["operator"]);
  await d.add("sup", ["supervisor"]);
  await d.add("qa", ["quality"]);
}, 180_000);

afterAll(() => rig?.close());

/** A batch in review with k = K and one charge entry over its limit (124 g of DMX at V0 = 22 L). */
async function batchInReviewWithOneException() {
  const { batch } = await buildPlannedBatch(t.database.db);
  expect((await d.move("op", batch.id, "START_CHARGING")).status).toBe(200);
  expect((await d.perform("op", batch.id, "reliefCheck")).status).toBe(201);
  expect((await d.perform("op", batch.id, "chargeDmx", { values: { dmxLot: "DMX-L-0419", dmxMass: 124 }, comments: { dmxMass: "cylinder over-delivered" } })).status).toBe(201);
  expect((await d.perform("op", batch.id, "chargeN2")).status).toBe(201);
  for (const key of ["reliefCheck", "chargeDmx"]) expect((await d.verify("sup", batch.id, key)).status).toBe(200);
  expect((await d.move("op", batch.id, "START_RUN")).status).toBe(200);
  await d.runToReview(batch.id, K);
  return batch;
}

async function signIn(email: string, password: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(base + "/sign-in");
  await page.getByLabel("Email").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 15_000 });
  return page;
}

/** Types the password into the open signature dialog and signs with `meaning`. */
async function sign(page: Page, meaning: string, password: string) {
  const dialog = page.getByRole("dialog", { name: "Electronic signature" });
  await dialog.getByLabel("Your password").fill(password);
  await dialog.getByRole("button", { name: `Sign: ${meaning}` }).click();
  return dialog;
}

describe("quality's review and release in the browser", () => {
  it("signs off the out-of-limit entry, performs the checklist and releases the batch", async () => {
    const batch = await batchInReviewWithOneException();
    const before = (await d.clients.qa.get(`/api/batches/${batch.id}/review`)).body;
    expect(before.check.verdict).toBe("within");
    expect(before.check.kObserved).toBeCloseTo(K, 8);
    expect(before.exceptions.map((e: { kind: string }) => e.kind)).toEqual(["out-of-limit"]);

    const page = await signIn(d.people.qa.email, d.people.qa.password);
    const failures: string[] = [];
    page.on("pageerror", (e) => failures.push(e.message));
    await page.goto(`${base}/batches/${batch.id}/review`);
    await page.getByRole("heading", { name: `Review of batch ${batch.code}` }).waitFor({ timeout: 15_000 });
    expect(await page.getByText("Kinetics within the rate model").first().isVisible()).toBe(true);

    // The exception says what was entered, the limits at this scale and the comment given with it.
    const exception = page.getByRole("listitem").filter({ has: page.getByRole("heading", { name: /DMX charged outside its limits/ }) });
    await exception.waitFor();
    const detail = (await exception.innerText()).replace(/\s+/g, " ");
    expect(detail).toContain("124 g");
    // 5.3 to 5.52 g per litre of V0 at V0 = 22 L: 116.6 to 121.44 g (arithmetic on the master record's limits).
    expect(detail).toContain("116.6 to 121.44 g");
    expect(detail).toContain("cylinder over-delivered");

    await exception.getByRole("button", { name: "Mark reviewed" }).click();
    const dialog = await sign(page, "reviewed", "not the password");
    await dialog.getByText("The password is not right").waitFor({ timeout: 15_000 });
    expect((await d.clients.qa.get(`/api/batches/${batch.id}/review`)).body.exceptions[0].reviewed).toBeNull();
    await sign(page, "reviewed", d.people.qa.password);
    await page.getByText(/^Marked reviewed:/).waitFor({ timeout: 15_000 });
    expect(await exception.getByText(d.people.qa.name).isVisible()).toBe(true);
    const reviewed = (await d.clients.qa.get(`/api/batches/${batch.id}/review`)).body.exceptions[0].reviewed;
    expect(reviewed).toMatchObject({ meaning: "reviewed", signerName: d.people.qa.name });

    // Release waits for the checklist; the screen offers it to quality.
    await page.getByText("Release checklist still needs to be performed").waitFor();
    await page.getByLabel("Reviewed, within specification").check();
    await page.getByRole("button", { name: "Sign as performed" }).click();
    await sign(page, "performed", d.people.qa.password);
    await page.getByText("Release checklist: recorded and signed as performed.").waitFor({ timeout: 15_000 });

    await page.getByRole("button", { name: `Release batch ${batch.code}` }).click();
    await sign(page, "released", d.people.qa.password);
    await page.getByText(`Batch ${batch.code} is now released.`).waitFor({ timeout: 15_000 });
    await page.getByText("This batch is released; its record is closed.").waitFor({ timeout: 15_000 });

    const after = (await d.clients.qa.get(`/api/batches/${batch.id}`)).body;
    expect(after.batch.state).toBe("released");
    const checklist = after.steps.find((s: { key: string }) => s.key === "releaseChecklist");
    expect(checklist.status).toBe("complete");
    expect(checklist.signatures.map((s: { meaning: string; signerName: string }) => [s.meaning, s.signerName])).toEqual([["performed", d.people.qa.name]]);
    expect(failures).toEqual([]);
    await page.close();
  });

  it("lists every reason release is refused, in words, for someone who may not release", async () => {
    const batch = await batchInReviewWithOneException();
    const page = await signIn(d.people.op.email, d.people.op.password);
    await page.goto(`${base}/batches/${batch.id}/review`);
    await page.getByRole("heading", { name: `Review of batch ${batch.code}` }).waitFor({ timeout: 15_000 });
    const refusals = page.getByText("Release is not possible yet, because:").locator("..");
    const text = (await refusals.innerText()).replace(/\s+/g, " ");
    expect(text).toContain("Releasing needs the role quality.");
    expect(text).toContain("You performed or verified steps of this batch");
    expect(text).toContain("1 review exception waits for your review.");
    expect(await page.getByRole("button", { name: "Mark reviewed" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /^Release batch/ }).count()).toBe(0);
    await page.close();
  });
});

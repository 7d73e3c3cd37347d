import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { and, eq } from "drizzle-orm";
import type { TestApp } from "../support/testApp.js";
import { buildApprovedRateModel, buildPerson, type BuiltPerson } from "../factories.js";
import { startBrowserApp, type BrowserApp } from "../support/browser.js";
import { rateModelVersions, signatures } from "../../server/db/schema.js";

let t: TestApp;
let browser: Browser;
let rig: BrowserApp;
let base: string;
let engineer: BuiltPerson;
let quality: BuiltPerson;
let approvedV1: Awaited<ReturnType<typeof buildApprovedRateModel>>;
let draftId: string;

beforeAll(async () => {
  rig = await startBrowserApp();
  ({ t, base, browser } = rig);
  engineer = await buildPerson(t.database.db, { roles: ["engineer"], name: "Browser Engineer" });
  quality = await buildPerson(t.database.db, { roles: ["quality"], name: "Browser Quality" });
  approvedV1 = await buildApprovedRateModel(t.database.db);
}, 180_000);

afterAll(() => rig?.close());

async function signIn(person: BuiltPerson): Promise<Page> {
  const page = await browser.newPage();
  await page.goto(base + "/sign-in");
  await page.getByLabel("Email").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 15_000 });
  return page;
}

async function liveEpsilon(page: Page): Promise<string> {
  return (await page.locator("output").first().innerText()).replace(/\s+/g, " ");
}

describe("drafting and approving a rate-model version in the browser", () => {
  it("lets the engineer draft version 2 with εA worked out while typing", async () => {
    const page = await signIn(engineer);
    const failures: string[] = [];
    page.on("pageerror", (e) => failures.push(e.message));
    await page.goto(`${base}/rate-models/versions/${approvedV1.id}`);
    await page.getByRole("button", { name: "Draft version 2" }).click();

    // εA = yA0·δ with δ the change in gas moles per mole of A (Levenspiel, Chemical Reaction
    // Engineering, 3rd ed., ch. 3 — from memory). For A(g) → 2 R(g), δ = (2 − 1)/1 = 1, so
    // εA equals the mole fraction of A fed: 0.7 for the factory's 70 % feed.
    expect(await liveEpsilon(page)).toMatch(/εA 0\.7 δ \(gas moles per mole of A\) 1 /);
    // Diluting to half A, half inert: εA = 0.5 · 1 = 0.5 (same definition).
    await page.getByLabel("Mole fraction").nth(0).fill("0.5");
    await page.getByLabel("Mole fraction").nth(1).fill("0.5");
    expect(await liveEpsilon(page)).toMatch(/εA 0\.5 /);
    // Fractions that do not sum to 1 leave εA undefined, said in words.
    await page.getByLabel("Mole fraction").nth(1).fill("0.4");
    expect(await liveEpsilon(page)).toMatch(/cannot be worked out yet: Feed mole fractions must sum to 1/);
    await page.getByLabel("Mole fraction").nth(1).fill("0.5");

    await page.getByLabel("Allowed deviation of observed k", { exact: true }).fill("8");
    await page.getByRole("button", { name: "Save draft version 2" }).click();
    await page.waitForURL((url) => url.pathname.startsWith("/rate-models/versions/") && !url.pathname.endsWith(approvedV1.id), { timeout: 15_000 });
    await page.getByRole("heading", { name: /version 2/ }).waitFor({ timeout: 15_000 });
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toMatch(/version 2\s*Draft/);
    draftId = page.url().split("/").pop()!;

    const [row] = await t.database.db.select().from(rateModelVersions).where(eq(rateModelVersions.id, draftId));
    expect(row.status).toBe("draft");
    expect(row.createdBy).toBe(engineer.id);
    expect(row.epsilonA).toBeCloseTo(0.5, 12);
    expect((row.content as { tolerancePct: number }).tolerancePct).toBe(8);
    expect(failures).toEqual([]);
    await page.close();
  });

  it("lets quality approve it with a password signature, refusing a wrong password first", async () => {
    const page = await signIn(quality);
    await page.goto(base + "/quality");
    await page.getByRole("link", { name: new RegExp(`Rate model ${approvedV1.code} version 2`) }).click();
    await page.getByRole("button", { name: "Approve with signature" }).click();
    await page.getByText(`approved — Rate model ${approvedV1.code} version 2`).waitFor();
    await page.getByText(/legally binding electronic signature/).waitFor();

    await page.getByLabel("Your password").fill("not my password at all");
    await page.getByRole("button", { name: "Sign: approved" }).click();
    await page.getByText("The password is not right. Nothing was signed.").waitFor({ timeout: 15_000 });
    const signedAfterWrong = await t.database.db.select().from(signatures).where(and(eq(signatures.entityType, "rate-model-version"), eq(signatures.entityId, draftId)));
    expect(signedAfterWrong).toEqual([]);

    await page.getByLabel("Your password").fill(quality.password);
    await page.getByLabel("Comment").fill("Checked against the bench batches.");
    await page.getByRole("button", { name: "Sign: approved" }).click();
    await page.getByText(/is approved\./).waitFor({ timeout: 15_000 });
    const signed = await t.database.db.select().from(signatures).where(and(eq(signatures.entityType, "rate-model-version"), eq(signatures.entityId, draftId)));
    expect(signed).toHaveLength(1);
    expect(signed[0].signerId).toBe(quality.id);
    expect(signed[0].meaning).toBe("approved");
    expect(signed[0].comment).toBe("Checked against the bench batches.");
    await page.close();
  });

  it("shows the engineer the version approved, signed by quality, and version 1 superseded", async () => {
    const page = await signIn(engineer);
    await page.goto(`${base}/rate-models/versions/${draftId}`);
    await page.getByRole("heading", { level: 1 }).waitFor();
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toMatch(/version 2\s*Approved/);
    const signature = page.getByRole("listitem").filter({ hasText: "Browser Quality" });
    expect(await signature.innerText()).toMatch(/Approved[\s\S]*Signed \(UTC\)\s*\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC[\s\S]*Local time/);
    expect(await signature.innerText()).not.toMatch(/Changed since signing/);
    const history = page.getByRole("region", { name: "All versions" });
    expect(await history.innerText()).toMatch(/Version 1\s*Superseded/);
    expect(await page.getByRole("button", { name: "Approve with signature" }).count()).toBe(0);
    await page.close();
  });
});

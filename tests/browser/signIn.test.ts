import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import type { TestApp } from "../support/testApp.js";
import { buildPerson, type BuiltPerson } from "../factories.js";
import { startBrowserApp, type BrowserApp } from "../support/browser.js";

let t: TestApp;
let browser: Browser;
let rig: BrowserApp;
let base: string;
let operator: BuiltPerson;

beforeAll(async () => {
  rig = await startBrowserApp();
  ({ t, base, browser } = rig);
  operator = await buildPerson(t.database.db, { roles: ["operator"], name: "Browser Operator" });
}, 180_000);

afterAll(() => rig?.close());

describe("signing in from the browser", () => {
  it("signs the operator in, shows the operator home, and signs out", async () => {
    const page = await browser.newPage();
    const failures: string[] = [];
    page.on("pageerror", (e) => failures.push(e.message));
    await page.goto(base + "/");
    await page.getByLabel("Email").fill(operator.email);
    await page.getByLabel("Password").fill(operator.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("heading", { name: /Operator/ }).first().waitFor({ timeout: 15_000 });
    expect(page.url()).toContain("/operator");
    expect(await page.getByText("Browser Operator").first().isVisible()).toBe(true);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.getByRole("button", { name: "Sign in" }).waitFor({ timeout: 15_000 });
    expect(page.url()).toContain("/sign-in");
    expect(failures).toEqual([]);
    await page.close();
  });

  it("says why a wrong password is refused", async () => {
    const page = await browser.newPage();
    await page.goto(base + "/sign-in");
    await page.getByLabel("Email").fill(operator.email);
    await page.getByLabel("Password").fill("this is not it");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText(/email or password is not right/i).waitFor({ timeout: 15_000 });
    await page.close();
  });

  it("serves the page and its bundled font from the same origin", async () => {
    const page = await browser.newPage();
    const fonts: string[] = [];
    page.on("response", (r) => r.url().match(/\.woff2?($|\?)/) && fonts.push(r.url()));
    await page.goto(base + "/sign-in");
    await page.evaluate(() => document.fonts.ready);
    expect(fonts.length).toBeGreaterThan(0);
    expect(fonts.every((f) => f.startsWith(base))).toBe(true);
    await page.close();
  });
});

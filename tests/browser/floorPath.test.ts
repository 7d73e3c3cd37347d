import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { TestApp } from "../support/testApp.js";
import { buildPerson, buildPlannedBatch, type BuiltPerson } from "../factories.js";
import { startBrowserApp, type BrowserApp } from "../support/browser.js";
import { auditEvents, batches, mailOutbox, signatures, stepEntries } from "../../server/db/schema.js";

let t: TestApp;
let browser: Browser;
let rig: BrowserApp;
let base: string;
let operator: BuiltPerson;
let supervisor: BuiltPerson;
let mailedPath = "";

const V0 = 22; // L, the planned batch's V0
const EPSILON_A = 0.7;
const K = 2.0e-3; // 1/s

/**
 * A logger CSV of an ideal first-order batch at constant pressure: V = V0(1 + εA(1 − e^(−kt)))
 * (the integrated first-order rate law for a variable-volume batch, common practice).
 */
function firstOrderTraceCsv(endS: number, stepS: number): { csv: string; endS: number } {
  const rows = ["t (s),V (L),T (°C),P (bar(a))"];
  for (let time = 0; time <= endS; time += stepS) rows.push(`${time},${(V0 * (1 + EPSILON_A * (1 - Math.exp(-K * time)))).toFixed(5)},250.0,2.000`);
  return { csv: rows.join("\n") + "\n", endS };
}

async function signIn(page: Page, person: BuiltPerson) {
  await page.getByLabel("Email").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

const card = (page: Page, title: string) => page.getByRole("article", { name: title });

/** Types the password into the open signature dialog and signs with the given meaning. */
async function sign(page: Page, password: string, meaning: "performed" | "verified") {
  const dialog = page.getByRole("dialog");
  await dialog.getByLabel("Your password").fill(password);
  await dialog.getByRole("button", { name: `Sign: ${meaning}` }).click();
}

async function performAndSign(page: Page, title: string, password: string) {
  await card(page, title).getByRole("button", { name: /^Sign as performed/ }).click();
  await sign(page, password, "performed");
  await card(page, title).getByText(/recorded and signed as performed/).waitFor({ timeout: 15_000 });
}

beforeAll(async () => {
  rig = await startBrowserApp();
  ({ t, base, browser } = rig);
  operator = await buildPerson(t.database.db, { roles: ["operator"], name: "Floor Operator" });
  supervisor = await buildPerson(t.database.db, { roles: ["supervisor"], name: "Floor Supervisor" });
}, 180_000);

afterAll(() => rig?.close());

describe("the plant floor's path through a batch", () => {
  it("charges and runs a batch with critical steps verified from the mail's link, adds a trace and sends it for review", async () => {
    const { batch } = await buildPlannedBatch(t.database.db);
    const db = t.database.db;
    const failures: string[] = [];
    const op = await browser.newPage({ viewport: { width: 1024, height: 768 } });
    op.on("pageerror", (e) => failures.push(e.message));
    await op.goto(base + "/sign-in");
    await signIn(op, operator);
    await op.getByRole("heading", { name: /Operator/ }).first().waitFor({ timeout: 15_000 });
    await op.goto(base + `/batches/${batch.id}`);
    await op.getByRole("heading", { name: `Batch ${batch.code}` }).waitFor({ timeout: 15_000 });

    // The pressurised-vessel caution before charging, with the vessel's ratings (demo 40 L vessel).
    const caution = op.getByRole("complementary", { name: /Caution before charging/ });
    await expect(caution.getByText("10 bar(g)").isVisible()).resolves.toBe(true);
    await expect(caution.getByText("8.5 bar(g)").isVisible()).resolves.toBe(true);

    // A double click on a move sends it once.
    await op.getByRole("button", { name: "Start charging" }).dblclick();
    await op.getByText("Start charging: done").waitFor({ timeout: 15_000 });
    await op.waitForTimeout(500);
    const starts = await db.select().from(auditEvents).where(and(eq(auditEvents.entityId, batch.id), eq(auditEvents.action, "batch-start-charging")));
    expect(starts).toHaveLength(1);
    const [afterStart] = await db.select().from(batches).where(eq(batches.id, batch.id));
    expect([afterStart.state, afterStart.revision]).toEqual(["charging", batch.revision + 1]);

    // A wrong signing password is refused and nothing is signed or recorded.
    const relief = card(op, "Confirm relief protection");
    await relief.getByLabel("In service, tag current").check();
    await relief.getByLabel("Leak-test pressure").fill("2.5");
    await relief.getByRole("button", { name: /^Sign as performed/ }).click();
    await sign(op, "not my password", "performed");
    await op.getByRole("dialog").getByText("The password is not right. Nothing was signed.").waitFor({ timeout: 15_000 });
    expect(await db.select().from(stepEntries).where(eq(stepEntries.batchId, batch.id))).toHaveLength(0);
    expect(await db.select().from(signatures).where(eq(signatures.entityId, `${batch.id}/reliefCheck`))).toHaveLength(0);
    await sign(op, operator.password, "performed");
    await relief.getByText("Performed — waits for a second person").waitFor({ timeout: 15_000 });

    // An out-of-limit charge is flagged at once and needs a comment before it can be signed.
    // 5.3–5.52 g per litre of V0 × 22 L = 116.6–121.44 g (arithmetic on the master record's limits).
    const dmx = card(op, "Charge DMX");
    await dmx.getByLabel("DMX lot number").fill("DMX-L-0419");
    await dmx.getByLabel("DMX charged", { exact: true }).fill("125");
    await dmx.getByText("Outside the limits (116.6 to 121.44 g)").waitFor({ timeout: 5_000 });
    await dmx.getByRole("button", { name: /^Sign as performed/ }).click();
    await dmx.getByText(/A comment is needed: say why DMX charged is outside its limits/).waitFor({ timeout: 5_000 });
    expect(await op.getByRole("dialog").isVisible()).toBe(false);
    await dmx.getByLabel("Comment on DMX charged").fill("Cylinder over-delivered; supervisor told.");
    await performAndSign(op, "Charge DMX", operator.password);
    await dmx.getByText("outside limits").waitFor();

    await card(op, "Charge nitrogen").getByLabel("Nitrogen charged").fill("8.5");
    await performAndSign(op, "Charge nitrogen", operator.password);

    // The supervisor follows the link in the verification mail.
    const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, supervisor.email));
    const waiting = mails.find((m) => m.subject.includes("Confirm relief protection") && m.subject.includes("waits for your verification"));
    mailedPath = /\/batches\/[0-9a-f-]{36}/.exec(waiting?.textBody ?? "")?.[0] ?? "";
    expect(mailedPath).toBe(`/batches/${batch.id}`);
    const sup = await browser.newPage({ viewport: { width: 1024, height: 768 } });
    sup.on("pageerror", (e) => failures.push(e.message));
    await sup.goto(base + "/sign-in");
    await signIn(sup, supervisor);
    await sup.getByRole("heading", { name: /Supervisor/ }).first().waitFor({ timeout: 15_000 });
    await sup.goto(base + mailedPath);
    for (const title of ["Confirm relief protection", "Charge DMX"]) {
      await card(sup, title).getByRole("button", { name: "Verify as second person" }).click();
      await sign(sup, supervisor.password, "verified");
      await card(sup, title).getByText(`${title}: verified. The step is complete.`).waitFor({ timeout: 15_000 });
    }

    // The operator starts the run; the caution comes again before pressurising.
    await op.getByRole("button", { name: "Start the run" }).click();
    await op.getByText("Start the run: done").waitFor({ timeout: 15_000 });

    // A hold needs a reason; so does resuming, which the supervisor also signs.
    await op.getByRole("button", { name: "Put on hold" }).click();
    const holdDialog = op.getByRole("dialog");
    await holdDialog.getByLabel("Reason").fill("Temperature controller alarm");
    await holdDialog.getByRole("button", { name: "Put on hold" }).click();
    await op.getByText(/^Put on hold: done/).waitFor({ timeout: 15_000 });
    await sup.getByRole("button", { name: "Resume" }).click({ timeout: 15_000 });
    const resumeDialog = sup.getByRole("dialog");
    await resumeDialog.getByRole("button", { name: "Continue to signature" }).click();
    await resumeDialog.getByText(/must say why/i).waitFor({ timeout: 5_000 });
    await resumeDialog.getByLabel("Reason").fill("Controller replaced and checked");
    await resumeDialog.getByRole("button", { name: "Continue to signature" }).click();
    await sup.getByRole("dialog").getByLabel("Your password").fill(supervisor.password);
    await sup.getByRole("dialog").getByRole("button", { name: "Sign: resumed" }).click();
    await sup.getByText(/^Resume: done/).waitFor({ timeout: 15_000 });
    const [resumed] = await db.select().from(auditEvents).where(and(eq(auditEvents.entityId, batch.id), eq(auditEvents.action, "batch-resume")));
    expect(resumed.reason).toBe("Controller replaced and checked");
    await op.getByRole("button", { name: "Put on hold" }).waitFor({ timeout: 15_000 });
    const pressurise = card(op, "Pressurise and heat");
    await pressurise.getByRole("complementary", { name: "Caution before pressurising" }).waitFor();
    await pressurise.getByLabel("Temperature at start").fill("250.1");
    await pressurise.getByLabel("Pressure at start").fill("2.0");
    await pressurise.getByRole("button", { name: "Now for Reaction start" }).click();
    await performAndSign(op, "Pressurise and heat", operator.password);

    // The supervisor's open page shows the step waiting for verification without a reload (live events).
    await card(sup, "Pressurise and heat").getByRole("button", { name: "Verify as second person" }).click({ timeout: 15_000 });
    await sign(sup, supervisor.password, "verified");
    await card(sup, "Pressurise and heat").getByText("Pressurise and heat: verified. The step is complete.").waitFor({ timeout: 15_000 });

    // The operator uploads the logger trace; the page says what the checks found.
    const { csv, endS } = firstOrderTraceCsv(1800, 10);
    const bytes = Buffer.from(csv, "utf8");
    await op.getByLabel("Trace file (CSV)").setInputFiles({ name: "hf-logger.csv", mimeType: "text/csv", buffer: bytes });
    await op.getByRole("button", { name: "Upload and check the trace" }).click();
    await op.getByText("Trace added: within the model so far").waitFor({ timeout: 20_000 });
    // The SHA-256 shown is the file's own, computed here with Node's crypto.
    await op.getByText(createHash("sha256").update(bytes).digest("hex")).waitFor();
    // Conversion at the last reading: X = 1 − e^(−k·t) for a first-order batch (common practice).
    const conversion = op.locator("dt", { hasText: "Conversion now" }).locator("xpath=following-sibling::dd[1]");
    await conversion.waitFor({ timeout: 15_000 });
    expect(Number(await conversion.innerText())).toBeCloseTo(1 - Math.exp(-K * endS), 3);

    const runEnd = card(op, "End of run");
    await runEnd.getByRole("button", { name: "Now for Run end" }).click();
    await runEnd.getByLabel("Final volume reading").fill("37.3");
    await performAndSign(op, "End of run", operator.password);

    await op.getByRole("button", { name: "Start sampling" }).click();
    await op.getByText("Start sampling: done").waitFor({ timeout: 15_000 });
    const sample = card(op, "Take the gas sample");
    await sample.getByLabel("Sample bulb id").fill("BULB-7");
    await sample.getByRole("button", { name: "Now for Sample time" }).click();
    await performAndSign(op, "Take the gas sample", operator.password);

    await op.getByRole("button", { name: "Send for review" }).click();
    await op.getByText("Send for review: done. The batch is now in review.").waitFor({ timeout: 15_000 });
    const [final] = await db.select().from(batches).where(eq(batches.id, batch.id));
    expect(final.state).toBe("review");
    expect(failures).toEqual([]);
    await op.close();
    await sup.close();
  });

  it("takes a signed-out person who follows a mailed batch link to that batch after sign-in", async () => {
    expect(mailedPath).not.toBe("");
    const page = await browser.newPage({ viewport: { width: 1024, height: 768 } });
    await page.goto(base + mailedPath);
    await page.getByRole("button", { name: "Sign in" }).waitFor({ timeout: 15_000 });
    await signIn(page, supervisor);
    await page.getByRole("heading", { name: /^Batch / }).waitFor({ timeout: 15_000 });
    expect(new URL(page.url()).pathname).toBe(mailedPath);
    await page.close();
  });
});

import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { readdirSync, readFileSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { startTestApp, type TestApp } from "../../support/testApp.js";
import { startMailCatcher, type MailCatcher } from "../../../server/services/mailCatcher.js";
import { freePort } from "../../support/freePort.js";
import { mailOutbox } from "../../../server/db/schema.js";

// This file runs its own catcher so that stopping it affects no other test, and its own
// database so that its outbox holds only its own messages.
let t: TestApp;
let catcher: MailCatcher;
let port: number;
const dir = mkdtempSync(join(tmpdir(), "isobatch-mail-"));
beforeAll(async () => {
  port = await freePort();
  catcher = await startMailCatcher(dir, port);
  t = await startTestApp({ smtpUrl: `smtp://127.0.0.1:${port}`, databaseUrl: inject("isolatedDatabaseUrl") });
});
afterAll(async () => {
  await catcher.stop();
  await t.close();
  rmSync(dir, { recursive: true, force: true });
});

const received = () => readdirSync(dir).map((f) => readFileSync(join(dir, f), "utf8"));
const outboxRow = async (subject: string) => (await t.database.db.select().from(mailOutbox).where(eq(mailOutbox.subject, subject)))[0];

describe("mail through the outbox", () => {
  it("delivers a queued message to the catcher and marks it sent", async () => {
    const subject = `Batch waiting for verification ${Date.now()}`;
    await t.database.db.transaction((tx) => t.mail.enqueue(tx, { to: "supervisor@harrowfen.example", subject, text: "Step 3 of batch HF-24-P1 waits for you." }));
    await t.mail.sendDue();
    expect(received().some((m) => m.includes(subject))).toBe(true);
    const row = await outboxRow(subject);
    expect(row.status).toBe("sent");
    expect(row.sentAt).not.toBeNull();
  });

  it("keeps a message queued while the mail server is down and sends it once it is back", async () => {
    await catcher.stop();
    const subject = `Batch held ${Date.now()}`;
    await t.database.db.transaction((tx) => t.mail.enqueue(tx, { to: "quality@harrowfen.example", subject, text: "Batch HF-24-P2 was put on hold." }));
    await t.mail.sendDue();
    let row = await outboxRow(subject);
    expect(row.status).toBe("queued");
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());

    catcher = await startMailCatcher(dir, port);
    // Make the retry due now rather than waiting out the backoff.
    await t.database.db.update(mailOutbox).set({ nextAttemptAt: new Date(Date.now() - 1000) }).where(eq(mailOutbox.id, row.id));
    await t.mail.sendDue();
    row = await outboxRow(subject);
    expect(row.status).toBe("sent");
    expect(row.attempts).toBe(2);
    expect(received().filter((m) => m.includes(subject))).toHaveLength(1);
  });
});

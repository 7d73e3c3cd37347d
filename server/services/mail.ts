import nodemailer, { type Transporter } from "nodemailer";
import { and, asc, eq, lte, sql } from "drizzle-orm";
import type { Db, DbOrTx } from "../db/client.js";
import { mailOutbox } from "../db/schema.js";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface MailService {
  /** Queues a message in the caller's transaction; the worker sends it after commit. */
  enqueue(tx: DbOrTx, mail: OutgoingMail): Promise<void>;
  /** Sends what is due now; returns how many were sent. */
  sendDue(): Promise<number>;
  start(): void;
  stop(): Promise<void>;
  check(): Promise<void>;
}

export interface MailOptions {
  db: Db;
  smtpUrl: string;
  from: string;
  pollMs: number;
  log: { warn: (obj: object, msg: string) => void };
}

const MAX_BACKOFF_MS = 10 * 60_000;
/** Wait before attempt n+1: 5 s, 10 s, 20 s … capped at 10 min. Never gives up: mail is never lost. */
export const backoffMs = (attempts: number) => Math.min(MAX_BACKOFF_MS, 5000 * 2 ** Math.max(0, attempts - 1));

/** The outbox and its worker over nodemailer. */
export function createMailService(opts: MailOptions): MailService {
  const transport: Transporter = nodemailer.createTransport(withTimeouts(opts.smtpUrl));
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<number> | undefined;
  let stopped = false;

  async function sendOne(): Promise<"sent" | "failed" | "none"> {
    return opts.db.transaction(async (tx) => {
      // SKIP LOCKED lets several app servers share one outbox without sending twice.
      const [due] = await tx
        .select()
        .from(mailOutbox)
        .where(and(eq(mailOutbox.status, "queued"), lte(mailOutbox.nextAttemptAt, sql`now()`)))
        .orderBy(asc(mailOutbox.nextAttemptAt))
        .limit(1)
        .for("update", { skipLocked: true });
      if (!due) return "none";
      try {
        await transport.sendMail({ from: opts.from, to: due.to, subject: due.subject, text: due.textBody, messageId: `<${due.id}@isobatch>` });
        await tx.update(mailOutbox).set({ status: "sent", sentAt: sql`now()`, attempts: due.attempts + 1, lastError: null }).where(eq(mailOutbox.id, due.id));
      } catch (err) {
        const attempts = due.attempts + 1;
        await tx
          .update(mailOutbox)
          .set({ attempts, lastError: String((err as Error).message).slice(0, 500), nextAttemptAt: sql`now() + ${backoffMs(attempts)} * interval '1 millisecond'` })
          .where(eq(mailOutbox.id, due.id));
        opts.log.warn({ mailId: due.id, attempts, err: (err as Error).message }, "mail not sent; will retry");
        return "failed"; // its next attempt is now in the future, so the round moves on
      }
      return "sent";
    });
  }

  async function sendDue(): Promise<number> {
    let sent = 0;
    for (let outcome = await sendOne(); outcome !== "none" && !stopped; outcome = await sendOne()) if (outcome === "sent") sent++;
    return sent;
  }

  const tick = async () => {
    if (running || stopped) return;
    running = sendDue().catch((err) => {
      opts.log.warn({ err: (err as Error).message }, "mail worker round failed");
      return 0;
    });
    await running;
    running = undefined;
  };

  return {
    enqueue: async (tx, mail) => {
      await tx.insert(mailOutbox).values({ to: mail.to, subject: mail.subject, textBody: mail.text });
    },
    sendDue,
    start: () => {
      stopped = false;
      timer ??= setInterval(tick, opts.pollMs);
    },
    stop: async () => {
      stopped = true;
      if (timer) clearInterval(timer);
      timer = undefined;
      await running;
      transport.close();
    },
    check: async () => {
      await transport.verify();
    },
  };
}

// A mail server that hangs must not hold a worker round for long.
function withTimeouts(url: string): string {
  const u = new URL(url);
  for (const [k, v] of [["connectionTimeout", "5000"], ["greetingTimeout", "5000"], ["socketTimeout", "10000"]]) if (!u.searchParams.has(k)) u.searchParams.set(k, v);
  return u.toString();
}

import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { desc } from "drizzle-orm";
import { simpleParser } from "mailparser";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { allow } from "../../policies/access.js";
import { mailOutbox } from "../../db/schema.js";

const iso = (d: Date | null) => d?.toISOString() ?? null;

/** /api/mail: the outbox, and what the local mail catcher received (admins). */
export function mailRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/mail", registry);

  r.get("/outbox", allow("admin"), async (_req, res) => {
    const rows = await ctx.db.select().from(mailOutbox).orderBy(desc(mailOutbox.createdAt)).limit(500);
    res.json({
      messages: rows.map((m) => ({ id: m.id, to: m.to, subject: m.subject, status: m.status, attempts: m.attempts, lastError: m.lastError, nextAttemptAt: iso(m.nextAttemptAt), createdAt: iso(m.createdAt), sentAt: iso(m.sentAt) })),
    });
  });

  r.get("/received", allow("admin"), async (_req, res) => {
    const dir = ctx.settings.mailDir;
    if (!dir) return res.json({ messages: [], note: "Mail goes to an outside SMTP server; there is no local catcher to read." });
    const names = (await readdir(dir).catch(() => [] as string[])).filter((n) => n.endsWith(".eml")).sort().reverse().slice(0, 200);
    const messages = await Promise.all(
      names.map(async (name) => {
        const parsed = await simpleParser(await readFile(join(dir, name)));
        const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(", ") : (parsed.to?.text ?? "");
        return { id: name.replace(/\.eml$/, ""), from: parsed.from?.text ?? "", to, subject: parsed.subject ?? "", date: parsed.date?.toISOString() ?? null, text: parsed.text ?? "" };
      }),
    );
    res.json({ messages });
  });
  return r;
}

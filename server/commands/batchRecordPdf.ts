import PDFDocument from "pdfkit";
import { createRequire } from "node:module";
import { and, asc, eq, inArray, like, or } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { auditEvents, people, signatures } from "../db/schema.js";
import type { BatchRecord } from "./batchRecord.js";
import type { KineticsCheckRow } from "./kineticsGate.js";
import type { ReviewException } from "./reviewExceptions.js";
import type { BatchYield } from "./yieldCheck.js";
import { fromSI } from "../../shared/units/index.js";

const require = createRequire(import.meta.url);
const font = (weight: number) => require.resolve(`@fontsource/public-sans/files/public-sans-latin-${weight}-normal.woff`);

// The bundled font has no Greek letters; the record spells them out.
const plain = (s: string) => s.replace(/ε/g, "epsilon").replace(/Δ/g, "delta").replace(/δ/g, "delta");
const utc = (d: Date | string) => new Date(d).toISOString().replace("T", " ").replace(/\.\d+Z$/, " UTC");
const val = (v: unknown) => (v === null || v === undefined ? "—" : typeof v === "number" ? String(+v.toPrecision(6)) : String(v));

export interface RecordDocumentInput {
  record: BatchRecord;
  check: KineticsCheckRow | null;
  exceptions: ReviewException[];
  trace: { t: number[]; V: number[] };
  yield: BatchYield;
}

/** Renders the executed batch record as a PDF (Public Sans embedded) and returns its bytes. */
export async function renderBatchRecordPdf(db: DbOrTx, input: RecordDocumentInput): Promise<Buffer> {
  const { record, check, exceptions, trace } = input;
  const { batch, vessel, campaign, masterRecord, model } = record;
  const batchSigs = await db.select().from(signatures).where(and(eq(signatures.entityType, "batch"), eq(signatures.entityId, batch.id))).orderBy(asc(signatures.signedAt));
  const devIds = record.deviations.map((d) => d.id);
  const devSigs = devIds.length ? await db.select().from(signatures).where(and(eq(signatures.entityType, "deviation"), inArray(signatures.entityId, devIds))) : [];
  const audit = await db.select().from(auditEvents).where(or(eq(auditEvents.entityId, batch.id), like(auditEvents.entityId, `${batch.id}/%`), devIds.length ? inArray(auditEvents.entityId, devIds) : undefined)).orderBy(asc(auditEvents.seq));
  const ids = new Set<string>([...record.steps.flatMap((s) => s.entries.map((e) => e.enteredBy)), ...record.samples.map((s) => s.takenBy)]);
  const names = new Map((ids.size ? await db.select({ id: people.id, name: people.name }).from(people).where(inArray(people.id, [...ids])) : []).map((p) => [p.id, p.name]));

  const doc = new PDFDocument({ size: "A4", margins: { top: 50, bottom: 50, left: 50, right: 50 }, info: { Title: `Executed batch record ${batch.code}`, Author: "Isobatch" }, bufferPages: true });
  doc.registerFont("body", font(400));
  doc.registerFont("bold", font(700));
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((ok) => doc.on("end", () => ok(Buffer.concat(chunks))));
  const h = (text: string) => doc.moveDown(0.6).font("bold").fontSize(13).text(plain(text)).moveDown(0.2).font("body").fontSize(9.5);
  const line = (text: string) => doc.font("body").fontSize(9.5).text(plain(text));
  const sigLine = (s: { signerName: string; meaning: string; signedAt: Date | string; comment: string | null }, note = "") => line(`  Signed ${s.meaning} by ${s.signerName}, ${utc(s.signedAt)}${s.comment ? ` — “${s.comment}”` : ""}${note}`);

  doc.font("bold").fontSize(18).text(`Executed batch record — ${batch.code}`);
  doc.font("body").fontSize(9.5).text(`Isobatch · printed ${utc(new Date())} · state: ${batch.state}`);
  h("Batch");
  line(`Campaign ${campaign.code}: ${campaign.process}`);
  line(`Vessel ${vessel.tag} (${vessel.description}); MAWP ${fromSI(vessel.mawpPa, "bar(g)").toFixed(2)} bar(g), relief set ${fromSI(vessel.reliefSetPa, "bar(g)").toFixed(2)} bar(g), rated ${vessel.minVolumeL}–${vessel.maxVolumeL} L`);
  line(`Scale: V0 ${val(batch.v0L)} L at ${(batch.temperatureK - 273.15).toFixed(1)} °C and ${fromSI(batch.pressurePa, "bar(a)").toFixed(3)} bar(a); planned final volume ${val((batch.plan as { finalVolumeL: number }).finalVolumeL)} L`);
  line(`Master record version ${masterRecord.version} (target conversion ${masterRecord.content.targetConversion}); rate model version ${model.version}: order ${model.content.order}, k_ref ${model.content.kRef} at ${model.content.TRefK} K, Ea ${model.content.EaJPerMol / 1000} kJ/mol, εA ${model.epsilonA}`);

  for (const phase of ["charge", "run", "sample", "release"] as const) {
    const steps = record.steps.filter((s) => s.phase === phase);
    if (!steps.length) continue;
    h(`Phase: ${phase}`);
    for (const s of steps) {
      doc.font("bold").fontSize(10.5).text(plain(`${s.step.title}${s.step.critical ? " (critical)" : ""} — ${s.status}`));
      if (!s.entries.length) line("  Not performed.");
      for (const e of s.entries) {
        const vals = s.step.fields.map((f) => `${f.label}: ${val((e.values as Record<string, unknown>)[f.key])}${f.kind === "number" && f.unit ? ` ${f.unit}` : ""}`).join("; ");
        line(`  Version ${e.version} by ${names.get(e.enteredBy) ?? "?"}, ${utc(e.enteredAt)}${e.version === s.entries.length ? "" : " (superseded)"}: ${vals}`);
        for (const [k, c] of Object.entries(e.comments as Record<string, string>)) line(`    Comment on ${k}: ${c}`);
        if ((e.outOfLimit as string[]).length) line(`    Outside limits: ${(e.outOfLimit as string[]).join(", ")}`);
        if (e.reason) line(`    Reason for correction: ${e.reason}`);
      }
      for (const sig of s.signatures) sigLine(sig, sig.matchesContent ? "" : " [no longer matches the current entry]");
    }
  }

  h("Yield");
  const y = input.yield;
  line(y.finalConversion === null ? "No trace: the final conversion is not known." : `Final conversion ${y.finalConversion.toFixed(3)} against the theoretical 1.000${y.limits ? `; accepted ${y.limits.low} to ${y.limits.high}: ${y.within ? "within" : "OUTSIDE"}` : "; the master record sets no limits"}`);

  h("Samples");
  if (!record.samples.length) line("None recorded.");
  for (const s of record.samples) line(`${utc(s.sampledAt)}: volume ${val(s.volumeL)} L${s.labResult ? `; lab result: ${s.labResult}` : ""} (by ${names.get(s.takenBy) ?? "?"})`);

  h("Deviations");
  if (!record.deviations.length) line("None.");
  for (const d of record.deviations) {
    line(`${d.title} — ${d.severity}, ${d.status}. ${d.description}`);
    if (d.rootCause) line(`  Root cause: ${d.rootCause}. Action: ${d.action}${d.coversKinetics ? " (accepted as covering the kinetics result)" : ""}`);
    for (const sig of devSigs.filter((x) => x.entityId === d.id)) sigLine(sig);
  }

  h("Kinetics check");
  if (!check) line("The check has not run on the current traces.");
  else {
    line(`Verdict: ${check.verdict === "within" ? "within the model" : "outside the model"} (library ${check.libraryVersion}, ${utc(check.ranAt)}, ${check.points} points)`);
    line(`k observed ${val(check.kObserved)} (95 % ${val(check.kObservedLow)} to ${val(check.kObservedHigh)}) against the model's ${val(check.kModel)} at the batch temperature; deviation ${val(check.deviationPct)} %; residual RMS ${val(check.residualRms)} L`);
    for (const r of check.reasons as { message: string }[]) line(`  - ${r.message}`);
    line(`Trace files (SHA-256): ${(check.traceHashes as string[]).join(", ") || "none"}`);
    drawChart(doc, trace, ((check.result as { predicted?: number[] }).predicted ?? []) as number[]);
  }

  h("Review exceptions");
  if (!exceptions.length) line("None.");
  for (const e of exceptions) line(`${e.title}${e.reviewed ? ` — reviewed by ${e.reviewed.signerName}, ${utc(e.reviewed.signedAt)}` : " — not reviewed"}`);

  h("Attachments");
  if (!record.attachments.length) line("None.");
  for (const { a, f } of record.attachments) line(`${f.originalName} (${f.contentType}, ${f.sizeBytes} bytes${a.stepKey ? `, step ${a.stepKey}` : ""}) SHA-256 ${f.sha256}`);
  for (const t of record.traces) line(`Trace file ${t.fileId}: ${t.points} points, SHA-256 ${t.sha256}`);

  h("Batch signatures");
  if (!batchSigs.length) line("None.");
  for (const s of batchSigs) sigLine(s);

  h("Audit trail of this batch");
  for (const a of audit) line(`#${a.seq} ${utc(a.occurredAt)} ${a.actorName}: ${a.action}${a.reason ? ` — ${a.reason}` : ""}`);

  const pages = doc.bufferedPageRange();
  for (let i = 0; i < pages.count; i++) {
    doc.switchToPage(pages.start + i);
    doc.font("body").fontSize(8).text(`${batch.code} · page ${i + 1} of ${pages.count}`, 50, doc.page.height - 35, { lineBreak: false });
  }
  doc.end();
  return done;
}

/** Observed (dots) against predicted (line) volume, drawn as vectors. */
function drawChart(doc: PDFKit.PDFDocument, trace: { t: number[]; V: number[] }, predicted: number[]) {
  if (trace.t.length < 2) return;
  const w = 440;
  const hgt = 160;
  if (doc.y + hgt + 40 > doc.page.height - 60) doc.addPage();
  const x0 = 70;
  const y0 = doc.y + 10;
  const tMax = trace.t[trace.t.length - 1];
  const all = [...trace.V, ...predicted];
  const vMin = Math.min(...all);
  const vMax = Math.max(...all);
  const X = (t: number) => x0 + (t / tMax) * w;
  const Y = (v: number) => y0 + hgt - ((v - vMin) / (vMax - vMin || 1)) * hgt;
  doc.save().lineWidth(0.5).strokeColor("#444").rect(x0, y0, w, hgt).stroke();
  const step = Math.max(1, Math.floor(trace.t.length / 400));
  if (predicted.length === trace.t.length) {
    doc.moveTo(X(trace.t[0]), Y(predicted[0]));
    for (let i = step; i < trace.t.length; i += step) doc.lineTo(X(trace.t[i]), Y(predicted[i]));
    doc.lineWidth(1.2).strokeColor("#1f4e79").stroke();
  }
  doc.fillColor("#b45309");
  for (let i = 0; i < trace.t.length; i += step) doc.circle(X(trace.t[i]), Y(trace.V[i]), 1.2).fill();
  doc.restore();
  doc.font("body").fontSize(8).fillColor("black");
  doc.text(`${vMax.toPrecision(4)} L`, 20, y0 - 3, { lineBreak: false });
  doc.text(`${vMin.toPrecision(4)} L`, 20, y0 + hgt - 6, { lineBreak: false });
  doc.text(`0 s`, x0, y0 + hgt + 4, { lineBreak: false });
  doc.text(`${Math.round(tMax)} s`, x0 + w - 30, y0 + hgt + 4, { lineBreak: false });
  doc.text("Dots: observed volume. Line: the model's prediction at the batch temperature.", x0, y0 + hgt + 16);
  doc.x = 50;
}

import busboy from "busboy";
import { createHash } from "node:crypto";
import type { Request } from "express";
import { eq } from "drizzle-orm";
import type { Readable } from "node:stream";
import type { RouteContext } from "../../services/types.js";
import { policyRouter, type RouteDeclaration } from "../../http/policyRouter.js";
import { signedIn, type SignedInPerson } from "../../policies/access.js";
import { HttpError, conflict, notFound } from "../../http/errors.js";
import { idParam } from "../../http/params.js";
import { files } from "../../db/schema.js";
import { receiveFile, formatBytes, type ReceivedFile } from "../../commands/fileReceiver.js";
import { createsRecord } from "../../http/recordEffects.js";

/** Reads the single `file` part of a multipart request into receiveFile. */
function receiveMultipart(ctx: RouteContext, req: Request): Promise<ReceivedFile> {
  const max = ctx.settings.uploadMaxBytes;
  const declared = Number(req.get("content-length") ?? 0);
  if (declared > max + 1024 * 1024) return Promise.reject(new HttpError(413, "file-too-large", `The file is larger than the limit of ${formatBytes(max)}.`, "file"));
  if (!req.is("multipart/form-data")) return Promise.reject(new HttpError(415, "multipart-required", "Send the file as multipart/form-data with a part named \"file\".", "file"));
  return new Promise((ok, fail) => {
    let bb: busboy.Busboy;
    try {
      bb = busboy({ headers: req.headers, limits: { files: 1, fileSize: max + 1, fields: 10, fieldSize: 10_000 } });
    } catch {
      return fail(new HttpError(400, "invalid-multipart", "The multipart body could not be read.", "file"));
    }
    let handled = false;
    const settle = (result: Promise<ReceivedFile>) => {
      handled = true;
      result.then(ok, (err) => {
        // Drain what the client is still sending so the refusal reaches it.
        req.unpipe(bb);
        req.resume();
        fail(err);
      });
    };
    bb.on("file", (name, stream: Readable, info) => {
      if (name !== "file" || handled) {
        stream.resume();
        return;
      }
      settle(receiveFile({ db: ctx.db, storage: ctx.storage, maxBytes: max }, req.user as SignedInPerson, stream, info.filename ?? "unnamed"));
    });
    bb.on("error", () => !handled && fail(new HttpError(400, "invalid-multipart", "The multipart body could not be read.", "file")));
    bb.on("close", () => !handled && fail(new HttpError(400, "file-missing", "No part named \"file\" was sent.", "file")));
    req.pipe(bb);
  });
}

async function sha256Of(stream: Readable): Promise<string> {
  const hash = createHash("sha256");
  for await (const chunk of stream) hash.update(chunk);
  return hash.digest("hex");
}

/** /api/files: upload (streamed, hashed) and download (hash checked first). */
export function fileRoutes(ctx: RouteContext, registry: RouteDeclaration[]) {
  const r = policyRouter("/api/files", registry);

  r.post("/", signedIn, createsRecord, async (req, res) => {
    res.status(201).json({ file: await receiveMultipart(ctx, req) });
  });

  r.get("/:id", signedIn, async (req, res) => {
    const row = await ctx.db.query.files.findFirst({ where: eq(files.id, idParam(req)) });
    if (!row) throw notFound("That file");
    let actual: string;
    try {
      actual = await sha256Of(await ctx.storage.get(row.storageKey));
    } catch {
      throw new HttpError(503, "storage-unavailable", "The file store is not answering; try again in a moment.");
    }
    if (actual !== row.sha256) throw conflict("file-hash-mismatch", "The stored file no longer matches the hash recorded at upload. It is not served; report this to quality.", { expectedSha256: row.sha256, actualSha256: actual });
    const body = await ctx.storage.get(row.storageKey);
    res.set({
      "Content-Type": row.contentType,
      "Content-Length": String(row.sizeBytes),
      "Content-Disposition": `attachment; filename*=UTF-8''${encodeURIComponent(row.originalName)}`,
      "X-Content-SHA256": row.sha256,
    });
    body.pipe(res);
  });

  r.get("/:id/details", signedIn, async (req, res) => {
    const row = await ctx.db.query.files.findFirst({ where: eq(files.id, idParam(req)) });
    if (!row) throw notFound("That file");
    res.json({ file: { id: row.id, originalName: row.originalName, contentType: row.contentType, sizeBytes: row.sizeBytes, sha256: row.sha256, uploadedAt: row.uploadedAt.toISOString() } });
  });
  return r;
}

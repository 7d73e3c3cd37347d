import { createHash, randomUUID } from "node:crypto";
import { Readable } from "node:stream";
import { fileTypeFromBuffer } from "file-type";
import type { Db } from "../db/client.js";
import { files } from "../db/schema.js";
import type { StorageService } from "../services/storage.js";
import { recordAudit, type Actor } from "./audit.js";
import { HttpError } from "../http/errors.js";

/** Types Isobatch keeps: photos, instrument printouts, logger files. Judged from the bytes. */
export const ALLOWED_TYPES = ["image/png", "image/jpeg", "application/pdf", "text/csv", "text/plain"] as const;

const SNIFF_BYTES = 4100;

/** Decides a file's type from its first bytes; text is told apart from binary by its content. */
export async function sniffType(head: Buffer, declaredName: string): Promise<string | undefined> {
  const detected = await fileTypeFromBuffer(head);
  if (detected) return (ALLOWED_TYPES as readonly string[]).includes(detected.mime) ? detected.mime : undefined;
  if (head.includes(0)) return undefined;
  // Cut at the last complete line so a multi-byte character split by the sample is not judged.
  const text = head.length === SNIFF_BYTES ? head.subarray(0, Math.max(head.lastIndexOf(10), 1)) : head;
  try {
    new TextDecoder("utf-8", { fatal: true }).decode(text);
  } catch {
    return undefined;
  }
  return /\.(csv|tsv)$/i.test(declaredName) ? "text/csv" : "text/plain";
}

export interface ReceivedFile {
  id: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: string;
}

/**
 * Streams one upload into the bucket under a fresh opaque key while hashing it, then records
 * its row and audit entry. A refused or failed upload leaves neither row nor object.
 */
export async function receiveFile(deps: { db: Db; storage: StorageService; maxBytes: number }, actor: Actor, stream: Readable, declaredName: string): Promise<ReceivedFile> {
  const iterator = stream[Symbol.asyncIterator]();
  const head: Buffer[] = [];
  let headLength = 0;
  let ended = false;
  while (headLength < SNIFF_BYTES) {
    const next = await iterator.next();
    if (next.done) {
      ended = true;
      break;
    }
    head.push(next.value);
    headLength += next.value.length;
  }
  if (headLength === 0) throw new HttpError(400, "empty-file", "The file is empty.", "file");
  if (headLength > deps.maxBytes) throw tooLarge(deps.maxBytes);
  const contentType = await sniffType(Buffer.concat(head).subarray(0, SNIFF_BYTES), declaredName);
  if (!contentType) throw new HttpError(415, "file-type-not-allowed", `This kind of file is not accepted. Accepted: PNG or JPEG photos, PDF printouts, CSV or plain-text logger files.`, "file");

  const hash = createHash("sha256");
  let size = 0;
  const body = Readable.from(
    (async function* () {
      for (const chunk of head) {
        size += chunk.length;
        hash.update(chunk);
        yield chunk;
      }
      while (!ended) {
        const next = await iterator.next();
        if (next.done) break;
        size += next.value.length;
        if (size > deps.maxBytes) throw tooLarge(deps.maxBytes);
        hash.update(next.value);
        yield next.value;
      }
    })(),
  );
  const key = `files/${randomUUID()}`;
  try {
    await deps.storage.put(key, body, contentType);
  } catch (err) {
    await deps.storage.remove(key).catch(() => undefined);
    if (err instanceof HttpError) throw err;
    throw new HttpError(503, "storage-unavailable", "The file store did not take the file. Nothing was saved; try again.", "file");
  }
  const sha256 = hash.digest("hex");
  try {
    return await deps.db.transaction(async (tx) => {
      const [row] = await tx.insert(files).values({ storageKey: key, originalName: declaredName.slice(0, 255) || "unnamed", contentType, sizeBytes: size, sha256, uploadedBy: actor.id! }).returning();
      const view = { id: row.id, originalName: row.originalName, contentType, sizeBytes: size, sha256, uploadedAt: row.uploadedAt.toISOString() };
      await recordAudit(tx, actor, { action: "file-uploaded", entityType: "file", entityId: row.id, after: view });
      return view;
    });
  } catch (err) {
    await deps.storage.remove(key).catch(() => undefined);
    throw err;
  }
}

const tooLarge = (max: number) => new HttpError(413, "file-too-large", `The file is larger than the limit of ${formatBytes(max)}.`, "file");

export const formatBytes = (n: number) => (n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(1)} MB` : n >= 1024 ? `${(n / 1024).toFixed(1)} kB` : `${n} bytes`);

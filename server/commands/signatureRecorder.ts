import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { and, asc, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "../db/client.js";
import { signatures } from "../db/schema.js";
import { HttpError } from "../http/errors.js";
import type { CheckCredentials } from "./credentialChecker.js";
import type { SignedInPerson } from "../policies/access.js";
import { recordAudit } from "./audit.js";
import type { SignatureMeaning, SignatureView } from "../../shared/schemas/common.js";

/** SHA-256 of the RFC 8785 canonical JSON of `content`: what a signature is bound to. */
export function contentHash(content: unknown): string {
  const text = canonicalize(content);
  if (text === undefined) throw new Error("Nothing to sign: the content cannot be written as JSON.");
  return createHash("sha256").update(text, "utf8").digest("hex");
}

/**
 * Confirms the signer by their password at the moment of signing. A wrong password counts
 * towards the lockout like a failed sign-in; nothing is signed.
 */
export async function confirmSigner(check: CheckCredentials, signer: SignedInPerson, password: string): Promise<void> {
  const result = await check(signer.email, password, "signature");
  if (result.ok) return;
  if (result.reason === "account-locked") throw new HttpError(423, "account-locked", "Your account is now locked after too many failed attempts. Nothing was signed. Ask an administrator to unlock it.");
  if (result.reason === "account-inactive") throw new HttpError(403, "account-inactive", "This account has been deactivated. Nothing was signed.");
  throw new HttpError(422, "signature-password-wrong", "The password is not right. Nothing was signed.", "password");
}

export interface SignatureRequest {
  meaning: SignatureMeaning;
  entityType: string;
  entityId: string;
  content: unknown;
  comment?: string | null;
}

/** Records a signature (and its audit row) in the caller's transaction. */
export async function recordSignature(tx: DbOrTx, signer: SignedInPerson, request: SignatureRequest) {
  const [row] = await tx
    .insert(signatures)
    .values({ signerId: signer.id, signerName: signer.name, meaning: request.meaning, comment: request.comment ?? null, entityType: request.entityType, entityId: request.entityId, contentHash: contentHash(request.content) })
    .returning();
  await recordAudit(tx, signer, { action: `signed-${request.meaning}`, entityType: request.entityType, entityId: request.entityId, after: { signatureId: row.id, meaning: row.meaning, contentHash: row.contentHash, comment: row.comment } });
  return row;
}

/** The signatures on records, each marked whether the record still matches what was signed. */
export async function signaturesFor(db: DbOrTx, entityType: string, contents: Map<string, unknown>): Promise<Map<string, SignatureView[]>> {
  const ids = [...contents.keys()];
  const out = new Map<string, SignatureView[]>(ids.map((id) => [id, []]));
  if (ids.length === 0) return out;
  const rows = await db.select().from(signatures).where(and(eq(signatures.entityType, entityType), inArray(signatures.entityId, ids))).orderBy(asc(signatures.signedAt));
  const hashes = new Map(ids.map((id) => [id, contentHash(contents.get(id))]));
  for (const r of rows) {
    out.get(r.entityId)!.push({ id: r.id, signerId: r.signerId, signerName: r.signerName, meaning: r.meaning as SignatureMeaning, comment: r.comment, signedAt: r.signedAt.toISOString(), contentHash: r.contentHash, matchesContent: r.contentHash === hashes.get(r.entityId) });
  }
  return out;
}

import { z } from "zod";

/** A finite number (JSON numbers only; no strings, no NaN). */
export const finite = (what = "must be a number") => z.number({ error: what }).refine(Number.isFinite, what);
export const positive = (what = "must be a positive number") => finite(what).refine((v) => v > 0, what);

export const Uuid = z.uuid({ error: "must be an id" });

/** The password re-entered at the moment of an electronic signature (never stored). */
export const SignatureSchema = z.object({
  password: z.string({ error: "is required: re-enter your password to sign" }).min(1, "is required: re-enter your password to sign").max(256, "is too long"),
  comment: z.string().trim().max(2000, "must be at most 2000 characters").optional(),
});
export type SignatureInput = z.infer<typeof SignatureSchema>;

/** Meanings a signature can carry; later steps add their own. */
export const SIGNATURE_MEANINGS = ["performed", "verified", "reviewed", "approved", "released", "rejected", "resumed", "closed", "investigated", "training-recorded", "training-withdrawn"] as const;
export type SignatureMeaning = (typeof SIGNATURE_MEANINGS)[number];

/** A signature as every screen shows it. */
export interface SignatureView {
  id: string;
  signerId: string;
  signerName: string;
  meaning: SignatureMeaning;
  comment: string | null;
  signedAt: string;
  contentHash: string;
  /** False when the signed record's content has changed since it was signed. */
  matchesContent: boolean;
}

export const VERSION_STATUSES = ["draft", "approved", "superseded"] as const;
export type VersionStatus = (typeof VERSION_STATUSES)[number];

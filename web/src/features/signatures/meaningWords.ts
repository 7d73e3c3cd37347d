import type { SignatureMeaning } from "../../../../shared/schemas/common";

/** How each signature meaning reads on screen; the stored meaning stays the code. */
export const MEANING_WORDS: Record<SignatureMeaning, string> = {
  performed: "Performed",
  verified: "Verified",
  reviewed: "Reviewed",
  approved: "Approved",
  released: "Released",
  rejected: "Rejected",
  resumed: "Resumed",
  closed: "Closed",
  investigated: "Investigated",
  "training-recorded": "Training recorded",
  "training-withdrawn": "Training withdrawn",
};

import type { SignatureView } from "../../../../shared/schemas/common";

export type ExceptionKind = "out-of-limit" | "correction" | "late-entry" | "signature-mismatch" | "deviation" | "kinetics-outside" | "kinetics-not-run" | "attachment-hash";

/** One thing in the executed record that needs quality's eyes before release. */
export interface ReviewExceptionView {
  key: string;
  kind: ExceptionKind;
  title: string;
  detail: Record<string, unknown>;
  stepKey: string | null;
  /** False when it must be resolved elsewhere first (an open deviation, a check not run). */
  reviewable: boolean;
  reviewed: SignatureView | null;
}

/** The stored kinetics check on the batch's current traces, with the full result. */
export interface ReviewCheckView {
  id: string;
  verdict: "within" | "outside";
  reasons: { code: string; message: string }[];
  kObserved: number | null;
  kObservedCI95: [number | null, number | null];
  kModel: number;
  deviationPct: number | null;
  residualRms: number | null;
  points: number;
  maxConversion: number | null;
  libraryVersion: string;
  traceHashes: string[];
  rateModelVersionId: string;
  ranAt: string;
  result: {
    kUnit?: string;
    notes?: string[];
    notice: string;
    predicted: (number | null)[];
    linearised: { x: (number | null)[]; y: (number | null)[]; slope: number | null; modelSlope: number | null } | null;
    fit: { residuals: (number | null)[]; residualRms: number | null; points: number; excludedPoints?: number } | null;
  };
}

/** GET /api/batches/:id/review. */
export interface ReviewView {
  check: ReviewCheckView | null;
  exceptions: ReviewExceptionView[];
}

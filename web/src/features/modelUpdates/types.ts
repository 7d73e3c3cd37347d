import type { RateModelContent, RateModelVersionView } from "../../../../shared/schemas/rateModels";

/** One released batch's k, fitted at the temperature it ran at. */
export interface ProposalPoint {
  batchId: string;
  code: string;
  /** K */
  T: number;
  k: number;
  kStdError: number | null;
  kCI95: [number | null, number | null];
  points: number;
}

/** POST /api/rate-models/versions/:id/proposal. */
export interface ProposalView {
  points: ProposalPoint[];
  arrhenius: {
    kRef: number;
    TRef: number;
    /** J/mol */
    Ea: number;
    kRefCI95: [number | null, number | null];
    EaCI95: [number | null, number | null];
    r2: number | null;
    weighted?: boolean;
    warnings: string[];
  };
  proposed: RateModelContent;
  draft: RateModelVersionView | null;
}

/** A deviation as GET /api/deviations lists it. */
export interface DeviationListRow {
  id: string;
  batchId: string;
  batchCode: string;
  stepKey: string | null;
  source: string;
  title: string;
  description: string;
  severity: "minor" | "major" | "critical";
  status: "open" | "investigated" | "closed";
  rootCause: string | null;
  action: string | null;
  coversKinetics: boolean;
  raisedAt: string;
  closedAt: string | null;
  revision: number;
}

export type DeviationStatusFilter = "not-closed" | "open" | "investigated" | "closed";

import type { DeviationOnBatch } from "../batches/types";

/** A deviation as GET /api/deviations lists it: as on its batch page, with the batch named, without the people. */
export type DeviationListRow = Omit<DeviationOnBatch, "raisedBy" | "investigatedBy" | "closedBy"> & { batchId: string; batchCode: string };

export type DeviationStatusFilter = "not-closed" | "open" | "investigated" | "closed";

import type { DbOrTx } from "../db/client.js";
import type { BatchRecord } from "./batchRecord.js";
import type { BatchFacts } from "../../shared/machines/batchMoves.js";

/** What the release guards need from the kinetics check and the review (filled in by the review step). */
export interface KineticsGate {
  factsFor(tx: DbOrTx, record: BatchRecord): Promise<{ kinetics: BatchFacts["kinetics"]; unreviewedExceptions: number }>;
}

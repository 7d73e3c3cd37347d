import type { BatchPlanInput, BatchPlanResult } from "../../../../shared/schemas/campaigns";
import type { SignatureView } from "../../../../shared/schemas/common";
import type { FieldDefinition, Phase } from "../../../../shared/schemas/masterRecords";
import type { RateModelContent } from "../../../../shared/schemas/rateModels";
import type { BatchFacts, BatchMove, BatchState, HoldableState, Refusal } from "../../../../shared/machines/batchMoves";
import type { BatchTrainingView } from "../../../../shared/schemas/training";
import type { Forecast } from "../../../../shared/execution/forecast";

/** A person as the batch view names them. */
export interface PersonRef {
  id: string;
  name: string;
}

/** One version of a step's entry; corrections add versions, nothing is overwritten. */
export interface StepEntryView {
  id: string;
  version: number;
  values: Record<string, unknown>;
  comments: Record<string, string>;
  outOfLimit: string[];
  reason: string | null;
  enteredBy: PersonRef | null;
  enteredAt: string;
}

/** A field definition with its limits worked out at this batch's V0. */
export type BatchFieldView = FieldDefinition & { limitsAtScale: { low: number | null; high: number | null } };

export type StepStatus = "not-started" | "awaiting-verification" | "complete";

/** One step of the pinned master record, with everything recorded against it. */
export interface BatchStepView {
  phase: Phase;
  key: string;
  title: string;
  instructions: string;
  critical: boolean;
  fields: BatchFieldView[];
  status: StepStatus;
  performedBy: PersonRef | null;
  verifiedBy: PersonRef | null;
  entries: StepEntryView[];
  signatures: SignatureView[];
}

export interface DeviationOnBatch {
  id: string;
  stepKey: string | null;
  source: string;
  title: string;
  description: string;
  severity: "minor" | "major" | "critical";
  status: "open" | "investigated" | "closed";
  rootCause: string | null;
  action: string | null;
  coversKinetics: boolean;
  raisedBy: PersonRef | null;
  raisedAt: string;
  investigatedBy: PersonRef | null;
  closedBy: PersonRef | null;
  closedAt: string | null;
  revision: number;
}

export interface AttachmentView {
  id: string;
  stepKey: string | null;
  note: string | null;
  file: { id: string; name: string; contentType: string; sizeBytes: number; sha256: string };
  addedBy: PersonRef | null;
  addedAt: string;
}

export interface TraceFileView {
  id: string;
  fileId: string;
  sha256: string;
  points: number;
  addedBy: PersonRef | null;
  addedAt: string;
}

export interface SampleView {
  id: string;
  sampledAt: string;
  volumeL: number;
  labResult: string | null;
  fileId: string | null;
  takenBy: PersonRef | null;
}

/** A lifecycle move as the server judged it for the viewer. */
export interface MoveView {
  move: BatchMove;
  label: string;
  allowed: boolean;
  refusals: Refusal[];
}

/** GET /api/batches/:id: the whole batch page. */
export interface BatchView {
  batch: {
    id: string;
    code: string;
    state: BatchState;
    heldFrom: HoldableState | null;
    holdReason: string | null;
    revision: number;
    v0L: number;
    temperatureK: number;
    pressurePa: number;
    entered: Pick<BatchPlanInput, "v0" | "temperature" | "pressure">;
    plan: BatchPlanResult;
    createdAt: string;
  };
  campaign: { id: string; code: string; process: string };
  vessel: {
    id: string;
    tag: string;
    description: string;
    status: "in-service" | "out-of-service";
    mawpPa: number;
    reliefSetPa: number;
    minVolumeL: number;
    maxVolumeL: number;
    boreAreaM2: number | null;
    entered: { pressureUnit: string; volumeUnit: string };
  };
  masterRecord: { id: string; version: number; targetConversion: number; maxConversion: number };
  rateModel: { id: string; version: number; epsilonA: number; yA0: number; content: RateModelContent; kAtBatchTemperature: number };
  steps: BatchStepView[];
  deviations: DeviationOnBatch[];
  attachments: AttachmentView[];
  traces: TraceFileView[];
  samples: SampleView[];
  facts: BatchFacts;
  moves: MoveView[];
  /** Whether the viewer's training on this master-record version is current, and if not, why. */
  training: BatchTrainingView;
}

/** A row of GET /api/batches. */
export interface BatchListRow {
  id: string;
  code: string;
  state: BatchState;
  revision: number;
  v0L: number;
  campaignId: string;
  campaignCode: string;
  vesselTag: string;
  createdAt: string;
}

/** GET /api/batches/:id/trace: the combined trace against the model, and the forecast. */
export interface BatchTraceView {
  trace: { t: number[]; V: number[]; T: number[] | null; P: number[] | null; files: number };
  predicted: number[];
  kModel: number;
  forecast: Forecast;
}

/** POST /api/batches/:id/traces: what adding a logger file found. */
export interface TraceAdded {
  id: string;
  points: number;
  deviationsRaised: string[];
  outsideModel: boolean;
  reasons: string[];
}

/** An uploaded file as POST /api/files answers. */
export interface UploadedFile {
  id: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: string;
}

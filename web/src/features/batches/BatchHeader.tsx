import { Link } from "react-router";
import { BatchStateBadge } from "../../components/BatchStateBadge";
import { Notice } from "../../components/Notice";
import { rateConstantUnit } from "../../../../shared/schemas/rateModels";
import { formatInUnit, formatNumber } from "../vessels/quantityFormat";
import { STATE_WORDS } from "./batchStates";
import type { BatchView } from "./types";

/** The batch page's header: code, campaign, vessel, state, operating point and the pinned versions. */
export function BatchHeader({ view }: { view: BatchView }) {
  const { batch, campaign, vessel, masterRecord, rateModel } = view;
  const entered = batch.entered;
  return (
    <header className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-3xl font-bold">Batch {batch.code}</h1>
        <BatchStateBadge state={batch.state} large />
      </div>
      <dl className="grid gap-x-6 gap-y-1 rounded-lg border-2 border-ink-200 bg-white p-4 sm:grid-cols-[max-content_1fr] lg:grid-cols-[max-content_1fr_max-content_1fr]">
        <dt className="font-semibold">Campaign</dt>
        <dd>
          {campaign.code} — {campaign.process}
        </dd>
        <dt className="font-semibold">Vessel</dt>
        <dd>
          {vessel.tag}
          {vessel.status === "out-of-service" && <strong className="ml-2 text-alarm-800">(out of service)</strong>}
        </dd>
        <dt className="font-semibold">V0</dt>
        <dd>{formatInUnit(batch.v0L, entered.v0.unit)}</dd>
        <dt className="font-semibold">Temperature</dt>
        <dd>{formatInUnit(batch.temperatureK, entered.temperature.unit)}</dd>
        <dt className="font-semibold">Pressure</dt>
        <dd>{formatInUnit(batch.pressurePa, entered.pressure.unit)}</dd>
        <dt className="font-semibold">εA</dt>
        <dd>{formatNumber(rateModel.epsilonA, 4)}</dd>
        <dt className="font-semibold">Master record</dt>
        <dd>
          <Link to={`/master-records/versions/${masterRecord.id}`}>Version {masterRecord.version}</Link> (target conversion {formatNumber(masterRecord.targetConversion, 3)})
        </dd>
        <dt className="font-semibold">Rate model</dt>
        <dd>
          <Link to={`/rate-models/versions/${rateModel.id}`}>Version {rateModel.version}</Link> (k at this temperature {formatNumber(rateModel.kAtBatchTemperature, 4)} {rateConstantUnit(rateModel.content.order)})
        </dd>
      </dl>
      {batch.state === "held" && (
        <Notice tone="error" title={`On hold${batch.heldFrom ? ` while ${STATE_WORDS[batch.heldFrom].toLowerCase()}` : ""}`}>
          <p>Reason: {batch.holdReason ?? "not given"}</p>
          <p>Work stops until a supervisor resumes the batch with a signature.</p>
        </Notice>
      )}
    </header>
  );
}

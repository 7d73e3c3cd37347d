import type { BatchPlanResult } from "../../../../shared/schemas/campaigns";
import type { VesselView } from "../../../../shared/schemas/vessels";
import { formatNumber } from "../vessels/quantityFormat";

const litres = (l: number) => `${formatNumber(l, 4)} L`;
const range = (low: number | null, high: number | null, unit: string) => {
  if (low === null && high === null) return "—";
  if (low === null) return `at most ${formatNumber(high, 4)} ${unit}`;
  if (high === null) return `at least ${formatNumber(low, 4)} ${unit}`;
  return `${formatNumber(low, 4)} to ${formatNumber(high, 4)} ${unit}`;
};

function VolumeAgainstRating({ plan, vessel }: { plan: BatchPlanResult; vessel: VesselView }) {
  const top = Math.max(vessel.maxVolumeL, plan.finalVolumeL, plan.v0L) * 1.05;
  const at = (l: number) => `${Math.min(100, Math.max(0, (l / top) * 100))}%`;
  const within = plan.finalVolumeL >= vessel.minVolumeL && plan.finalVolumeL <= vessel.maxVolumeL;
  return (
    <div className="flex flex-col gap-1">
      <p>
        <span className="font-semibold">Final volume {litres(plan.finalVolumeL)}</span> at conversion {formatNumber(plan.maxConversion)} (V0 {litres(plan.v0L)}),{" "}
        {within ? "within" : <strong>outside</strong>} {vessel.tag}'s rated working volume of {litres(vessel.minVolumeL)} to {litres(vessel.maxVolumeL)}.
      </p>
      <div aria-hidden="true" className="relative h-6 rounded-sm bg-ink-100">
        <div className="absolute inset-y-0 border-x-2 border-ok-800 bg-ok-50" style={{ left: at(vessel.minVolumeL), width: `calc(${at(vessel.maxVolumeL)} - ${at(vessel.minVolumeL)})` }} />
        <div className="absolute inset-y-0 w-1 bg-ink-700" style={{ left: at(plan.v0L) }} title="V0" />
        <div className={`absolute -inset-y-1 w-1.5 ${within ? "bg-fen-700" : "bg-alarm-800"}`} style={{ left: at(plan.finalVolumeL) }} title="Final volume" />
      </div>
      <p aria-hidden="true" className="text-[0.85rem] text-ink-600">
        Shaded: rated range · thin mark: V0 · thick mark: final volume
      </p>
    </div>
  );
}

/** The live plan: εA, final volume against the vessel's rating, CA0, scaled charges, and every problem in words. */
export function PlanResult({ plan, vessel }: { plan: BatchPlanResult; vessel: VesselView }) {
  return (
    <section aria-labelledby="plan-result-title" className="flex flex-col gap-4 rounded-lg border-2 border-ink-200 bg-white p-5">
      <h3 id="plan-result-title" className="text-xl font-bold">
        The plan
      </h3>
      <div aria-live="polite" className="flex flex-col gap-3">
        {plan.problems.length > 0 ? (
          <div role="alert" className="rounded-md border-l-8 border-alarm-800 bg-alarm-50 px-4 py-3 text-alarm-800">
            <p className="font-bold">
              This plan cannot be saved: {plan.problems.length} {plan.problems.length === 1 ? "problem" : "problems"}
            </p>
            <ul className="ml-5 list-disc text-ink-950">
              {plan.problems.map((problem) => (
                <li key={problem.code}>{problem.message}</li>
              ))}
            </ul>
          </div>
        ) : (
          <p className="rounded-md border-l-8 border-ok-800 bg-ok-50 px-4 py-3 text-ok-800">
            No problems found against {vessel.tag}'s ratings and status. This does not replace the site's own pre-start checks.
          </p>
        )}
      </div>
      <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">εA</dt>
        <dd>{formatNumber(plan.epsilonA, 4)}</dd>
        <dt className="font-semibold">CA0</dt>
        <dd>{Number.isFinite(plan.cA0MolPerL) ? `${formatNumber(plan.cA0MolPerL, 4)} mol/L` : "— (needs a physical temperature and pressure)"}</dd>
        <dt className="font-semibold">Operating point</dt>
        <dd>
          {formatNumber(plan.temperatureK, 6)} K, {formatNumber(plan.pressurePa / 1e5, 4)} bar(a)
        </dd>
      </dl>
      <VolumeAgainstRating plan={plan} vessel={vessel} />
      <div className="flex flex-col gap-2">
        <h4 className="font-bold">Charges scaled to this V0</h4>
        {plan.charges.length === 0 ? (
          <p className="text-ink-600">The master record gives no charge per litre of V0.</p>
        ) : (
          <div className="relative overflow-x-auto rounded-md border-2 border-ink-200">
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Charges scaled to V0 of {litres(plan.v0L)}</caption>
              <thead className="bg-ink-100">
                <tr>
                  <th scope="col" className="px-3 py-2">Step</th>
                  <th scope="col" className="px-3 py-2">Entry</th>
                  <th scope="col" className="px-3 py-2">Per litre of V0</th>
                  <th scope="col" className="px-3 py-2">For this batch</th>
                </tr>
              </thead>
              <tbody>
                {plan.charges.map((charge) => (
                  <tr key={`${charge.stepKey}-${charge.fieldKey}`} className="border-t border-ink-200">
                    <td className="px-3 py-2">{charge.stepTitle}</td>
                    <td className="px-3 py-2">{charge.label}</td>
                    <td className="px-3 py-2 whitespace-nowrap">{range(charge.perLitre.low, charge.perLitre.high, `${charge.unit}/L`)}</td>
                    <td className="px-3 py-2 font-semibold whitespace-nowrap">{range(charge.scaled.low, charge.scaled.high, charge.unit)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </div>
    </section>
  );
}

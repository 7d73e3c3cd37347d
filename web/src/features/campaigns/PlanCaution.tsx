import { Caution } from "../../components/Caution";
import type { VesselView } from "../../../../shared/schemas/vessels";
import { formatInUnit, formatNumber } from "../vessels/quantityFormat";

const bar = (pa: number) => `${formatNumber(pa / 1e5, 4)} bar(a)`;

/** The pressurised-vessel caution with the vessel's MAWP and relief setting beside the planned pressure. */
export function PlanCaution({ vessel, plannedPa }: { vessel?: VesselView; plannedPa: number }) {
  const unit = vessel?.entered.pressureUnit;
  const both = (pa: number) => (unit && unit !== "bar(a)" ? `${bar(pa)} (${formatInUnit(pa, unit, 4)})` : bar(pa));
  return (
    <Caution>
      <p>
        The batch runs at pressure and temperature in a vessel that holds gas. Check the plan
        against the vessel's current inspection and relief-valve records, follow your site's
        permit and isolation procedures, and defer to local codes and licensed engineers where
        anything here disagrees with them.
      </p>
      {vessel ? (
        <dl className="mt-2 grid gap-x-4 font-semibold sm:grid-cols-[max-content_1fr]">
          <dt>MAWP of {vessel.tag}</dt>
          <dd>{both(vessel.mawpPa)}</dd>
          <dt>Relief set pressure</dt>
          <dd>{both(vessel.reliefSetPa)}</dd>
          <dt>Planned pressure</dt>
          <dd>{Number.isFinite(plannedPa) ? both(plannedPa) : "not entered yet"}</dd>
        </dl>
      ) : (
        <p className="mt-2 font-semibold">Choose a vessel to see its MAWP and relief set pressure here.</p>
      )}
    </Caution>
  );
}

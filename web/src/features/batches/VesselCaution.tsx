import { Caution } from "../../components/Caution";
import { formatInUnit } from "../vessels/quantityFormat";
import type { BatchView } from "./types";

/**
 * The pressurised-vessel caution with this batch's figures: MAWP and relief set pressure beside
 * the planned pressure, and the computed final volume against the vessel's rated range.
 */
export function VesselCaution({ view, moment }: { view: BatchView; moment: "charging" | "pressurising" }) {
  const { vessel, batch } = view;
  const pUnit = vessel.entered.pressureUnit;
  const vUnit = vessel.entered.volumeUnit;
  const plannedUnit = batch.entered.pressure.unit;
  const finalL = batch.plan.finalVolumeL;
  const inRange = finalL >= vessel.minVolumeL && finalL <= vessel.maxVolumeL;
  const planned = formatInUnit(batch.pressurePa, plannedUnit, 4);
  const plannedInVesselUnit = plannedUnit === pUnit ? null : formatInUnit(batch.pressurePa, pUnit, 4);
  return (
    <Caution title={moment === "charging" ? "Caution before charging: pressurised vessel" : "Caution before pressurising"}>
      <dl className="grid gap-x-4 gap-y-0.5 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Vessel</dt>
        <dd>
          {vessel.tag} — {vessel.description}
        </dd>
        <dt className="font-semibold">Planned pressure</dt>
        <dd className="font-bold">
          {planned}
          {plannedInVesselUnit ? ` (${plannedInVesselUnit})` : ""}
        </dd>
        <dt className="font-semibold">MAWP</dt>
        <dd>{formatInUnit(vessel.mawpPa, pUnit, 4)}</dd>
        <dt className="font-semibold">Relief set pressure</dt>
        <dd>{formatInUnit(vessel.reliefSetPa, pUnit, 4)}</dd>
        <dt className="font-semibold">Computed final volume</dt>
        <dd className="font-bold">
          {formatInUnit(finalL, vUnit, 4)} against the rated {formatInUnit(vessel.minVolumeL, vUnit, 4)} to {formatInUnit(vessel.maxVolumeL, vUnit, 4)}
          {inRange ? "" : " — OUTSIDE the rated range: do not go on; raise a deviation."}
        </dd>
      </dl>
      <p className="mt-2">
        {moment === "charging"
          ? "Confirm the relief device is in service and the vessel is isolated as your permit requires before anything is charged."
          : "Bring the vessel up to pressure and temperature only with the relief path open and the volume logger running; stop and hold the batch if the pressure nears the relief set pressure."}{" "}
        Follow your site's procedures, local codes and licensed engineers where anything here disagrees with them.
      </p>
    </Caution>
  );
}

import type { OrderTrialView } from "../../../../shared/schemas/kinetics";
import { formatNumber } from "../vessels/quantityFormat";

/** Every order tried by "auto", with the one chosen (lowest residual, simpler order preferred) marked. */
export function OrderTable({ trials, chosen, V0 }: { trials: OrderTrialView[]; chosen: { order: number; orderFitted: boolean }; V0: number }) {
  const isChosen = (t: OrderTrialView) => t.orderFitted === chosen.orderFitted && t.order === chosen.order;
  return (
    <div tabIndex={0} aria-label="Orders compared; scrolls sideways on narrow screens" className="relative overflow-x-auto rounded-md border-2 border-ink-200 bg-white">
      <table className="w-full border-collapse text-left">
        <caption className="px-3 py-2 text-left font-bold">Orders compared (integral method on the volumes)</caption>
        <thead className="bg-ink-100">
          <tr>
            {["Order", "k", "Unit of k", "Residual RMS (% of V0)", "r²", "Converged"].map((h) => (
              <th key={h} scope="col" className="border-b-2 border-ink-300 px-3 py-2 font-semibold whitespace-nowrap">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {trials.map((t) => (
            <tr key={t.label} className={`border-b border-ink-200 last:border-b-0 ${isChosen(t) ? "bg-fen-50 font-semibold" : "even:bg-ink-50"}`}>
              <th scope="row" className="px-3 py-2 text-left font-semibold whitespace-nowrap">
                {t.label}
                {isChosen(t) && <span className="ml-2 rounded-sm bg-fen-700 px-1.5 py-0.5 text-[0.85rem] text-white">best fit</span>}
              </th>
              <td className="px-3 py-2 tabular-nums">{formatNumber(t.k, 5)}</td>
              <td className="px-3 py-2">{t.kUnit}</td>
              <td className="px-3 py-2 tabular-nums whitespace-nowrap">
                {t.residualRms === null ? "—" : `${formatNumber(t.residualRms * 1000, 4)} mL (${formatNumber((100 * t.residualRms) / V0, 3)} %)`}
              </td>
              <td className="px-3 py-2 tabular-nums">{formatNumber(t.r2, 6)}</td>
              <td className="px-3 py-2">{t.converged ? "Yes" : "No"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

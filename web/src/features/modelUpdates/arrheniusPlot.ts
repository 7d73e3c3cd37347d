import type { IntervalChartProps, IntervalPoint } from "../../components/charts/IntervalChart";
import { GAS_CONSTANT } from "../../../../shared/kinetics/version";
import type { ProposalView } from "./types";

const lnOrNull = (v: number | null) => (v !== null && v > 0 ? Math.log(v) : null);

/** ln k on the Arrhenius line through kRef at TRef with activation energy Ea (J/mol), at 1000/T = `x`. */
export const lnKOnLine = (kRef: number, TRefK: number, EaJPerMol: number, x: number) => Math.log(kRef) - (EaJPerMol / GAS_CONSTANT) * (x / 1000 - 1 / TRefK);

/** The Arrhenius plot: ln k against 1000/T per batch with its 95 % interval, the fitted line and the current model's line. */
export function arrheniusChart(proposal: ProposalView, current: { kRef: number; TRefK: number; EaJPerMol: number }): Pick<IntervalChartProps, "points" | "lines" | "xDomain"> {
  const points: IntervalPoint[] = proposal.points.map((p) => ({ id: p.batchId, name: p.code, x: 1000 / p.T, y: Math.log(p.k), low: lnOrNull(p.kCI95[0]), high: lnOrNull(p.kCI95[1]) }));
  const xs = points.map((p) => p.x);
  const span = Math.max(...xs) - Math.min(...xs) || Math.abs(xs[0]) * 0.01;
  const xDomain: [number, number] = [Math.min(...xs) - span * 0.15, Math.max(...xs) + span * 0.15];
  const { kRef, TRef, Ea } = proposal.arrhenius;
  const along = (k: number, T: number, E: number): [number, number][] => xDomain.map((x) => [x, lnKOnLine(k, T, E, x)] as [number, number]);
  return {
    points,
    xDomain,
    lines: [
      { label: "Fitted line (proposal)", points: along(kRef, TRef, Ea) },
      { label: "Current version's line", points: along(current.kRef, current.TRefK, current.EaJPerMol), dashed: true, colour: "#0e5c63" },
    ],
  };
}

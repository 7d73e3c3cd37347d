import { predictVolume } from "../../../shared/kinetics/prediction";

export interface BenchTrace {
  t: number[];
  V: number[];
  predicted: number[];
}

/**
 * An invented HF-24 trace (demo data only): DMX → 2 MON with 30 % N2, εA = 0.7, first order,
 * 22 L at the start, 250 °C, 2.0 bar(a), three hours, with a little deterministic noise.
 */
export function benchTrace(points: number): BenchTrace {
  const duration = 3 * 3600;
  const t = new Float64Array(points);
  for (let i = 0; i < points; i++) t[i] = points > 1 ? (i * duration) / (points - 1) : 0;
  const model = predictVolume({ order: 1, k: 4.0e-4, epsilonA: 0.7, V0: 22 }, t);
  const V = new Array<number>(points);
  for (let i = 0; i < points; i++) V[i] = model[i] + 0.03 * Math.sin(i * 12.9898) * Math.cos(i * 0.7);
  return { t: Array.from(t), V, predicted: Array.from(model) };
}

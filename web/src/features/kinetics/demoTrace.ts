import { predictVolume } from "../../../../shared/kinetics/prediction";

/**
 * An invented HF-24 logger file for trying the screen: DMX → 2 MON with 30 % N2 (εA = 0.7),
 * first order at k = 2.0e-3 1/s, 40 L at the start, 250 °C and 2.0 bar(a), with a little
 * deterministic noise. Demo data only.
 */
export function demoTraceCsv(points = 100_000, kScale = 1): Blob {
  const duration = 3600;
  const t = new Float64Array(points);
  for (let i = 0; i < points; i++) t[i] = (i * duration) / (points - 1);
  const V = predictVolume({ order: 1, k: 2.0e-3 * kScale, epsilonA: 0.7, V0: 40 }, t);
  const lines: string[] = ["time (s),volume (L),temperature (°C),pressure (bar(a))"];
  for (let i = 0; i < points; i++) {
    const wobble = Math.sin(i * 12.9898) * Math.cos(i * 0.7);
    lines.push(`${t[i].toFixed(3)},${(V[i] + 0.02 * wobble).toFixed(4)},${(250 + 0.3 * wobble).toFixed(2)},${(2 + 0.004 * wobble).toFixed(4)}`);
  }
  return new Blob([lines.join("\n"), "\n"], { type: "text/csv" });
}

import { GAS_CONSTANT } from "./version.js";

/** Conversion of A read from the gas volume: XA = (V − V0)/(εA·V0). NaN when εA = 0. */
export function conversionFromVolume(V: number, V0: number, epsilonA: number): number {
  if (epsilonA === 0) return Number.NaN;
  return (V - V0) / (epsilonA * V0);
}

/** Gas volume at a conversion: V = V0(1 + εA·XA). */
export function volumeFromConversion(X: number, V0: number, epsilonA: number): number {
  return V0 * (1 + epsilonA * X);
}

/** Concentration of A at a conversion in a constant-pressure vessel, mol/L. */
export function concentrationFromConversion(X: number, cA0: number, epsilonA: number): number {
  return (cA0 * (1 - X)) / (1 + epsilonA * X);
}

/** Initial concentration of A in a gaseous charge, mol/L, from yA0, P (Pa) and T (K). */
export function initialConcentrationGas(yA0: number, P: number, T: number): number {
  return (yA0 * P) / (GAS_CONSTANT * T) / 1000;
}

/** Conversion at every point of a volume series. */
export function conversionSeries(V: ArrayLike<number>, V0: number, epsilonA: number): Float64Array {
  const X = new Float64Array(V.length);
  for (let i = 0; i < V.length; i++) X[i] = conversionFromVolume(V[i], V0, epsilonA);
  return X;
}

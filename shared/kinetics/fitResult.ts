/** Result of fitting a rate constant to a trace. */
export interface FitResult {
  method: "volume-nonlinear" | "linearised";
  order: number;
  /** True when n itself was fitted. */
  orderFitted: boolean;
  orderStdError?: number;
  orderCI95?: [number, number];
  k: number;
  kUnit: string;
  kStdError: number;
  kCI95: [number, number];
  r2: number;
  /** Observed minus predicted volume at each used point, L. */
  residuals: Float64Array;
  /** Root mean square of the residuals, L. */
  residualRms: number;
  points: number;
  excludedPoints: number;
  converged: boolean;
  iterations: number;
  warnings: string[];
}

/** Unit of k for a rate law of order n in mol/L and s. */
export function rateConstantUnit(order: number): string {
  if (order === 0) return "mol/(L·s)";
  if (order === 1) return "1/s";
  if (order === 2) return "L/(mol·s)";
  const exponent = Number((1 - order).toPrecision(6));
  return `(mol/L)^(${exponent})/s`;
}

/** Short label of an order for tables. */
export function orderLabel(order: number, fitted = false): string {
  const shown = Number(order.toPrecision(4));
  return fitted ? `free n = ${shown}` : `n = ${shown}`;
}

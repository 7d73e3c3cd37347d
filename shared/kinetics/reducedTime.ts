/**
 * Reduced time τ = k·cA0^(n−1)·t needed to reach conversion X at order n, by quadrature in the
 * transformed variable w = (u^(1−n) − 1)/(1 − n), u = 1 − X, where dτ/dw = −1/(1 + εA·X)^(1−n)
 * is smooth up to full conversion.
 */

const GAUSS_NODES = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
const GAUSS_WEIGHTS = [0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665, 0.2369268850561891];
/** Panels per unit of |w|, and the most used. */
const PANELS_PER_UNIT = 6;
const MAX_PANELS = 96;

/** w at conversion X for order n (w = ln(1 − X) at n = 1). */
function transformedState(X: number, order: number): number {
  const a = 1 - order;
  const lnU = Math.log1p(-X);
  if (a === 0) return lnU;
  return Math.expm1(a * lnU) / a;
}

/** Conversion at transformed state w for order n. */
function conversionAtState(w: number, order: number): number {
  const a = 1 - order;
  if (a === 0) return -Math.expm1(w);
  if (1 + a * w <= 0) return 1;
  return -Math.expm1(Math.log1p(a * w) / a);
}

/** τ(X): reduced time to reach conversion X (0 ≤ X ≤ 1; Infinity at X = 1 when n ≥ 1). */
export function reducedTimeAtConversion(X: number, order: number, epsilonA: number): number {
  if (!(X < 1)) return order < 1 && X === 1 ? integrate(transformedState(1, order), order, epsilonA) : Number.POSITIVE_INFINITY;
  if (order === 1 && X >= 0) return -Math.log1p(-X);
  return integrate(transformedState(X, order), order, epsilonA);
}

/**
 * τ(X) at orders 0, 1 and 2 in closed form, for 0 ≤ X < 1 (the integral method's straight
 * lines): ln(1 + εA·X)/εA (X when εA = 0), −ln(1 − X), and (1 + εA)·X/(1 − X) + εA·ln(1 − X).
 */
export function closedFormReducedTime(X: number, order: 0 | 1 | 2, epsilonA: number): number {
  if (order === 0) return epsilonA === 0 ? X : Math.log1p(epsilonA * X) / epsilonA;
  if (order === 1) return -Math.log1p(-X);
  return ((1 + epsilonA) * X) / (1 - X) + epsilonA * Math.log1p(-X);
}

function integrate(wEnd: number, order: number, epsilonA: number): number {
  if (!Number.isFinite(wEnd)) return Number.NaN;
  const a = 1 - order;
  const panels = Math.min(MAX_PANELS, 4 + Math.ceil(PANELS_PER_UNIT * Math.abs(wEnd)));
  const panel = wEnd / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = (p + 0.5) * panel;
    for (let g = 0; g < GAUSS_NODES.length; g++) {
      const w = mid + 0.5 * panel * GAUSS_NODES[g];
      const X = conversionAtState(w, order);
      sum += GAUSS_WEIGHTS[g] * Math.exp(-a * Math.log1p(epsilonA * X));
    }
  }
  return -0.5 * panel * sum;
}

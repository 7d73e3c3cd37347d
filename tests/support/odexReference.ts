import { createRequire } from "node:module";

// odex (an independent ODE solver from npm, used in tests only) ships TypeScript sources that do
// not pass this project's strict checks, so it is loaded untyped and given the small interface used here.
interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  maxSteps: number;
  solve(f: (x: number, y: number[]) => number[], x0: number, y0: number[], x1: number): { y: number[] };
}
const { Solver } = createRequire(import.meta.url)("odex") as { Solver: new (n: number) => OdexSolver };

/**
 * y at each of `times` (non-decreasing; earlier ones repeat the last value) for y' = f(t, y)
 * from y(0) = y0, integrated by odex to 1e−14 absolute and 1e−13 relative.
 */
export function odexSolve(f: (t: number, y: number) => number, y0: number, times: readonly number[]): number[] {
  const solver = new Solver(1);
  solver.absoluteTolerance = 1e-14;
  solver.relativeTolerance = 1e-13;
  solver.maxSteps = 1e6;
  const rhs = (t: number, y: number[]) => [f(t, y[0])];
  const out: number[] = [];
  let at = 0;
  let y = y0;
  for (const target of times) {
    if (target > at) {
      y = solver.solve(rhs, at, [y], target).y[0];
      at = target;
    }
    out.push(y);
  }
  return out;
}

/** Conversion from the rate law dX/dt = scale·(1 − X)^n/(1 + εA·X)^(n−1), scale = k·cA0^(n−1), by odex. */
export function odexConversion(order: number, scale: number, epsilonA: number, times: readonly number[]): number[] {
  return odexSolve((_t, y) => {
    const X = Math.min(y, 1);
    return (scale * Math.pow(1 - X, order)) / Math.pow(1 + epsilonA * X, order - 1);
  }, 0, times);
}

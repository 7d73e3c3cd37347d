import { closedFormPass } from "./closedFormPasses.js";
import { OPEN_GUARD, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";
import { likelyGrid, type RegularGrid } from "./regularGrid.js";
import { gridPass } from "./regularGridPasses.js";
import type { ClosedFormData } from "./closedFormRefinement.js";

/**
 * The full-data passes of one closed-form refinement. The first (checked) pass proves that every
 * point passes the guard and, where the times look regular, that they lie on the grid; the
 * passes after it evaluate with the faster grid loops when the grid held, else the general ones.
 */
export class ClosedFormPassRunner {
  private readonly cFactor: number;
  private readonly kFactor: number;
  private grid: RegularGrid | undefined;

  constructor(private readonly data: ClosedFormData) {
    this.cFactor = data.order === 1 ? 1 : Math.pow(data.cA0 ?? Number.NaN, data.order - 1);
    this.kFactor = data.V0 * data.epsilonA * this.cFactor;
  }

  /** False when k·cA0^(n−1) cannot give a finite prediction. */
  get usable(): boolean {
    return Number.isFinite(this.kFactor);
  }

  /** The setup at k; one object shape for every pass keeps the loops monomorphic. */
  setupAt(k: number, t = this.data.t, V = this.data.V): PassSetup {
    const { order, V0, epsilonA } = this.data;
    return { order, t, V, V0, epsilonA, scale: k * this.cFactor, kFactor: this.kFactor };
  }

  /** The checked pass at k: false when a point falls outside the guard. */
  first(k: number, sums: PassSums): boolean {
    const guard: PointGuard = this.data.guard ?? OPEN_GUARD;
    const setup = this.setupAt(k);
    this.grid = likelyGrid(this.data.t, setup.scale);
    if (this.grid !== undefined) {
      const outcome = gridPass(setup, this.grid, null, sums, guard);
      if (outcome !== "off grid") return outcome === "complete";
      this.grid = undefined;
    }
    return closedFormPass(setup, null, sums, guard);
  }

  /** A pass at k writing the residuals; only after `first` has proved the points. */
  withResiduals(k: number, residuals: Float64Array, sums: PassSums): void {
    if (this.grid === undefined) closedFormPass(this.setupAt(k), residuals, sums);
    else gridPass(this.setupAt(k), this.grid, residuals, sums, OPEN_GUARD);
  }
}

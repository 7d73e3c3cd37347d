import { closedFormPass } from "./closedFormPasses.js";
import { joinSums, OPEN_GUARD, type PassSetup, type PassSums, type PointGuard } from "./passBasics.js";
import { likelyGrid, type RegularGrid } from "./regularGrid.js";
import { gridPass } from "./regularGridPasses.js";
import type { ClosedFormData } from "./closedFormRefinement.js";

/**
 * The full-data passes of one closed-form refinement. The first (checked) pass proves that every
 * point passes the guard and, where the times look regular, that they lie on the grid; the
 * passes after it evaluate with the faster grid loops when the grid held, else the general ones.
 * When the times as a whole are not a grid but their leading run is (a selection that dropped
 * points near the end), the grid loops take that run and the general loops the rest.
 */
export class ClosedFormPassRunner {
  private readonly cFactor: number;
  private readonly kFactor: number;
  private grid: RegularGrid | undefined;
  /** Points the grid loops take: all of them, or the leading run when the rest is apart. */
  private gridPoints = 0;
  private readonly tailSums: PassSums = { ssr: 0, jtj: 0, jtr: 0, sst: 0 };

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
    const { t, V } = this.data;
    const n = t.length;
    const scale = k * this.cFactor;
    this.grid = likelyGrid(t, scale);
    this.gridPoints = n;
    const run = Math.min(n, this.data.leadingRun ?? 0);
    if (this.grid === undefined && run < n) {
      this.grid = likelyGrid(t.subarray(0, run), scale);
      this.gridPoints = run;
    }
    if (this.grid !== undefined) {
      const m = this.gridPoints;
      const outcome = gridPass(this.setupAt(k, t.subarray(0, m), V.subarray(0, m)), this.grid, null, sums, guard);
      if (outcome === "complete") {
        if (m === n) return true;
        const rest = closedFormPass(this.setupAt(k, t.subarray(m), V.subarray(m)), null, this.tailSums, guard);
        joinSums(sums, m, this.tailSums, n - m);
        return rest;
      }
      if (outcome !== "off grid") return false;
      this.grid = undefined;
    }
    return closedFormPass(this.setupAt(k), null, sums, guard);
  }

  /** A pass at k writing the residuals; only after `first` has proved the points. */
  withResiduals(k: number, residuals: Float64Array, sums: PassSums): void {
    if (this.grid === undefined) {
      closedFormPass(this.setupAt(k), residuals, sums);
      return;
    }
    const { t, V } = this.data;
    const n = t.length;
    const m = this.gridPoints;
    gridPass(this.setupAt(k, t.subarray(0, m), V.subarray(0, m)), this.grid, residuals.subarray(0, m), sums, OPEN_GUARD);
    if (m === n) return;
    closedFormPass(this.setupAt(k, t.subarray(m), V.subarray(m)), residuals.subarray(m), this.tailSums);
    joinSums(sums, m, this.tailSums, n - m);
  }
}

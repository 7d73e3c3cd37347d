/**
 * A pair of arrays reused from one fit to the next for the selected copy of a trace, which never
 * leaves the fit. A fresh pair of large arrays pays a page fault on the first touch of every
 * page: for a million points about as much as the copy itself (measured). Fits run to the end
 * synchronously, so one pair is never used by two at once. Arrays above RETAIN_LIMIT points are
 * not kept, so an occasional huge trace does not hold its memory afterwards.
 */
export class SelectionBuffers {
  private t = new Float64Array(0);
  private V = new Float64Array(0);

  constructor(private readonly retainLimit = RETAIN_LIMIT) {}

  /** Arrays of at least n points; their contents are whatever the last user left. */
  take(n: number): { t: Float64Array; V: Float64Array } {
    if (this.t.length >= n) return { t: this.t, V: this.V };
    const pair = { t: new Float64Array(n), V: new Float64Array(n) };
    if (n <= this.retainLimit) {
      this.t = pair.t;
      this.V = pair.V;
    }
    return pair;
  }
}

/** 2²² points: at most 64 MB held between fits. */
const RETAIN_LIMIT = 1 << 22;

/** An append-only Float64Array that doubles its capacity as it fills. */
export class GrowableFloat64 {
  private buffer: Float64Array;
  private size = 0;

  constructor(initialCapacity = 1024) {
    this.buffer = new Float64Array(Math.max(1, initialCapacity));
  }

  /** Number of values held. */
  get length(): number {
    return this.size;
  }

  /** Appends one value. */
  push(value: number): void {
    if (this.size === this.buffer.length) {
      const bigger = new Float64Array(this.buffer.length * 2);
      bigger.set(this.buffer);
      this.buffer = bigger;
    }
    this.buffer[this.size++] = value;
  }

  /** The values held, as a view on the internal buffer (no copy). */
  view(): Float64Array {
    return this.buffer.subarray(0, this.size);
  }
}

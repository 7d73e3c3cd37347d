/** Dense symmetric positive-definite systems of a handful of unknowns, row-major storage. */

/** Cholesky factor L (lower, row-major) of an n×n SPD matrix; undefined when not positive definite. */
export function choleskyFactor(A: ArrayLike<number>, n: number): Float64Array | undefined {
  const L = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = A[i * n + j];
      for (let k = 0; k < j; k++) sum -= L[i * n + k] * L[j * n + k];
      if (i === j) {
        if (!(sum > 0)) return undefined;
        L[i * n + i] = Math.sqrt(sum);
      } else {
        L[i * n + j] = sum / L[j * n + j];
      }
    }
  }
  return L;
}

/** Solves L·Lᵀ·x = b for x given the Cholesky factor L. */
export function choleskySolve(L: Float64Array, b: ArrayLike<number>, n: number): Float64Array {
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let sum = b[i];
    for (let k = 0; k < i; k++) sum -= L[i * n + k] * x[k];
    x[i] = sum / L[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let sum = x[i];
    for (let k = i + 1; k < n; k++) sum -= L[k * n + i] * x[k];
    x[i] = sum / L[i * n + i];
  }
  return x;
}

/** Inverse of an n×n SPD matrix; undefined when it is singular or not positive definite. */
export function invertSymmetric(A: ArrayLike<number>, n: number): Float64Array | undefined {
  const L = choleskyFactor(A, n);
  if (L === undefined) return undefined;
  const inverse = new Float64Array(n * n);
  const unit = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    unit.fill(0);
    unit[j] = 1;
    const column = choleskySolve(L, unit, n);
    for (let i = 0; i < n; i++) inverse[i * n + j] = column[i];
  }
  return inverse;
}

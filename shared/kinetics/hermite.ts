/** Hermite interpolation on one interval, s = (x − x0)/h in [0, 1]. */

/** Quintic Hermite from values, first and second derivatives at both ends. */
export function quinticHermite(
  s: number,
  h: number,
  y0: number, d0: number, dd0: number,
  y1: number, d1: number, dd1: number,
): number {
  const s2 = s * s;
  const s3 = s2 * s;
  const s4 = s3 * s;
  const s5 = s4 * s;
  const h0 = 1 - 10 * s3 + 15 * s4 - 6 * s5;
  const h1 = s - 6 * s3 + 8 * s4 - 3 * s5;
  const h2 = 0.5 * s2 - 1.5 * s3 + 1.5 * s4 - 0.5 * s5;
  const h4 = -4 * s3 + 7 * s4 - 3 * s5;
  const h5 = 0.5 * s3 - s4 + 0.5 * s5;
  return y0 * h0 + h * d0 * h1 + h * h * dd0 * h2 + y1 * (1 - h0) + h * d1 * h4 + h * h * dd1 * h5;
}

/** Cubic Hermite from values and first derivatives at both ends. */
export function cubicHermite(s: number, h: number, y0: number, d0: number, y1: number, d1: number): number {
  const s2 = s * s;
  const s3 = s2 * s;
  return (2 * s3 - 3 * s2 + 1) * y0 + (s3 - 2 * s2 + s) * h * d0 + (-2 * s3 + 3 * s2) * y1 + (s3 - s2) * h * d1;
}

/** A volume–time record in base units: t in s, V in L, optional T in K and P in Pa. */
export interface Trace {
  t: ArrayLike<number>;
  V: ArrayLike<number>;
  T?: ArrayLike<number>;
  P?: ArrayLike<number>;
}

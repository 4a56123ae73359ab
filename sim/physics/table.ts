/**
 * Piecewise-linear tables y(T) (conductivity, specific heat, air properties): linear between rows, the end value held
 * flat outside the table. One binary search finds the row pair; the value and its slope share it.
 */

/** A piecewise-linear table y(T), flat outside its range. Temperatures in K. */
export interface Table {
  readonly tK: Float64Array;
  readonly y: Float64Array;
}

/** Index lo of the row pair (lo, lo + 1) whose span holds tK; the caller has checked xs[0] < tK < xs[n − 1]. */
function rowBelow(xs: Float64Array, tK: number): number {
  let lo = 0;
  let hi = xs.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid]! <= tK) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Evaluates a table at T (K): linear between rows, the end value outside. */
export function evalTable(table: Table, tK: number): number {
  const { tK: xs, y } = table;
  const n = xs.length;
  if (n === 1 || tK <= xs[0]!) return y[0]!;
  if (tK >= xs[n - 1]!) return y[n - 1]!;
  const lo = rowBelow(xs, tK);
  const x0 = xs[lo]!;
  const y0 = y[lo]!;
  return y0 + ((y[lo + 1]! - y0) * (tK - x0)) / (xs[lo + 1]! - x0);
}

/**
 * A table's value at T (K) and, in out[0], its slope dy/dT (0 outside the table, where it is held flat): one search
 * for both. Overwrites out[0]. Allocates nothing.
 */
export function evalTableWithSlope(table: Table, tK: number, out: Float64Array): number {
  const { tK: xs, y } = table;
  const n = xs.length;
  out[0] = 0;
  if (n === 1 || tK <= xs[0]!) return y[0]!;
  if (tK >= xs[n - 1]!) return y[n - 1]!;
  const lo = rowBelow(xs, tK);
  const x0 = xs[lo]!;
  const y0 = y[lo]!;
  out[0] = (y[lo + 1]! - y0) / (xs[lo + 1]! - x0);
  return y0 + ((y[lo + 1]! - y0) * (tK - x0)) / (xs[lo + 1]! - x0); // as evalTable() rounds it
}

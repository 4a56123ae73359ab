/**
 * Solves a tridiagonal system A·x = d by the Thomas algorithm (Conte & de Boor, Elementary Numerical Analysis, §3.3;
 * Press et al., Numerical Recipes, §2.4 "tridag"). Row i reads  lower[i]·x[i−1] + diag[i]·x[i] + upper[i]·x[i+1] = d[i];
 * lower[0] and upper[n−1] are ignored. Stable without pivoting for a diagonally dominant matrix (by rows or columns),
 * which is what the implicit heat equation assembles.
 *
 * Overwrites `x` (the solution) and `work` (n scratch values). `d` and the diagonals are left as they were.
 * Returns false on a zero pivot (the caller treats it as a failed step), true otherwise. Allocates nothing.
 */
export function solveTridiagonal(
  n: number,
  lower: Float64Array,
  diag: Float64Array,
  upper: Float64Array,
  d: Float64Array,
  x: Float64Array,
  work: Float64Array,
): boolean {
  let pivot = diag[0]!;
  if (pivot === 0) return false;
  let inverse = 1 / pivot;
  x[0] = d[0]! * inverse;
  for (let i = 1; i < n; i++) {
    const w = upper[i - 1]! * inverse;
    work[i] = w;
    pivot = diag[i]! - lower[i]! * w;
    if (pivot === 0) return false;
    inverse = 1 / pivot;
    x[i] = (d[i]! - lower[i]! * x[i - 1]!) * inverse;
  }
  for (let i = n - 2; i >= 0; i--) x[i] = x[i]! - work[i + 1]! * x[i + 1]!;
  return true;
}

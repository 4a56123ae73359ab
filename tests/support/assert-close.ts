// Numerical comparison for the verification tests: a plain throw with every number a reader needs.

/** Tolerance of a comparison: the check passes when |actual − expected| ≤ max(abs, rel·|expected|). */
export interface CloseTolerance {
  /** Relative tolerance, a fraction of |expected| (e.g. 1e-6). Default 0. */
  rel?: number;
  /** Absolute tolerance, in the unit of the compared quantity (K, W/m², s, ...). Default 0. */
  abs?: number;
}

/**
 * Throws unless `actual` is within the tolerance of `expected`:
 * |actual − expected| ≤ max(abs, rel·|expected|).
 * A non-finite `actual` (NaN, ±Infinity) always fails; so does a non-finite `expected`,
 * so that a broken reference value cannot pass silently. With no tolerance given the
 * comparison is exact.
 */
export function assertClose(actual: number, expected: number, tol: CloseTolerance, label?: string): void {
  const rel = tol.rel ?? 0;
  const abs = tol.abs ?? 0;
  const name = label ?? 'value';
  if (!(rel >= 0) || !(abs >= 0)) {
    throw new Error(`${name}: tolerance must be non-negative (rel ${rel}, abs ${abs})`);
  }
  if (!Number.isFinite(expected)) {
    throw new Error(`${name}: expected value is not finite (${expected}); actual ${actual}`);
  }
  if (!Number.isFinite(actual)) {
    throw new Error(`${name}: actual value is not finite (${actual}); expected ${expected}`);
  }
  const diff = Math.abs(actual - expected);
  const allowed = Math.max(abs, rel * Math.abs(expected));
  if (diff <= allowed) return;
  const relDiff = expected === 0 ? Infinity : diff / Math.abs(expected);
  throw new Error(
    `${name}: actual ${actual}, expected ${expected}, |difference| ${diff} ` +
      `(relative ${relDiff}) exceeds tolerance ${allowed} (rel ${rel}, abs ${abs})`,
  );
}

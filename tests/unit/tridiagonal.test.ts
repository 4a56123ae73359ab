// solveTridiagonal() (elimination from both ends, sim/grid/tridiagonal.ts) against a dense Gaussian elimination with
// partial pivoting written here (Golub & Van Loan, Matrix Computations, 4th ed., Algorithm 3.4.1), on random diagonally
// dominant systems from a seeded generator; and its refusal of singular systems, wherever the elimination meets them.

import { describe, expect, it } from 'vitest';
import { solveTridiagonal } from '../../sim/grid/tridiagonal.ts';
import { assertClose } from '../support/assert-close.ts';
import { seededRandom } from '../support/scenarios.ts';

/** Solves the dense system A·x = b by Gaussian elimination with partial pivoting. A is n×n, row-major. */
function denseSolve(A: number[][], b: number[]): number[] {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(M[i]![k]!) > Math.abs(M[p]![k]!)) p = i;
    [M[k], M[p]] = [M[p]!, M[k]!];
    for (let i = k + 1; i < n; i++) {
      const f = M[i]![k]! / M[k]![k]!;
      for (let j = k; j <= n; j++) M[i]![j] = M[i]![j]! - f * M[k]![j]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = M[i]![n]!;
    for (let j = i + 1; j < n; j++) s -= M[i]![j]! * x[j]!;
    x[i] = s / M[i]![i]!;
  }
  return x;
}

/** A random tridiagonal system, strictly diagonally dominant by rows (|diag| ≥ |lower| + |upper| + margin). */
function randomSystem(n: number, rand: () => number) {
  const lower = Float64Array.from({ length: n }, (_, i) => (i === 0 ? 0 : 2 * rand() - 1));
  const upper = Float64Array.from({ length: n }, (_, i) => (i === n - 1 ? 0 : 2 * rand() - 1));
  const diag = Float64Array.from({ length: n }, (_, i) => (rand() < 0.5 ? -1 : 1) * (Math.abs(lower[i]!) + Math.abs(upper[i]!) + 0.1 + rand()));
  const d = Float64Array.from({ length: n }, () => 10 * (2 * rand() - 1));
  const dense = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) =>
    j === i ? diag[i]! : j === i - 1 ? lower[i]! : j === i + 1 ? upper[i]! : 0));
  return { lower, diag, upper, d, dense };
}

describe('solveTridiagonal()', () => {
  it.each([1, 2, 3, 4, 5, 10, 11, 100, 101, 200])('solveTridiagonal() matches a dense solve on a random diagonally dominant system of size %i', (n) => {
    const rand = seededRandom(1000 + n);
    for (let trial = 0; trial < 5; trial++) {
      const { lower, diag, upper, d, dense } = randomSystem(n, rand);
      const before = [lower, diag, upper, d].map((a) => Float64Array.from(a));
      const x = new Float64Array(n);
      const work = new Float64Array(n);
      expect(solveTridiagonal(n, lower, diag, upper, d, x, work)).toBe(true);
      const reference = denseSolve(dense, Array.from(d));
      const scale = Math.max(...reference.map(Math.abs));
      // Both are backward stable; with diagonal dominance margin ≥ 0.1 the condition number is ≲ 1e2, so the two
      // solutions agree to ≈ 1e2·n·ε relative to the largest component. Tolerance 1e-11 of it.
      reference.forEach((r, i) => assertClose(x[i]!, r, { abs: 1e-11 * scale }, `x[${i}] (n = ${n})`));
      // the diagonals and the right-hand side are left as they were
      [lower, diag, upper, d].forEach((a, k) => expect(Array.from(a)).toEqual(Array.from(before[k]!)));
    }
  });

  it('solveTridiagonal() reports a zero pivot by returning false instead of dividing by zero', () => {
    const n = 3;
    const zeroFirst = solveTridiagonal(n, Float64Array.of(0, 1, 1), Float64Array.of(0, 2, 2), Float64Array.of(1, 1, 0),
      Float64Array.of(1, 1, 1), new Float64Array(n), new Float64Array(n));
    expect(zeroFirst).toBe(false);
    // [[1, 1], [1, 1]] eliminates to a zero second pivot
    const zeroSecond = solveTridiagonal(2, Float64Array.of(0, 1), Float64Array.of(1, 1), Float64Array.of(1, 0),
      Float64Array.of(1, 1), new Float64Array(2), new Float64Array(2));
    expect(zeroSecond).toBe(false);
    expect(solveTridiagonal(1, Float64Array.of(0), Float64Array.of(0), Float64Array.of(0), Float64Array.of(1), new Float64Array(1), new Float64Array(1))).toBe(false);
  });

  it('solveTridiagonal() reports a singular system by returning false wherever its elimination meets the zero pivot', () => {
    // rows 4 on the diagonal and 1 beside it, with a singular 2 × 2 block (rows [1 1] and [1 1], uncoupled from the
    // rows around it) or a zero row placed where each part of the elimination reaches it: the downward sweep's first
    // rows and its last (n even: one row more than the upward sweep), the upward sweep's first row and a later one
    const singular = (n: number, block: number[], zeroRow?: number) => {
      const lower = Float64Array.from({ length: n }, (_, i) => (i === 0 ? 0 : 1));
      const upper = Float64Array.from({ length: n }, (_, i) => (i === n - 1 ? 0 : 1));
      const diag = new Float64Array(n).fill(4);
      for (const r of block) diag[r] = 1;
      if (block.length === 2) { lower[block[0]!] = 0; upper[block[1]!] = 0; }
      if (zeroRow !== undefined) { lower[zeroRow] = 0; diag[zeroRow] = 0; upper[zeroRow] = 0; }
      return solveTridiagonal(n, lower, diag, upper, new Float64Array(n).fill(1), new Float64Array(n), new Float64Array(n));
    };
    expect(singular(6, [0, 1])).toBe(false); // downward, row 1
    expect(singular(6, [1, 2])).toBe(false); // downward, row 2: the sweep's extra row (n even)
    expect(singular(5, [3, 4])).toBe(false); // upward, row 3
    expect(singular(3, [], 2)).toBe(false); // upward, its first row
    expect(singular(6, [2, 3])).toBe(false); // row m = 3, where the two sweeps meet
  });

  it('solveTridiagonal() solves a 2 × 2 system with a zero in the last diagonal entry (row 1 is where the sweeps meet)', () => {
    // [[1, 1], [1, 0]]·x = [3, 2]: x = [2, 1]
    const x = new Float64Array(2);
    expect(solveTridiagonal(2, Float64Array.of(0, 1), Float64Array.of(1, 0), Float64Array.of(1, 0), Float64Array.of(3, 2), x, new Float64Array(2))).toBe(true);
    expect(Array.from(x)).toEqual([2, 1]);
  });
});

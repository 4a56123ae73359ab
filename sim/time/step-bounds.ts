/**
 * The discrete maximum principle on one step: with no heat put in over the step (no imposed flux or heater power, no
 * volumetric source, no cell terms, no heater or bench face), every temperature at its end lies between the least and
 * the greatest of the temperatures at its start and of the temperatures the faces exchange heat with (a held value, a
 * fluid, the surroundings, a plate). Backward Euler keeps that bound for any step (its stage matrix is an M-matrix,
 * Patankar 1980 §4.3); TR-BDF2 does not: its stability function R(z) = (A·(1 + d·z)/(1 − d·z) − Bb)/(1 − d·z) dips to
 * 1/2 − 1/√2 ≈ −0.207 at z = h·λ ≈ −8.2 on the negative real axis (computed from the method's coefficients,
 * tr-bdf2.ts; Hosea & Shampine 1996, §2, note that it is negative there), so a cell whose relaxation time is about an
 * eighth of the step undershoots by up to a fifth of a jump it sees, which the error estimate accepts while it is below
 * tolerance_K (fuzz seed 12 case 8911: 2.3 K below a plate at −60 °C with tolerance_K 5). evolve.ts redoes such a step
 * by backward Euler.
 */
import type { StepConditions } from '../grid/discretization.ts';
import type { FaceCondition } from '../physics/problem.ts';

/** Widens [lohi[0], lohi[1]] to hold tK (by min and max: no branch whose first run could come after optimisation). */
function widen(lohi: Float64Array, tK: number): void {
  lohi[0] = Math.min(lohi[0]!, tK);
  lohi[1] = Math.max(lohi[1]!, tK);
}

/** The range of temperatures a face condition exchanges heat with, widened into [lohi[0], lohi[1]]; false if it puts heat in. */
function faceRange(c: FaceCondition, lohi: Float64Array): boolean {
  if (c.kind === 'fixed') { widen(lohi, c.tK); return true; }
  if (c.kind !== 'terms') return false;
  if (c.fluxWPerM2 !== 0) return false;
  widen(lohi, c.fluidK);
  widen(lohi, c.surroundingsK);
  if (c.plate) widen(lohi, c.plate.tK);
  return true;
}

/**
 * Writes into lohi the bounds a step from the node temperatures T0 must keep under the conditions cond (see above), and
 * returns true; returns false (lohi undefined) when heat is put in over the step or the layers have cell terms, where
 * no such bound holds.
 */
export function stepBounds(T0: Float64Array, cond: StepConditions, hasCellTerms: boolean, lohi: Float64Array): boolean {
  if (hasCellTerms) return false;
  for (let i = 0; i < cond.source.length; i++) if (cond.source[i] !== 0) return false;
  let lo = Infinity;
  let hi = -Infinity;
  for (let j = 0; j < T0.length; j++) {
    const t = T0[j]!;
    lo = Math.min(lo, t);
    hi = Math.max(hi, t);
  }
  lohi[0] = lo;
  lohi[1] = hi;
  const bottom = faceRange(cond.bottom, lohi);
  const top = faceRange(cond.top, lohi);
  return bottom && top;
}

/**
 * Whether the temperatures T at the step's end, or the range [stageLowK, stageHighK] of its trapezoidal stage, leave
 * [lohi[0] − slack, lohi[1] + slack]. The stage matters for the ledger, not for the state: the trapezoidal rule is
 * A-stable but not L-stable (its stability function tends to −1 as z → −∞), so across a jump a stiff cell's stage
 * overshoots by nearly the whole jump, and the face heat at the stage is about minus the one at the start. The
 * method's quadrature then books the step's heat as the small difference of two huge terms: on fuzz seed 9 case 107 (a
 * 1 µm layer under a face switched to 2000 °C) 2.2e13 W/m² at the start and −2.2e13 at the stage over a 0.028 s step,
 * which left the ledger 5e-6 of 509 J/m² out (1e-8 relative), while the end state was right; the step's error
 * estimate filtered once reads the stage's overshoot as error and rejects such steps until they are short; filtered
 * twice (tr-bdf2.ts) it reads the stiff component as the method damps it, and may accept one. Backward Euler, one
 * stage, books the heat at its end alone.
 */
export function leavesBounds(T: Float64Array, stageLowK: number, stageHighK: number, lohi: Float64Array, slack: number): boolean {
  const lo = lohi[0]! - slack;
  const hi = lohi[1]! + slack;
  if (!(stageLowK >= lo && stageHighK <= hi)) return true;
  for (let j = 0; j < T.length; j++) if (!(T[j]! >= lo && T[j]! <= hi)) return true;
  return false;
}

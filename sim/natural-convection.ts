/**
 * Natural convection from a horizontal plate to quiescent air, Nu = h·L/k against Ra = g·β·|ΔT|·L³/(ν·α) with
 * L = A/P (Goldstein, Sparrow & Jones 1973; Lloyd & Moran 1974), properties at the film temperature, β = 1/T_film:
 *   hot face up or cold face down:  Nu = 0.54 Ra^¼ (10⁴–10⁷), Nu = 0.15 Ra^⅓ (10⁷–10¹¹)  (Incropera eqs. 9.30, 9.31)
 *   hot face down or cold face up:  Nu = 0.52 Ra^⅕ (10⁴–10⁹)                           (Incropera 7th ed. eq. 9.32, from memory)
 * A small cell often lies below Ra = 10⁴. The power laws are then extrapolated and the run reports the Rayleigh range
 * as a warning, rather than switching silently to another law.
 */
import { airConductivity, airDiffusivity, airKinematicViscosity } from './air.ts';
import { evalTable } from './material.ts';
import type { Facing } from './problem.ts';
import { STANDARD_GRAVITY_M_S2 } from './units.ts';

export const naturalConvectionRanges = {
  upperFacing: { low: 1e4, switch: 1e7, high: 1e11 },
  lowerFacing: { low: 1e4, high: 1e9 },
} as const;

/** The film temperature at which air properties are taken, K: the mean of surface and free stream (Incropera §7.1). */
export const filmTemperature = (tK: number, fluidK: number): number => 0.5 * (tK + fluidK);

/** Rayleigh number for a face at tK next to air at fluidK; lengthM = A/P. */
export function rayleigh(tK: number, fluidK: number, lengthM: number): number {
  const film = filmTemperature(tK, fluidK);
  const nu = evalTable(airKinematicViscosity, film);
  const alpha = evalTable(airDiffusivity, film);
  return (STANDARD_GRAVITY_M_S2 * Math.abs(tK - fluidK) * lengthM ** 3) / (film * nu * alpha);
}

/** Whether the buoyant plume leaves the face (hot face up, cold face down): the "upper surface" correlations apply. */
export function plumeRisesFromFace(facing: Facing, tK: number, fluidK: number): boolean {
  return (facing === 'up') === (tK > fluidK);
}

/** Nusselt number of the applicable correlation. */
export function nusselt(ra: number, plumeRises: boolean): number {
  if (plumeRises) return ra <= naturalConvectionRanges.upperFacing.switch ? 0.54 * ra ** 0.25 : 0.15 * Math.cbrt(ra);
  return 0.52 * ra ** 0.2;
}

const slopeScratch = new Float64Array(1);

/** Heat-transfer coefficient h, W·m⁻²·K⁻¹, of a horizontal face at tK in air at fluidK; lengthM = A/P. */
export function naturalConvectionCoefficient(facing: Facing, tK: number, fluidK: number, lengthM: number): number {
  if (tK === fluidK) return 0;
  return naturalConvectionIn(facing, tK, fluidK, lengthM, slopeScratch) / (fluidK - tK);
}

/**
 * Heat into a horizontal face at tK from air at fluidK, W/m², with its slope dq/dT in out[0]. One evaluation of the
 * correlation. Overwrites out[0].
 */
export function naturalConvectionIn(facing: Facing, tK: number, fluidK: number, lengthM: number, out: Float64Array): number {
  if (tK === fluidK) {
    out[0] = 0;
    return 0;
  }
  const ra = rayleigh(tK, fluidK, lengthM);
  const rises = plumeRisesFromFace(facing, tK, fluidK);
  const film = filmTemperature(tK, fluidK);
  const h = (nusselt(ra, rises) * evalTable(airConductivity, film)) / lengthM;
  out[0] = -convectionSlopeFactor(ra, rises) * h;
  return h * (fluidK - tK);
}

/**
 * d(h·ΔT)/dΔT over h for the law in force: Nu ∝ Ra^m gives h ∝ |ΔT|^m, so q = h·ΔT has slope (1 + m)·h (air
 * properties held at the film temperature; Newton needs only a good slope, not the exact one).
 */
export function convectionSlopeFactor(ra: number, plumeRises: boolean): number {
  if (plumeRises) return ra <= naturalConvectionRanges.upperFacing.switch ? 1.25 : 4 / 3;
  return 1.2;
}

/** Whether a Rayleigh number lies inside the applicable correlation's published range. */
export function rayleighInRange(ra: number, plumeRises: boolean): boolean {
  const r = plumeRises ? naturalConvectionRanges.upperFacing : naturalConvectionRanges.lowerFacing;
  return ra >= r.low && ra <= r.high;
}

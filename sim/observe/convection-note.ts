/**
 * What an extrapolated natural-convection correlation means for the answer, in one plain sentence: "heat loss from
 * the faces is uncertain by about N %". A cm-sized cell lies at Rayleigh numbers (about 10–10⁴) where the published
 * correlations for horizontal plates disagree; N is the spread between them, weighed by the heat they carry in this
 * very run:
 *   1. along the recorded face temperatures, the convective heat lost Q = ∫ h·|T − T_air| dt is integrated with the
 *      correlation the solver used and with each alternative below (same air properties, same film temperature);
 *   2. the convective spread is max |Q_alt − Q_used| / Q_used;
 *   3. the faces' total loss (convection + radiation + plate, the energy ledger) moves by that spread times the
 *      convective share of it.
 * Alternatives (their formulas as transcribed in ../shared/reference/low-ra-convection.md):
 *   Raithby & Hollands, Handbook of Heat Transfer (1998) ch. 4, thick-layer forms; down-facing capped at the
 *     up-facing value (common practice, no source);
 *   VDI Heat Atlas, 2nd ed. (2010), ch. F2 (from memory);
 *   0.54 Ra^¼ / 0.15 Ra^⅓ up, 0.52 Ra^⅕ down (Lloyd & Moran 1974; Incropera eq. 9.30–9.32, from memory).
 * This is a sensitivity of the recorded run, not a re-run: a weaker h would leave the faces hotter, which the
 * integral does not follow; the figure is a first-order estimate and says so.
 */
import { airConductivity, airDiffusivity, airKinematicViscosity } from '../physics/air.ts';
import { evalTable } from '../physics/material.ts';
import { facingOf, filmTemperature, naturalConvectionCoefficient, plumeRisesFromFace, rayleigh, rayleighInRange } from '../physics/natural-convection.ts';
import { characteristicLengthM, conditionAt, type Problem } from '../physics/problem.ts';
import type { RunRecord } from './record.ts';
import { cToK } from '../physics/units.ts';

export const convectionNoteDefaults = {
  /** Faces within this many kelvin of the air are not weighed (the recorder ignores them too). */
  watchMinK: 1,
  /** The percentages are rounded up to this step: the figure is an estimate, not a measurement. */
  roundToPercent: 5,
} as const;

type Nusselt = (ra: number, rises: boolean, pr: number) => number;

/** Raithby & Hollands (1998): thin-layer Nu_T with the thick-layer correction; turbulent blend up-facing. */
export function raithbyHollands(ra: number, rises: boolean, pr: number): number {
  const cl = 0.671 / (1 + (0.492 / pr) ** (9 / 16)) ** (4 / 9);
  const nuT = 0.835 * cl * ra ** 0.25;
  const nuL = 1.4 / Math.log(1 + 1.4 / nuT);
  const nuTurb = 0.14 * ((1 + 0.0107 * pr) / (1 + 0.01 * pr)) * Math.cbrt(ra);
  const up = (nuL ** 10 + nuTurb ** 10) ** 0.1;
  if (rises) return up;
  const nuTd = (0.527 * ra ** 0.2) / (1 + (1.9 / pr) ** 0.9) ** (2 / 9);
  return Math.min(2.5 / Math.log(1 + 2.5 / nuTd), up);
}

/** VDI Heat Atlas (2010) F2, laminar forms. */
export function vdiHeatAtlas(ra: number, rises: boolean, pr: number): number {
  if (rises) return 0.766 * (ra * (1 + (0.322 / pr) ** (11 / 20)) ** (-20 / 11)) ** 0.2;
  return 0.6 * (ra * (1 + (0.492 / pr) ** (9 / 16)) ** (-16 / 9)) ** 0.2;
}

/** The textbook power laws (Lloyd & Moran; Incropera 9.30–9.32). */
export const powerLaws: Nusselt = (ra, rises, _pr) => (rises ? (ra <= 1e7 ? 0.54 * ra ** 0.25 : 0.15 * Math.cbrt(ra)) : 0.52 * ra ** 0.2);

const ALTERNATIVES: readonly Nusselt[] = [raithbyHollands, vdiHeatAtlas, powerLaws];

export interface ConvectionNote {
  /** Some face was at Rayleigh numbers outside the used correlation's published range during the run. */
  readonly outsideRange: boolean;
  /** Spread of the convective heat loss between published correlations, %, rounded up. */
  readonly convectionPercent: number;
  /** The same spread as a share of all the heat the faces lost, %, rounded up. */
  readonly faceLossPercent: number;
}

const roundUp = (p: number): number => Math.max(convectionNoteDefaults.roundToPercent,
  Math.ceil(p / convectionNoteDefaults.roundToPercent) * convectionNoteDefaults.roundToPercent);

/** The note for a run, or undefined when no face used natural convection. */
export function convectionNote(problem: Problem, record: RunRecord): ConvectionNote | undefined {
  const lengthM = characteristicLengthM(problem.footprint);
  const families = ALTERNATIVES;
  const USED = families.length;
  // ∫ h·|ΔT| dt, J/m²: one per alternative, then (index USED) the correlation the solver used
  const q = new Float64Array(families.length + 1);
  const prev = new Float64Array(families.length + 1);
  let outside = false;
  let seen = false;
  for (const side of ['bottom', 'top'] as const) {
    const faceC = side === 'bottom' ? record.bottomC : record.topC;
    prev.fill(0);
    for (let j = 0; j < record.tS.length; j++) {
      const c = conditionAt(problem[side], record.tS[j]!);
      const now = new Float64Array(families.length + 1);
      const tK = cToK(faceC[j]!);
      if (c.kind === 'terms' && c.convection.kind === 'natural' && Math.abs(tK - c.fluidK) >= convectionNoteDefaults.watchMinK && lengthM > 0) {
        seen = true;
        const ra = rayleigh(tK, c.fluidK, lengthM);
        const rises = plumeRisesFromFace(facingOf(side), tK, c.fluidK);
        if (!rayleighInRange(ra, rises)) outside = true;
        const film = filmTemperature(tK, c.fluidK);
        const pr = evalTable(airKinematicViscosity, film) / evalTable(airDiffusivity, film);
        const dT = Math.abs(tK - c.fluidK);
        const kOverL = evalTable(airConductivity, film) / lengthM;
        families.forEach((f, i) => { now[i] = f(ra, rises, pr) * kOverL * dT; });
        now[USED] = Math.abs(naturalConvectionCoefficient(facingOf(side), tK, c.fluidK, lengthM)) * dT;
      }
      if (j > 0) {
        const dt = record.tS[j]! - record.tS[j - 1]!;
        for (let i = 0; i < q.length; i++) q[i]! += 0.5 * (prev[i]! + now[i]!) * dt;
      }
      prev.set(now);
    }
  }
  const usedJ = q[USED]!;
  if (!seen || usedJ <= 0) return undefined;
  let spread = 0;
  for (let i = 0; i < USED; i++) spread = Math.max(spread, Math.abs(q[i]! - usedJ) / usedJ);
  const e = record.energy;
  // the convective share of all the heat the faces lost (the ledger's outflow: convection, radiation, plate)
  const share = Math.min(1, usedJ / Math.max(e.bottomOutJ + e.topOutJ, Number.MIN_VALUE));
  return { outsideRange: outside, convectionPercent: roundUp(100 * spread), faceLossPercent: roundUp(100 * spread * share) };
}

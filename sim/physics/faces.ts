/**
 * Heat into an exposed face, q(T_face) in W/m², and its derivative dq/dT for Newton:
 *   q = q_imposed + h·(T_fluid − T) + ε·σ·(T_sur⁴ − T⁴) + G_plate·(T_plate − T)
 * (grey surface in large isothermal surroundings, Incropera eq. 1.7; a held plate through a contact conductance).
 * A face held at a fixed temperature is not a flux: the solver imposes T_face directly.
 */
import { naturalConvectionAt } from './natural-convection.ts';
import type { FaceCondition, Facing } from './problem.ts';
import { STEFAN_BOLTZMANN_W_M2K4 } from './units.ts';

export interface FaceContext {
  readonly facing: Facing;
  /** Characteristic length A/P of the footprint, m (natural convection only). */
  readonly lengthM: number;
}

type Terms = Extract<FaceCondition, { kind: 'terms' }>;

/** [T, T∞, L] in and [q, dq/dT] out of naturalConvectionAt(), and room for the air properties it reads. */
const convectionIo = new Float64Array(6);

/** Heat into the face at tK, W/m²; writes dq/dT (W·m⁻²·K⁻¹) to out[0]. Allocates nothing. */
export function faceHeatIn(c: Terms, ctx: FaceContext, tK: number, out: Float64Array): number {
  let q = c.fluxWPerM2;
  let dq = 0;
  const conv = c.convection;
  if (conv.kind === 'fixed') {
    q += conv.coefficient * (c.fluidK - tK);
    dq -= conv.coefficient;
  } else if (conv.kind === 'natural') {
    convectionIo[0] = tK;
    convectionIo[1] = c.fluidK;
    convectionIo[2] = ctx.lengthM;
    naturalConvectionAt(ctx.facing, convectionIo);
    q += convectionIo[0]!;
    dq += convectionIo[1]!;
  }
  if (c.emissivity > 0) {
    const es = c.emissivity * STEFAN_BOLTZMANN_W_M2K4;
    const t2 = tK * tK;
    const s2 = c.surroundingsK * c.surroundingsK;
    q += es * (s2 * s2 - t2 * t2);
    dq -= 4 * es * t2 * tK;
  }
  if (c.plate) {
    q += c.plate.conductance * (c.plate.tK - tK);
    dq -= c.plate.conductance;
  }
  out[0] = dq;
  return q;
}

/**
 * Whether a face condition counts as a heat input for `heat_off_s`: a held plate, a positive imposed flux, a face
 * held at a fixed temperature (a plate of unbounded conductance), or a heater body (until it is lifted off).
 */
export function isHeatInput(c: FaceCondition): boolean {
  if (c.kind === 'bench') return false; // a bench only takes heat from the face
  return c.kind === 'fixed' || c.kind === 'heater' || c.plate !== undefined || c.fluxWPerM2 > 0;
}

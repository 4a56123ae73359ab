/**
 * The ripple an on-off heater's relay sends into the stack, in the linear periodic regime (the method of complex
 * temperatures: Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed. 1959, §2.6; the same on the grid's own
 * semi-discrete equations). Between its two levels the relay drives the plate as a sawtooth of peak-to-peak the band
 * Δ; its fundamental, of period P, has the amplitude Δ·sin(πd)/(π²·d·(1 − d)) for a rise over the share d of the
 * cycle (the first term of its Fourier series), at most 4Δ/π², at d = ½ (the symmetric triangle), which is taken. With
 * T = T̄ + Re(θ·e^{iωt}), ω = 2π/P, the stack as last evaluated (its conductances G between nodes, and each cell's
 * dT/dH, tau) gives one complex tridiagonal system for the amplitudes θ:
 *   heater face j₀ (no mass):  G_c·(θ_p − θ_j₀) = G_j₀·(θ_j₀ − θ_next)
 *   cell j:                    iω·Δx_j·θ_j = tau_j·(G_{j−1}·(θ_{j−1} − θ_j) − G_j·(θ_j − θ_{j+1}))
 *   the other face:            no loss (θ equal to its cell's),
 * a cell on an isothermal plateau (tau 0) holding θ = 0. Leaving out the face losses and the edges can only raise the
 * amplitudes, so the largest |θ| overstates what the stack sees. What reads it: time/plates.ts, which holds a relay
 * whose ripple in the stack is well below the run's temperature tolerance (heldThermostatDefaults).
 */
import type { Workspace } from '../grid/discretization.ts';

/** Scratch of one complex tridiagonal solve: the modified upper diagonal and right side, real and imaginary parts. */
export interface RippleScratch {
  readonly cRe: Float64Array;
  readonly cIm: Float64Array;
  readonly dRe: Float64Array;
  readonly dIm: Float64Array;
}

export function createRippleScratch(nodes: number): RippleScratch {
  return { cRe: new Float64Array(nodes), cIm: new Float64Array(nodes), dRe: new Float64Array(nodes), dIm: new Float64Array(nodes) };
}

/** The amplitude of the fundamental of a sawtooth of peak-to-peak bandK at its largest (the symmetric triangle), K. */
export const sawtoothFundamentalK = (bandK: number): number => (4 * bandK) / (Math.PI * Math.PI);

/**
 * The largest amplitude of the temperature ripple over the stack's nodes (faces and cells), K, when the plate on face
 * `side` (0 bottom, 1 top) swings with amplitude plateAmplitudeK at period periodS through the contact conductance
 * contactWPerM2K, on the state last evaluated into ws. Allocates nothing.
 */
export function rippleInStackK(ws: Workspace, side: 0 | 1, contactWPerM2K: number, plateAmplitudeK: number, periodS: number,
  s: RippleScratch): number {
  const n = ws.n;
  const m = n + 2;
  const { G, tau } = ws;
  const dx = ws.grid.dx;
  const omega = (2 * Math.PI) / periodS;
  // node k of the system is node j = k from the heater's face (side 0), or j = n + 1 − k (side 1), so the heater's
  // face is always row 0: G between system nodes k and k + 1 is G[k] or G[n − k]
  const gAt = (k: number): number => (side === 0 ? G[k]! : G[n - k]!);
  // Thomas elimination with complex pivots: row k is a_k·θ_{k−1} + b_k·θ_k + c_k·θ_{k+1} = d_k, a and c real
  // row 0: (G_c + G_0)·θ_0 − G_0·θ_1 = G_c·θ_p, all of it real (the face has no mass)
  const p0 = contactWPerM2K + gAt(0);
  const inv0 = 1 / (p0 * p0);
  s.cRe[0] = -gAt(0) * p0 * inv0;
  s.cIm[0] = 0;
  s.dRe[0] = contactWPerM2K * plateAmplitudeK * p0 * inv0;
  s.dIm[0] = 0;
  for (let k = 1; k < m; k++) {
    let a: number;
    let bRe: number;
    let bIm: number;
    let c: number;
    if (k === m - 1) {
      // the other face, without loss: −G·θ_{k−1} + G·θ_k = 0
      const g = gAt(k - 1);
      a = -g; bRe = g; bIm = 0; c = 0;
    } else {
      const t = tau[side === 0 ? k : n + 1 - k]!;
      const cell = side === 0 ? k - 1 : n - k;
      const gBelow = gAt(k - 1);
      const gAbove = gAt(k);
      a = -t * gBelow; bRe = t * (gBelow + gAbove); bIm = omega * dx[cell]!; c = -t * gAbove;
    }
    // b − a·c′_{k−1}, then c′_k = c/(that), d′_k = (d − a·d′_{k−1})/(that)
    const pRe = bRe - a * s.cRe[k - 1]!;
    const pIm = bIm - a * s.cIm[k - 1]!;
    const inv = 1 / (pRe * pRe + pIm * pIm);
    s.cRe[k] = c * pRe * inv;
    s.cIm[k] = -c * pIm * inv;
    const rRe = -a * s.dRe[k - 1]!;
    const rIm = -a * s.dIm[k - 1]!;
    s.dRe[k] = (rRe * pRe + rIm * pIm) * inv;
    s.dIm[k] = (rIm * pRe - rRe * pIm) * inv;
  }
  // back substitution, keeping the largest amplitude
  let xRe = s.dRe[m - 1]!;
  let xIm = s.dIm[m - 1]!;
  let most = Math.hypot(xRe, xIm);
  for (let k = m - 2; k >= 0; k--) {
    const re = s.dRe[k]! - (s.cRe[k]! * xRe - s.cIm[k]! * xIm);
    const im = s.dIm[k]! - (s.cRe[k]! * xIm + s.cIm[k]! * xRe);
    xRe = re;
    xIm = im;
    most = Math.max(most, Math.hypot(xRe, xIm));
  }
  return most;
}

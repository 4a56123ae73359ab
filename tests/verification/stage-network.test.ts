// The integrator behind the interface: TR-BDF2 and the time loop's step control (sim/time/drive.ts) on a lumped
// network (sim/grid/node-network.ts), a stage system that shares nothing with the 1D grid, against the closed form of
// a two-body network. Two lumped bodies (Incropera et al., Fundamentals of Heat and Mass Transfer, §5.2, the
// lumped-capacitance balance, written once per body and linked by a conductance) obey the constant-coefficient linear
// system C·dT/dt = K·T + s, whose solution is T(t) = T* + exp(A·t)·(T(0) − T*) with A = C⁻¹K and the steady state
// T* = −K⁻¹s (Boyce & DiPrima, Elementary Differential Equations, §7.5 and §7.9). For a 2×2 A with real distinct
// eigenvalues λ₁, λ₂, exp(A·t) = [(A − λ₂I)·e^{λ₁t} − (A − λ₁I)·e^{λ₂t}]/(λ₁ − λ₂) (Sylvester's formula; Moler &
// Van Loan, "Nineteen dubious ways to compute the exponential of a matrix, twenty-five years later", SIAM Review 45,
// 2003, §2 and method 15). The numbers are an invented rig: a 98 J/K steel disc heated at 20 W, linked to a 60 J/K
// salt pellet, both losing heat to air at 295 K.

import { describe, expect, it } from 'vitest';
import type { Network } from '../../sim/grid/node-network.ts';
import { NETWORK_CHANNEL, NetworkSystem } from '../../sim/grid/node-network.ts';
import { createStepBuffers } from '../../sim/grid/stage-system.ts';
import type { DriveOptions } from '../../sim/time/drive.ts';
import { drive } from '../../sim/time/drive.ts';
import { assertClose } from '../support/assert-close.ts';

const AIR_K = 295;
const NET: Network = {
  capacitiesJPerK: [98, 60],
  links: [{ a: 0, b: 1, conductanceWPerK: 0.5 }],
  losses: [{ node: 0, conductanceWPerK: 0.3, toK: AIR_K }, { node: 1, conductanceWPerK: 0.05, toK: AIR_K }],
  powersW: [20, 0],
};
const START_K = [AIR_K, AIR_K] as const;

/** The closed form T(t) of the two-body network NET from START_K (see the header). */
function closedForm(tS: number): [number, number] {
  const [c1, c2] = NET.capacitiesJPerK as [number, number];
  const g = 0.5;
  const g1 = 0.3;
  const g2 = 0.05;
  const p1 = 20;
  // K and s of C·dT/dt = K·T + s
  const k11 = -(g + g1); const k12 = g; const k21 = g; const k22 = -(g + g2);
  const s1 = p1 + g1 * AIR_K; const s2 = g2 * AIR_K;
  const det = k11 * k22 - k12 * k21;
  const star1 = -(k22 * s1 - k12 * s2) / det;
  const star2 = -(-k21 * s1 + k11 * s2) / det;
  const a11 = k11 / c1; const a12 = k12 / c1; const a21 = k21 / c2; const a22 = k22 / c2;
  const tr = a11 + a22;
  const disc = Math.sqrt((a11 - a22) ** 2 + 4 * a12 * a21);
  const l1 = 0.5 * (tr + disc);
  const l2 = 0.5 * (tr - disc);
  const e1 = Math.exp(l1 * tS);
  const e2 = Math.exp(l2 * tS);
  const x1 = START_K[0] - star1;
  const x2 = START_K[1] - star2;
  // exp(At)·x by Sylvester's formula
  const m = (a: number, b: number, c: number, d: number, l: number): [number, number] => [(a - l) * x1 + b * x2, c * x1 + (d - l) * x2];
  const [u1, u2] = m(a11, a12, a21, a22, l2);
  const [v1, v2] = m(a11, a12, a21, a22, l1);
  return [star1 + (u1 * e1 - v1 * e2) / (l1 - l2), star2 + (u2 * e1 - v2 * e2) / (l1 - l2)];
}

interface Run { worstK: number; steps: number; rejected: number; storedJ: number; bookedJ: number; inputJ: number }

function run(stepping: DriveOptions['stepping'], toleranceK: number, endS: number): Run {
  const sys = new NetworkSystem(NET, toleranceK);
  const buf = createStepBuffers(sys);
  buf.U0.set(START_K);
  let worstK = 0;
  let bookedJ = 0;
  let inputJ = 0;
  const end = drive(sys, buf, { endS, stepping, newton: { toleranceK: toleranceK * 1e-2, maxIterations: 12 }, maxSteps: 1e6 }, (_t0, t1, channelJ) => {
    const exact = closedForm(t1);
    worstK = Math.max(worstK, Math.abs(buf.U1[0]! - exact[0]), Math.abs(buf.U1[1]! - exact[1]));
    bookedJ += channelJ[NETWORK_CHANNEL.surroundings]! + channelJ[NETWORK_CHANNEL.input]!;
    inputJ += channelJ[NETWORK_CHANNEL.input]!;
  });
  if (end.status !== 'ok') throw new Error(end.message);
  return { worstK, steps: end.stats.steps, rejected: end.stats.rejected, storedJ: sys.storedAboveJ(buf.U0, Float64Array.from(START_K)), bookedJ, inputJ };
}

/** The log–log slope of ys against xs by least squares. */
function slope(xs: readonly number[], ys: readonly number[]): number {
  const lx = xs.map(Math.log);
  const ly = ys.map(Math.log);
  const mx = lx.reduce((a, b) => a + b, 0) / lx.length;
  const my = ly.reduce((a, b) => a + b, 0) / ly.length;
  let num = 0;
  let den = 0;
  lx.forEach((x, k) => { num += (x - mx) * (ly[k]! - my); den += (x - mx) ** 2; });
  return num / den;
}

const ADAPTIVE = { kind: 'adaptive', firstStepS: 0.01, maxStepS: 200 } as const;

describe('TR-BDF2 on a lumped network (the stage-system interface)', () => {
  it('drive() with fixed steps of 40, 20, 10, 5 s converges at order 2 ± 0.1 (TR-BDF2) and 1 ± 0.1 (backward Euler)', () => {
    // Bank et al. 1985 and Hosea & Shampine 1996: TR-BDF2 is second order; backward Euler first. 600 s is a whole
    // number of every step; the error is the largest over the step ends of either body against the closed form.
    const steps = [40, 20, 10, 5];
    const trbdf2 = steps.map((h) => run({ kind: 'fixed', stepS: h, scheme: 'tr-bdf2' }, 1, 600).worstK);
    const euler = steps.map((h) => run({ kind: 'fixed', stepS: h, scheme: 'backward-euler' }, 1, 600).worstK);
    assertClose(slope(steps, trbdf2), 2, { abs: 0.1 }, 'order of TR-BDF2'); // measured 2.02
    assertClose(slope(steps, euler), 1, { abs: 0.1 }, 'order of backward Euler'); // measured 0.96
  });

  it('drive() with adaptive steps follows the closed form, its error shrinking as tolerance^(2/3)', () => {
    // Control of the error per step of a pair of order p = 2 gives a global error proportional to tol^(p/(p+1))
    // (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4, tolerance proportionality): slope 2/3 ± 0.1 over three
    // decades. Measured: errors 0.023, 0.0052, 0.0011, 2.5e-4 K over 3000 s in 34 to 236 steps, slope 0.65.
    const tolerances = [1e-2, 1e-3, 1e-4, 1e-5];
    const runs = tolerances.map((tol) => run(ADAPTIVE, tol, 3000));
    assertClose(slope(tolerances, runs.map((r) => r.worstK)), 2 / 3, { abs: 0.1 }, 'slope of the error against the tolerance');
    // the global error of a dissipative run stays within a few tens of local tolerances (measured 2.3 to 25 ×)
    runs.forEach((r, k) => expect(r.worstK, `error at tolerance ${tolerances[k]} K`).toBeLessThan(100 * tolerances[k]!));
    // more steps at tighter tolerances: the control is working, not a fixed step in disguise
    expect(runs[3]!.steps).toBeGreaterThan(3 * runs[0]!.steps);
  });

  it('drive() closes the network\'s energy ledger to 1e-12 of the heat put in (stored = surroundings + input)', () => {
    // The stages hold their equations exactly (the linear accept) and the ledger channels are integrated by the
    // method's own weights, so Σ C·ΔT equals the booked heat to round-off (measured ≤ 3.6e-14 of the input).
    for (const tol of [1e-2, 1e-4]) {
      const r = run(ADAPTIVE, tol, 3000);
      assertClose(r.inputJ, 20 * 3000, { rel: 1e-14 }, 'heat put in, J');
      assertClose(r.storedJ, r.bookedJ, { abs: 1e-12 * r.inputJ }, `stored against booked heat at tolerance ${tol} K`);
    }
  });

  it('drive() reaches the hand-computed steady state of the network', () => {
    // At steady state all 20 W leave to the air: 20 = 0.3·(T₁ − Tₐ) + 0.05·(T₂ − Tₐ) and 0.5·(T₁ − T₂) = 0.05·(T₂ − Tₐ),
    // so T₂ − Tₐ = 0.5·(T₁ − Tₐ)/0.55 and T₁ − Tₐ = 20·0.55/(0.3·0.5 + 0.3·0.05 + 0.5·0.05) = 57.89 K. The slowest time
    // constant is about 450 s (the two capacities over the two losses), so 2e4 s is some 44 of them.
    const rise1 = (20 * 0.55) / (0.3 * 0.5 + 0.3 * 0.05 + 0.5 * 0.05);
    const rise2 = (0.5 * rise1) / 0.55;
    const sys = new NetworkSystem(NET, 1e-3);
    const buf = createStepBuffers(sys);
    buf.U0.set(START_K);
    const end = drive(sys, buf, { endS: 2e4, stepping: ADAPTIVE, newton: { toleranceK: 1e-5, maxIterations: 12 }, maxSteps: 1e5 });
    expect(end.status).toBe('ok');
    // L-stable: the transient is damped to nothing and a steady state of the stages is the exact one
    assertClose(buf.U0[0]!, AIR_K + rise1, { abs: 1e-6 }, 'disc at steady state, K');
    assertClose(buf.U0[1]!, AIR_K + rise2, { abs: 1e-6 }, 'pellet at steady state, K');
    assertClose(closedForm(2e4)[0], AIR_K + rise1, { abs: 1e-9 }, 'closed form at 2e4 s against the hand value, K');
  });

  it('NetworkSystem refuses a network it cannot solve, naming the field and the value', () => {
    expect(() => new NetworkSystem({ ...NET, capacitiesJPerK: [98, 0] }, 1e-3)).toThrow('capacitiesJPerK[1]: must be a positive number of J/K, got 0');
    expect(() => new NetworkSystem({ ...NET, links: [{ a: 0, b: 2, conductanceWPerK: 1 }] }, 1e-3)).toThrow('links[0].b: must be a node index in 0…1, got 2');
    expect(() => new NetworkSystem({ ...NET, losses: [{ node: 0, conductanceWPerK: -1, toK: 295 }] }, 1e-3)).toThrow('losses[0].conductanceWPerK: must be a non-negative number of W/K, got -1');
    expect(() => new NetworkSystem(NET, 0)).toThrow('toleranceK: must be a positive number of kelvin, got 0');
  });
});

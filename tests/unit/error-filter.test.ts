// TR-BDF2's local error estimate on the test equation y′ = λy (Dahlquist's; Hairer & Wanner, Solving ODEs II, §IV.2),
// whose closed form gives the step's true local error: U1 − e^{λh}·U0. The system is a one-node lumped network
// (sim/grid/node-network.ts: C·dT/dt = −G·(T − T_a), λ = −G/C, its excess over the surroundings T − T_a the y),
// stepped once by takeStep() with z = hλ from −0.1 to −10⁴. Filtered once through the stage operator the estimate
// tends to a constant as z → −∞ while the true error falls as 1/z (the method is L-stable); filtered twice, as
// takeStep does when the first estimate exceeds 1, it stays within 0.74–1.14 of the true error (sim/time/tr-bdf2.ts).

import { describe, expect, it } from 'vitest';
import { NetworkSystem } from '../../sim/grid/node-network.ts';
import { createStepBuffers } from '../../sim/grid/stage-system.ts';
import type { StepOutcome } from '../../sim/time/tr-bdf2.ts';
import { takeStep } from '../../sim/time/tr-bdf2.ts';

const Z = [-0.1, -1, -3, -10, -100, -1000, -1e4];

const AIR_K = 300;
/** The node's heat capacity, J/K: not 1, so that the second filter's right side M·est differs from est. */
const C = 50;

/**
 * One TR-BDF2 step of 1 s from 1 K above the surroundings, hλ = z, error tolerance toleranceK: the estimate the step
 * was judged by and its true local error, K.
 */
function oneStep(z: number, toleranceK: number): { estimateK: number; trueK: number } {
  const net = { capacitiesJPerK: [C], links: [], losses: [{ node: 0, conductanceWPerK: -z * C, toK: AIR_K }] };
  const sys = new NetworkSystem(net, toleranceK);
  const buf = createStepBuffers(sys);
  buf.U0[0] = AIR_K + 1;
  sys.evaluate(buf.U0);
  sys.readRates(buf.F0);
  sys.readChannels(buf.q0);
  sys.markStart();
  const outcome: StepOutcome = { status: 'ok', errorNorm: 0, newtonIterations: 0 };
  takeStep(sys, buf, 1, { toleranceK: 1e-14, maxIterations: 12 }, false, outcome);
  expect(outcome.status).toBe('ok');
  return { estimateK: outcome.errorNorm * toleranceK, trueK: Math.abs(buf.U1[0]! - (AIR_K + Math.exp(z))) };
}

describe('takeStep(): the local error estimate on y′ = λy', () => {
  it('filtered twice when it would reject the step: within 0.74–1.14 of the true error for hλ from −0.1 to −10⁴', () => {
    // a tolerance far below any of these errors, so the first estimate always exceeds 1. The bounds are not read from
    // takeStep: they are the least and greatest of the same ratio over hλ from −10⁻³ to −10⁶ in steps of 10^0.001,
    // worked by hand from the method's stage equations on y′ = λy (Bank et al. 1985, eq. 2.3 and the trapezoidal
    // rule) and the embedded weights (tr-bdf2.ts): 0.737 at hλ = −3.54, 1.138 as hλ → −10⁶. takeStep gives 0.975,
    // 0.830, 0.739, 0.834, 1.090, 1.133, 1.138 at the seven points
    for (const z of Z) {
      const { estimateK, trueK } = oneStep(z, 1e-12);
      const ratio = estimateK / trueK;
      expect(ratio, `hλ = ${z}`).toBeGreaterThanOrEqual(0.73);
      expect(ratio, `hλ = ${z}`).toBeLessThanOrEqual(1.14);
    }
  });

  it('filtered once when it accepts the step: too large by about |hλ|/3 on a stiff component', () => {
    // a tolerance above every estimate, so the step is accepted on the first: 1.455 K against a true 0.044 K at
    // hλ = −100 (33×), 1.608 against 4.8e-4 at −10⁴ (3333×); on a smooth component the two agree (1.004 at −0.1).
    // These figures come from the same hand computation as above, not from takeStep
    for (const z of [-100, -1e4]) {
      const { estimateK, trueK } = oneStep(z, 10);
      expect(estimateK / trueK, `hλ = ${z}`).toBeGreaterThan(Math.abs(z) / 4);
    }
    const smooth = oneStep(-0.1, 1);
    expect(smooth.estimateK / smooth.trueK).toBeCloseTo(1.004, 3);
  });
});

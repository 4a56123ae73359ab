// The quick tier of the fuzz suite: a seeded batch of random valid scenarios (arbitrary.ts) through the fuzz
// properties (check.ts). On a failure fast-check shrinks the scenario to a small reproducer and prints it with the
// seed and path; keep it under tests/regressions/fuzz/ with the property it broke. The long tier is `npm run fuzz`.

import fc from 'fast-check';
import { describe, it } from 'vitest';
import { scenarioArbitrary } from './arbitrary.ts';
import { checkScenario } from './check.ts';

/** Scenarios per run: a few hundred take ~20 s on one shared core (most run in milliseconds, a few in a second). */
const RUNS = 300;
/** Any fixed seed: the batch is the same on every machine, so a failure here is reproducible as printed. */
const SEED = 20261202;

describe('fuzzed valid scenarios', () => {
  it(`runProblem() finishes or stops with a physical message, finite, above 0 K, energy balanced, within bounds (${RUNS} scenarios)`, () => {
    fc.assert(fc.property(scenarioArbitrary, (scenario) => {
      const outcome = checkScenario(scenario);
      if (outcome.kind !== 'finished' && outcome.kind !== 'stopped') throw new Error(`${outcome.kind}: ${outcome.message}`);
    }), { seed: SEED, numRuns: RUNS });
  });
});

// The quick tier of the fuzz over heater bodies, benches and side walls (body-arbitrary.ts) through the same properties
// as the full-range stacks (check.ts): finishes or stops with a physical message, finite, above 0 K, energy balanced.
// fc.assert shrinks a failure to a small scenario and prints it with the seed and path that replay it. The long tier
// is `npm run fuzz -- --bodies`.

import fc from 'fast-check';
import { describe, it } from 'vitest';
import { bodyScenarios } from './body-arbitrary.ts';
import { checkScenario } from './check.ts';

/** Scenarios per run: most take tens of milliseconds, a thermostat on a light plate a second or two. */
const RUNS = 40;
/** Any fixed seed: the batch is the same on every machine, so a failure here is reproducible as printed. */
const SEED = 20261205;
/** Room for the batch on a loaded machine and, after a failure, for shrinking (each smaller candidate is a run). */
const TIMEOUT_MS = 600_000;

describe('fuzzed heater bodies, benches and side walls', () => {
  it(`runProblem() finishes or stops with a physical message, finite, above 0 K, energy balanced (${RUNS} scenarios)`, () => {
    fc.assert(
      fc.property(bodyScenarios, (scenario) => {
        const outcome = checkScenario(scenario);
        if (outcome.kind === 'finished' || outcome.kind === 'stopped') return true;
        throw new Error(`${outcome.kind}: ${outcome.message}`);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  }, TIMEOUT_MS);
});

// Random valid scenarios (seeded, short) exercise every face term, schedule change, contact, source and phase change
// together. Whatever the mix, a valid scenario must run to the end with status 'ok' and a result of finite numbers
// (DESIGN.md, "Result": every number is finite).

import { describe, expect, it } from 'vitest';
import { resultDocument } from '../../sim/observe/result.ts';
import { runProblem } from '../../sim/run.ts';
import { parseOk, randomScenario, seededRandom } from '../support/scenarios.ts';

const SEEDS = Array.from({ length: 30 }, (_, i) => i + 1);

describe('random valid scenarios', () => {
  it.each(SEEDS)('runProblem() on random scenario #%i finishes with status ok and only finite numbers', (seed) => {
    // every kind of input: fluxes, heater power, sources, natural convection, plain-number and tabulated properties
    const scenario = randomScenario(seededRandom(seed * 7919), { heatInputs: true, natural: true, plainNumbers: true, constantCp: false });
    const problem = parseOk(scenario);
    const outcome = runProblem(problem);
    expect(outcome.status, `scenario ${JSON.stringify(scenario)} ended with ${JSON.stringify(outcome)}`).toBe('ok');
    if (outcome.status !== 'ok') return;
    const { grid, record, summary, stats } = outcome;
    // resultDocument() throws on any NaN or infinity in the summary, probes or series
    expect(() => resultDocument(problem, grid, record, summary, stats)).not.toThrow();
    for (const row of record.map.data) expect(Number.isFinite(row)).toBe(true);
    expect(record.probes.tS).toEqual([...new Set(scenario.output?.times_s ?? [])].sort((a, b) => a - b));
  });
});

// The README's example output is what `freezeline run examples/bench-coupon.json` prints today, so the first thing a
// reader runs matches the page (the table is built by the CLI's own formatter from a fresh run).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { evaluateExpectations } from '../../sim/scenario/expect.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';

describe('README.md example', () => {
  it('shows the verdict table that the CLI prints for the demo scenario', () => {
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    const shown = /```\n(freezeline — [\s\S]*?)\n```/.exec(readme)?.[1];
    expect(shown, 'README holds a printed example starting with "freezeline — "').toBeDefined();
    const parsed = parseScenarioText(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8'));
    if (!parsed.ok) throw new Error('demo scenario invalid');
    const out = runProblem(parsed.problem);
    if (out.status !== 'ok') throw new Error(out.status);
    const expectations = evaluateExpectations(parsed.scenario.expect, out.summary);
    expect(summaryTable(parsed.problem, out.summary, out.record, { expectations, steps: out.stats.steps })).toBe(shown);
  });
});

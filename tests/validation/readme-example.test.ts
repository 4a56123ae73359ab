// The README's example outputs are what the CLI prints today, so what a reader runs matches the page: the verdict table
// of `freezeline run examples/bench-coupon.json` (built by the CLI's own formatter from a fresh run), and the three
// answers of `freezeline window` on the demo with its plate at 800 °C (the window command's own words), and the outputs
// shown after a `$ npx freezeline …` line (seek, ambient), run as a user runs them (node sim/cli/bin.js); a row shown
// as `...` stands for the rows the page leaves out.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { evaluateExpectations } from '../../sim/scenario/expect.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';
import { searchWindow } from '../../sim/study/window.ts';
import { windowWords } from '../../sim/study/words.ts';
import { freezeline } from '../support/cli.ts';
import { demoOnPlate, parseOk } from '../support/scenarios.ts';

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

  it('shows the answers that `window` prints for the demo on an 800 °C plate', () => {
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    const shown = /```\n( {2}hold at most [\s\S]*?)\n```/.exec(readme)?.[1];
    expect(shown, 'README holds a printed window example starting with "  hold at most"').toBeDefined();
    const result = searchWindow(parseOk(demoOnPlate(800)));
    if (!result.ok) throw new Error(result.reason);
    const words = windowWords(result.report);
    expect([words.longest, words.shortest, words.window].map((l) => `  ${l}`).join('\n')).toBe(shown);
  });

  it('shows what each `$ npx freezeline …` command prints', () => {
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    const blocks = [...readme.matchAll(/```\n\$ npx freezeline (.*)\n([\s\S]*?)\n```/g)];
    expect(blocks.map((b) => b[1]!.split(' ')[0]), 'the commands shown').toEqual(['seek', 'ambient']);
    for (const [, command, shown] of blocks) {
      // the page's arguments hold no quoted spaces but the target's, which the shell would keep whole
      const args = command!.match(/"[^"]*"|\S+/g)!.map((a) => a.replace(/^"(.*)"$/, '$1'));
      const r = freezeline(...args);
      expect(r.code, `${command}: exit code`).toBe(0);
      const printed = r.out.split('\n');
      // each shown line appears in the output, in order; `...` skips any number of rows
      let at = 0;
      let skipping = false;
      for (const line of shown!.split('\n')) {
        if (line.trim() === '...') { skipping = true; continue; }
        const found = printed.indexOf(line, at);
        expect(found, `${command}: the line ${JSON.stringify(line)}`).toBeGreaterThanOrEqual(at);
        if (!skipping) expect(found, `${command}: the line ${JSON.stringify(line)} follows the one before`).toBe(at === 0 ? found : at);
        at = found + 1;
        skipping = false;
      }
    }
  });
});

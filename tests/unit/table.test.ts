// summaryTable() on a run where nothing happens: a plate below the salt's melting range never melts the separator,
// so every separator verdict has no value. Each must read as the wording table's words, never as a number with a unit
// (issue: "never s", "undetermined"). The LiCl–KCl eutectic melts near 352 °C (common practice, no source; the
// library gives its own sourced figure), so a 300 °C plate cannot melt it.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { noValueWords, windowStatusWords } from '../../sim/observe/wording.ts';

function coolPlateRun() {
  const file = JSON.parse(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8')) as {
    bottom: { plate?: { temperature_C: number } }[]; expect?: unknown;
  };
  file.bottom[0]!.plate!.temperature_C = 300;
  delete file.expect;
  const parsed = parseScenario(file);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => e.message).join('\n'));
  const out = runProblem(parsed.problem);
  if (out.status !== 'ok') throw new Error(out.status);
  return { problem: parsed.problem, out };
}

describe('summaryTable()', () => {
  it('writes the wording table\'s words for verdicts that have no value, and no number-with-unit in their place', () => {
    const { problem, out } = coolPlateRun();
    expect(out.summary.separator.molten_at_s).toBeNull();
    const text = summaryTable(problem, out.summary, out.record);
    expect(text).toMatch(/separator molten at +never fully molten/);
    expect(text).toContain(noValueWords.half_frozen_at_s);
    expect(text).toContain(noValueWords.frozen_at_s);
    expect(text).toContain(windowStatusWords['never-molten'].sentence);
    expect(text).not.toMatch(/NaN|Infinity|never s\b|undetermined|null/);
  });
});

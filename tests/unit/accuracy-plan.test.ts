// What a run states about the accuracy it was solved to (sim/scenario/accuracy.ts, sim/observe/result.ts,
// sim/cli/table.ts). Expected values are the rule of accuracyDefaults worked by hand: the demo runs 3600 s, so the
// modelled error at the defaults is 5.5e-4 × 3600 = 1.98 s; asking 1 s needs one level (1.98 / 2 = 0.99 ≤ 1): cells × 2,
// tolerances ÷ 3 (0.2 K → 0.0667 K, 4e-3 → 1.33e-3), melt ramp 0.1 K × min(1, 1 / 0.5) = 0.1 K.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { resultDocument } from '../../sim/observe/result.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';

const demo = JSON.parse(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8')) as Record<string, unknown>;

function solved(numerics?: object) {
  const parsed = parseScenario(numerics ? { ...demo, numerics } : demo);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  const out = runProblem(parsed.problem, { detail: 'summary' });
  if (out.status !== 'ok') throw new Error(out.status);
  return { problem: parsed.problem, out };
}

describe('the accuracy a run states', () => {
  it('resultDocument() gives numerics with the level, grid factor, tolerances and ramp chosen for event_accuracy_s 1', () => {
    const base = solved();
    const { problem, out } = solved({ event_accuracy_s: 1 });
    const doc = resultDocument(problem, out.grid, out.record, out.summary, out.stats);
    expect(doc.numerics.event_accuracy_s).toBe(1);
    expect([doc.numerics.level, doc.numerics.grid_refine, doc.numerics.tolerance_divisor]).toEqual([1, 2, 3]);
    // exact divisions and products of round numbers: round-off only
    assertClose(doc.numerics.tolerance_K, 0.2 / 3, { rel: 1e-15 }, 'tolerance_K');
    assertClose(doc.numerics.liquid_fraction_tolerance, 4e-3 / 3, { rel: 1e-15 }, 'liquid_fraction_tolerance');
    assertClose(doc.numerics.melt_ramp_K, 0.1, { rel: 1e-15 }, 'melt_ramp_K');
    assertClose(doc.numerics.expected_error_s!, 0.99, { rel: 1e-12 }, 'expected_error_s');
    expect(out.grid.n).toBe(2 * base.out.grid.n);
  });

  it('summaryTable() prints the accuracy line: what was asked and what was chosen', () => {
    const { problem, out } = solved({ event_accuracy_s: 1 });
    const table = summaryTable(problem, out.summary, out.record, {});
    expect(table).toContain('accuracy: event times to 1 s, cells ×2, tolerances ÷3, melt kinks smoothed over ±0.1 K (modelled error about 0.99 s)');
  });

  it('resultDocument() says the settings were the file\'s own when it sets both grid and tolerances', () => {
    const { problem, out } = solved({ event_accuracy_s: 0.1, tolerance_K: 0.2, cells_per_mm: 4 });
    const doc = resultDocument(problem, out.grid, out.record, out.summary, out.stats);
    expect([doc.numerics.level, doc.numerics.grid_refine, doc.numerics.tolerance_divisor, doc.numerics.melt_ramp_K]).toEqual([0, 1, 1, 0]);
    expect(summaryTable(problem, out.summary, out.record, {})).toContain('accuracy: grid and tolerances as set in the file (event times to 0.1 s not pursued)');
  });
});

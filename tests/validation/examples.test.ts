// Every file in examples/ runs and meets the claim written in its own `expect` block (invented scenarios: the claim
// is the example's design statement, checked against the solver, not a reference value).
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runProblem } from '../../sim/run.ts';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';

const dir = new URL('../../examples/', import.meta.url);
const files = readdirSync(dir).filter((f) => f.endsWith('.json')).sort();

describe('examples/', () => {
  it('holds at least three examples', () => {
    expect(files.length).toBeGreaterThanOrEqual(3);
  });

  it.each(files)('%s runs and meets the check it states', (file) => {
    const parsed = parseScenarioText(readFileSync(new URL(file, dir), 'utf8'));
    if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
    const claim = parsed.scenario.expect;
    expect(claim, `${file} states no expect block`).toBeDefined();
    expect(parsed.scenario.description ?? '', 'the description states the check in words').toMatch(/Check:/);
    const out = runProblem(parsed.problem);
    if (out.status !== 'ok') throw new Error(`${file}: ${out.status}`);
    const s = out.summary;
    const sep = s.separator;
    if (claim!.molten_before_s !== undefined) expect(sep.molten_at_s).not.toBeNull();
    if (claim!.molten_before_s !== undefined) expect(sep.molten_at_s!).toBeLessThan(claim!.molten_before_s);
    if (claim!.half_frozen_before_s !== undefined) expect(sep.half_frozen_at_s ?? Infinity).toBeLessThan(claim!.half_frozen_before_s);
    if (claim!.half_frozen_after_s !== undefined) expect(sep.half_frozen_at_s ?? Infinity).toBeGreaterThan(claim!.half_frozen_after_s);
    if (claim!.window_status !== undefined) expect(s.safe_window_status).toBe(claim!.window_status);
    if (claim!.window_at_least_s !== undefined) expect(s.safe_window_s ?? -Infinity).toBeGreaterThanOrEqual(claim!.window_at_least_s);
    if (claim!.window_at_most_s !== undefined) expect(s.safe_window_s ?? Infinity).toBeLessThanOrEqual(claim!.window_at_most_s);
    for (const [layer, atLeast] of Object.entries(claim!.margin_at_least_K ?? {})) {
      expect(s.layers[layer]?.margin_K ?? -Infinity, `${layer} margin`).toBeGreaterThanOrEqual(atLeast);
    }
    expect(s.energy.imbalance_rel).toBeLessThan(1e-6);
  });
});

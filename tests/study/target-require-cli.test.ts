// The study commands and `run --require` as a user calls them (node sim/cli/bin.js, a separate process): exit codes as
// documented in the README (0 ok, 2 invalid input, 3 a requirement not met), the JSON shapes the README states, and the
// refusals naming the bad option. The references are the lumped closed form (lumped-slab.ts) and the demo's own claims
// (its margin to ignition is above 100 K, its window is about a minute: examples/bench-coupon.json).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { hForEndC, slabFile } from './lumped-slab.ts';
import { freezeline, repoRoot as root } from '../support/cli.ts';
import { drainedSlab } from '../support/scenarios.ts';

const demo = join(root, 'examples/bench-coupon.json');
const work = mkdtempSync(join(tmpdir(), 'freezeline-study-'));
const slab = join(work, 'slab.json');
writeFileSync(slab, JSON.stringify(slabFile()));

describe('freezeline run --require', () => {
  it('exits 0 and prints "met" with the value when every requirement holds', () => {
    const r = freezeline('run', demo, '--require', 'margin_K>=100', '--require', 'safe_window_status==ok');
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/requirement margin_K>=100: met \(margin_K = \d+/);
  });

  it('exits 3 and names the requirement and the value when one is not met', () => {
    const r = freezeline('run', demo, '--require', 'safe_window_s>=600', '--json');
    expect(r.code).toBe(3);
    expect(r.err).toMatch(/requirement not met: safe_window_s>=600; the run gave safe_window_s = \d/);
    // with --json, stdout still holds exactly the result document
    expect(() => JSON.parse(r.out) as unknown).not.toThrow();
  });

  it('exits 2 before running when a requirement names no verdict', () => {
    const r = freezeline('run', demo, '--require', 'layers.cathode.margin_K>=25');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--require: target layers.cathode.margin_K>=25: no layer with id "cathode"');
    expect(r.out).toBe('');
  });
});

describe('freezeline sweep / seek / ambient', () => {
  it('sweep refuses a bad --vary path and range with exit 2, naming it', () => {
    const a = freezeline('sweep', slab, '--vary', 'layers.slb.thickness_mm=1:2:3');
    expect([a.code, a.err.trim()]).toEqual([2, '--vary layers.slb.thickness_mm: no entry with id "slb" in layers (entries 0–0, ids slab)']);
    const b = freezeline('sweep', slab, '--vary', 'ambient_C=0:10:zero');
    expect([b.code, b.err.trim()]).toEqual([2, '--vary ambient_C: COUNT must be a whole number ≥ 1, got "zero"']);
    expect(a.out + b.out).toBe('');
  });

  it('sweep --format jsonl writes one { index, inputs, summary, error } row per run, in index order', () => {
    const r = freezeline('sweep', slab, '--vary', 'top.0.convection_W_m2K=2:6:3', '--list', 'layers.slab.thickness_mm=1,-1', '--format', 'jsonl', '--jobs', '2');
    expect(r.code, r.err).toBe(0);
    const rows = r.out.trim().split('\n').map((l) => JSON.parse(l) as { index: number; inputs: Record<string, number>; summary: unknown; error: string | null });
    expect(rows.map((x) => x.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(Object.keys(rows[0]!).sort()).toEqual(['error', 'index', 'inputs', 'summary']);
    expect(rows[1]!.inputs).toEqual({ 'top.0.convection_W_m2K': 2, 'layers.slab.thickness_mm': -1 });
    expect(rows.filter((x) => x.error !== null).length).toBe(3);
  });

  it('seek --json finds the closed-form h and prints { value, met, solves, summary }', () => {
    const r = freezeline('seek', slab, '--adjust', 'top.0.convection_W_m2K', '--min', '1', '--max', '20', '--target', 'layers.slab.peak_C>=80', '--tolerance', '0.001', '--json');
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out) as { value: number; met: boolean; solves: number; summary: object };
    expect(j.met).toBe(true);
    assertClose(j.value, hForEndC(80), { abs: 0.01 }, 'h'); // budget as in seek.test.ts
    expect(j.solves).toBeGreaterThan(0);
    expect(j.summary).toHaveProperty('layers');
  });

  it('seek says when a target cannot be met, and refuses a bad --adjust or range', () => {
    const r = freezeline('seek', slab, '--adjust', 'top.0.convection_W_m2K', '--min', '1', '--max', '20', '--target', 'layers.slab.peak_C>=150');
    expect(r.code).toBe(0);
    expect(r.out).toContain('layers.slab.peak_C>=150 is not met for any top.0.convection_W_m2K in [1, 20]');
    const bad = freezeline('seek', slab, '--adjust', 'top.3.convection_W_m2K', '--min', '1', '--max', '20', '--target', 'safe_window_s>=1');
    expect([bad.code, bad.err.trim()]).toEqual([2, '--adjust top.3.convection_W_m2K: top has no entry 3 (entries 0–0)']);
    const range = freezeline('seek', slab, '--adjust', 'ambient_C', '--min', '5', '--max', '1', '--target', 'safe_window_s>=1');
    expect(range.code).toBe(2);
    expect(range.err).toContain('--min must be below --max');
  });

  it('seek says when its runs did not finish, rather than only that the target is not met', () => {
    // a 2 mm slab drained at 5 kW/m² from below stops when its face would reach 0 K (about 8 min) at every ambient
    const drained = join(work, 'drained.json');
    writeFileSync(drained, JSON.stringify(drainedSlab()));
    const r = freezeline('seek', drained, '--adjust', 'ambient_C', '--min', '0', '--max', '40', '--target', 'margin_K>=10');
    expect(r.code, r.err).toBe(0);
    expect(r.out).toContain('margin_K>=10 is not met for any ambient_C in [0, 40]: none of its runs finished');
    expect(r.out).toMatch(/ 9 of the 9 runs did not finish \(counted as not meeting the target\); the first, at ambient_C = 0: the run stopped: the heat drawn from the bottom face exceeds what the stack holds/);
    const j = JSON.parse(freezeline('seek', drained, '--adjust', 'ambient_C', '--min', '0', '--max', '40', '--target', 'margin_K>=10', '--json').out) as { unfinished: { value: number; error: string }[]; solves: number };
    expect(j.unfinished).toHaveLength(j.solves);
    expect(j.unfinished[0]!.value).toBe(0);
    // ambient marks each such run in its table and gives the reasons below it, the columns kept aligned
    const a = freezeline('ambient', drained, '--from', '0', '--to', '40', '--count', '3', '--jobs', '1');
    expect(a.code, a.err).toBe(0);
    expect(a.out).toMatch(/\n {9}0\.0 {3}did not finish \(below\) {5}/);
    expect(a.out).toContain('  3 of the 3 runs did not finish:\n    at 0.0 °C: the run stopped: the heat drawn from the bottom face exceeds what the stack holds');
  });

  it('ambient --json lists each ambient with its verdicts and the stretches that pass', () => {
    const r = freezeline('ambient', demo, '--from', '0', '--to', '40', '--count', '3', '--json', '--jobs', '1');
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out) as { points: { ambient_C: number; pass: boolean; window_s: number | null }[]; passing: number[][] };
    expect(j.points.map((p) => p.ambient_C)).toEqual([0, 20, 40]);
    // the demo keeps a window and a margin above 100 K at room temperature (its own stated check)
    expect(j.points[1]!.pass).toBe(true);
    expect(j.passing.length).toBeGreaterThan(0);
  });
});

// Sweeps (sim/study/sweep.ts, sim/cli/sweep-pool.ts): refusals before anything runs, the grid order, parallel rows equal
// to serial rows, shards that join to the whole, a bad point as a row, and the verdict in each row against the lumped
// closed form (Incropera 6th ed. eq. 5.6, see lumped-slab.ts).
import { describe, expect, it } from 'vitest';
import { runPoints } from '../../sim/cli/sweep-pool.ts';
import { parseList, parseShard, parseVary, planSweep, pointInputs, runSweepPoint, shardIndices, type Axis, type SweepPlan, type SweepRow } from '../../sim/study/sweep.ts';
import { csvHeader, csvRow } from '../../sim/study/sweep-rows.ts';
import { assertClose } from '../support/assert-close.ts';
import { slabEndC, slabFile } from './lumped-slab.ts';

const doc = slabFile();
const ok = <T>(o: { ok: true; value: T } | { ok: false; message: string }): T => {
  if (!o.ok) throw new Error(o.message);
  return o.value;
};
const plan = (axes: Axis[]): SweepPlan => ok(planSweep(doc, axes));

async function rows(p: SweepPlan, indices: number[], jobs: number): Promise<SweepRow[]> {
  const out: SweepRow[] = [];
  await runPoints(p, indices, { jobs, progress: false, onRow: (r) => out.push(r) });
  return out;
}

describe('parseVary(), parseList() and planSweep()', () => {
  it('spaces FROM:TO:COUNT evenly with both ends exact', () => {
    expect(ok(parseVary(doc, 'top.0.convection_W_m2K=2:10:5')).values).toEqual([2, 4, 6, 8, 10]);
    expect(ok(parseVary(doc, 'ambient_C=5:5:1')).values).toEqual([5]);
  });

  it('refuses a bad path before anything runs, naming it', () => {
    const r = parseVary(doc, 'layers.slb.thickness_mm=1:2:3');
    expect(!r.ok && r.message).toBe('--vary layers.slb.thickness_mm: no entry with id "slb" in layers (entries 0–0, ids slab)');
    const r2 = parseList(doc, 'layers.slab=1,2');
    expect(!r2.ok && r2.message).toContain('--list layers.slab: is an object, not a single value');
  });

  it('refuses a bad range: a non-number, a count that is not a whole number ≥ 1, COUNT 1 with two ends, a bad form', () => {
    const refusals: [string, string][] = [
      ['ambient_C=a:10:3', 'FROM must be a number, got "a"'],
      ['ambient_C=0::3', 'TO must be a number, got ""'],
      ['ambient_C=0:10:2.5', 'COUNT must be a whole number ≥ 1, got "2.5"'],
      ['ambient_C=0:10:0', 'COUNT must be a whole number ≥ 1, got "0"'],
      ['ambient_C=0:10:1', 'COUNT 1 takes one value'],
      ['ambient_C=0:10', 'write KEY=FROM:TO:COUNT'],
    ];
    for (const [text, words] of refusals) {
      const r = parseVary(doc, text);
      expect(r.ok, text).toBe(false);
      if (!r.ok) expect(r.message).toContain(words);
    }
  });

  it('refuses a key the format does not know, with the parser\'s suggestion, and the same input varied twice', () => {
    const r = planSweep(doc, [ok(parseVary(doc, 'top.0.emisivity=0:1:3'))]);
    expect(!r.ok && r.message).toContain('top[0].emisivity: unknown key (did you mean "emissivity"?)');
    const twice = planSweep(doc, [ok(parseVary(doc, 'ambient_C=0:1:2')), ok(parseList(doc, 'ambient_C=3,4'))]);
    expect(!twice.ok && twice.message).toContain('varied twice');
  });

  it('orders the grid with the first axis slowest and the last fastest', () => {
    const p = plan([ok(parseList(doc, 'ambient_C=10,20')), ok(parseList(doc, 'top.0.convection_W_m2K=1,2,3'))]);
    expect(p.count).toBe(6);
    expect(pointInputs(p, 4)).toEqual({ ambient_C: 20, 'top.0.convection_W_m2K': 2 });
  });

  it('splits into interleaved shards that together hold every index once', () => {
    expect(ok(parseShard('2/3'))).toEqual({ k: 2, n: 3 });
    for (const bad of ['0/3', '4/3', '1/0', '1-3', 'x']) expect(parseShard(bad).ok, bad).toBe(false);
    const joined = [1, 2, 3].flatMap((k) => shardIndices(10, { k, n: 3 })).sort((a, b) => a - b);
    expect(joined).toEqual([...Array(10).keys()]);
  });
});

describe('runSweepPoint() and runPoints()', () => {
  it('gives each row the verdict of the closed form at its inputs (slab end temperature within 0.1 K)', () => {
    const p = plan([ok(parseVary(doc, 'top.0.convection_W_m2K=2:8:3'))]);
    for (let i = 0; i < p.count; i++) {
      const row = runSweepPoint(p, i);
      const h = row.inputs['top.0.convection_W_m2K'] as number;
      // peak = end temperature (monotonic warming); solver error < 0.02 K at tolerance_K 0.01, lumping error ~Bi·ΔT ≈ 1e-3 K
      assertClose(row.summary!.layers.slab!.peak_C, slabEndC(h), { abs: 0.1 }, `peak at h = ${h}`);
    }
  });

  it('keeps an invalid point as a row with its error and goes on', () => {
    const p = plan([ok(parseList(doc, 'layers.slab.thickness_mm=1,-1,2'))]);
    const r = [0, 1, 2].map((i) => runSweepPoint(p, i));
    expect(r.map((x) => x.error === null)).toEqual([true, false, true]);
    expect(r[1]!.error).toBe('layers[0].thickness_mm: must be > 0, got -1');
    expect(r[1]!.summary).toBeNull();
    expect(csvRow(r[1]!, ['layers.slab.thickness_mm'], ['slab'])).toMatch(/^1,-1,(,)+"?layers\[0\]\.thickness_mm: must be > 0, got -1"?$/);
    expect(csvHeader(['layers.slab.thickness_mm'], ['slab']).split(',')).toHaveLength(csvRow(r[0]!, ['layers.slab.thickness_mm'], ['slab']).split(',').length);
  });

  it('gives identical rows in index order on two worker threads and in this thread, and shards that join to the whole', async () => {
    const p = plan([ok(parseVary(doc, 'top.0.convection_W_m2K=1:9:5')), ok(parseList(doc, 'layers.slab.thickness_mm=1,0,2'))]);
    const all = [...Array(p.count).keys()];
    const serial = await rows(p, all, 1);
    const parallel = await rows(p, all, 2);
    expect(parallel.map((r) => r.index)).toEqual(all);
    expect(JSON.stringify(parallel)).toBe(JSON.stringify(serial));
    // the shards run in this thread: the threads were compared just above, each thread start costs a tsx compile
    const parts = await Promise.all([1, 2, 3].map((k) => rows(p, shardIndices(p.count, { k, n: 3 }), 1)));
    const joined = parts.flat().sort((a, b) => a.index - b.index);
    expect(JSON.stringify(joined)).toBe(JSON.stringify(serial));
    expect(serial.filter((r) => r.error !== null)).toHaveLength(5);
  });
});

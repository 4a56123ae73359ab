// The `freezeline` command as a user calls it (node sim/cli/bin.js → the esbuild bundle): it prints the words of the
// wording table, ends with the hazard list, reports stated expectations and exits 3 when one is not met, writes the
// CSV on the output times and a self-contained HTML report. The demo's claims and the words are the references; the
// exit codes are the ones documented in the README.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { layerColours } from '../../sim/observe/layer-colours.ts';
import { hazards, predictionNotCertification, verdictTerms } from '../../sim/observe/wording.ts';
import { freezeline, repoRoot as root } from '../support/cli.ts';
import { drainedSlab, drainedSlabZeroKelvinS } from '../support/scenarios.ts';

const demo = join(root, 'examples/bench-coupon.json');
const work = mkdtempSync(join(tmpdir(), 'freezeline-cli-'));

/** The demo with two claims it does not meet (window at least 10 min, anode margin at least 300 K). */
function failingScenario(): string {
  const file = JSON.parse(readFileSync(demo, 'utf8')) as { expect: Record<string, unknown> };
  file.expect.window_at_least_s = 600;
  file.expect.margin_at_least_K = { anode: 300 };
  const path = join(work, 'too-hopeful.json');
  writeFileSync(path, JSON.stringify(file));
  return path;
}

describe('freezeline run', () => {
  it('prints every verdict term of the wording table, the stated expectations as met, and the hazard list', () => {
    const r = freezeline('run', demo);
    expect(r.code, r.err).toBe(0);
    for (const key of ['heat_off_s', 'molten_at_s', 'half_frozen_at_s', 'frozen_at_s', 'safe_window_s'] as const) {
      expect(r.out).toMatch(new RegExp(`^  ${verdictTerms[key].term} `, 'm'));
    }
    expect(r.out).toMatch(/^ {4}met {5}separator molten before 15:00 min:s/m);
    for (const h of hazards) expect(r.out).toContain(`${h.term}: ${h.definition}`);
    expect(r.out.trimEnd().endsWith(predictionNotCertification)).toBe(true);
    expect(r.out).not.toMatch(/NaN|Infinity|never s\b|undetermined|safe window|heater removed/);
  });

  it('exits 3 when a stated expectation is not met, naming it on stderr, and still writes the CSV and the report', () => {
    const csv = join(work, 'out.csv');
    const html = join(work, 'report.html');
    const r = freezeline('run', failingScenario(), '--csv', csv, '--csv-at', 'output', '--report', html);
    expect(r.code).toBe(3);
    expect(r.out).toMatch(/NOT MET +usable window at least 10:00 min:s/);
    expect(r.err).toContain('expectation not met: anode margin at least 300 K; the run gave');
    // the demo asks for output at 600, 900 and 1800 s: one row each, probes as columns
    const rows = readFileSync(csv, 'utf8').trimEnd().split('\r\n');
    expect(rows.map((l) => l.split(',')[0])).toEqual(['t_s', '600', '900', '1800']);
    expect(rows[0]).toMatch(/probe_/);
    const page = readFileSync(html, 'utf8');
    expect(page).toContain(verdictTerms.safe_window_s.term);
    expect(page).toContain('NOT MET');
    for (const h of hazards) expect(page).toContain(h.term);
    expect(page).toContain(predictionNotCertification);
    expect(page).toContain('<svg');
    // each layer's line in the colour the view gives that layer (one rule for both: sim/observe/layer-colours.ts)
    for (const [id, c] of layerColours(['collector', 'separator', 'anode'])) {
      expect(page).toMatch(new RegExp(`stroke="${c}" stroke-width="2"/><text[^>]*>${id}</text>`));
    }
    // self-contained: no script, nothing fetched
    expect(page).not.toMatch(/<script|<link|\ssrc=|@import|url\(/i);
  });

  it('refuses an unknown --csv-at choice with exit code 2, naming the option and the value', () => {
    const r = freezeline('run', demo, '--csv', join(work, 'x.csv'), '--csv-at', 'hourly');
    expect(r.code).toBe(2);
    expect(r.err).toContain('--csv-at: must be "series" or "output", got "hourly"');
  });
});

describe('freezeline check (the bundle)', () => {
  it('says that stated expectations are not evaluated without a run, and exits 0 for a valid file', () => {
    const r = freezeline('check', failingScenario());
    expect(r.code).toBe(0);
    expect(r.out).toContain('valid (3 layers, 3600 s); 5 stated expectations not evaluated');
  });

  it('refuses a bad field with exit code 2 and a message that names it, from the built bundle itself', () => {
    const file = JSON.parse(readFileSync(demo, 'utf8')) as { layers: { thickness_mm: number }[] };
    file.layers[1]!.thickness_mm = -1.5;
    const bad = join(work, 'bad.json');
    writeFileSync(bad, JSON.stringify(file));
    freezeline('check', demo); // builds build/cli/main.js if a source is newer
    const r = spawnSync(process.execPath, [join(root, 'build/cli/main.js'), 'check', bad], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('layers[1].thickness_mm: must be > 0, got -1.5');
  });

  it('reports a run stopped for a physical reason in words, with exit code 4, and with --json as a stopped document', () => {
    // a 2 mm steel-like slab drained by 5 kW/m² from below, adiabatic above: its face reaches 0 K at
    // t* = ρcL·(T₀ − qL/(3k))/q = 469 s (the quasi-steady closed form, tests/support/scenarios.ts drainedSlab), inside a 3 h run
    const file = drainedSlab();
    const path = join(work, 'drained.json');
    writeFileSync(path, JSON.stringify(file));
    const words = freezeline('run', path);
    expect(words.code).toBe(4);
    expect(words.err).toMatch(/drained\.json: the run stopped: the heat drawn from the bottom face exceeds what the stack holds: its temperature would fall below absolute zero at t = \d+(\.\d+)? s\n$/);
    expect(words.out).toBe('');
    expect(words.err).not.toContain('internal error');
    const json = freezeline('run', path, '--json');
    expect(json.code).toBe(4);
    const doc = JSON.parse(json.out) as { stopped: { reason: string; t_s: number; message: string }; series: { t_s: number[]; layers: { slab: { mean_C: number[] } }; faces: { bottom_C: number[] } } };
    expect(doc.stopped.reason).toBe('physical');
    expect(doc.stopped.message).toMatch(/^the heat drawn from the bottom face exceeds/);
    // the series recorded up to the stop: from t = 0, the slab at 20 °C, to the last step before it, its bottom face
    // near 0 K (−273.15 °C)
    const t = doc.series.t_s;
    expect(t[0]).toBe(0);
    expect(t[t.length - 1]!).toBeLessThanOrEqual(doc.stopped.t_s);
    expect(doc.series.layers.slab.mean_C[0]).toBe(20);
    expect(doc.series.faces.bottom_C[t.length - 1]!).toBeLessThan(-200);
    // --csv writes the same rows, and says where
    const csvPath = join(work, 'drained.csv');
    const withCsv = freezeline('run', path, '--csv', csvPath);
    expect(withCsv.code).toBe(4);
    expect(withCsv.err).toContain(`the series up to t = ${Number(t[t.length - 1]!.toPrecision(6))} s is in ${csvPath}`);
    expect(readFileSync(csvPath, 'utf8').trim().split('\n')).toHaveLength(t.length + 1);
    expect(Math.abs(doc.stopped.t_s - drainedSlabZeroKelvinS()) / drainedSlabZeroKelvinS()).toBeLessThan(0.01); // 469 s; measured 468.9 s
    // the help lists every exit code, this one with it
    const help = freezeline('--help');
    expect(help.code).toBe(0);
    expect(help.out.replace(/\s+/g, ' ')).toContain('Exit codes: 0 done; 2 invalid input (the message names the field and the value); 3 a stated expectation or a --require condition not met; 4 the run stopped before its end, for a physical reason (heat drawn beyond what the stack holds) or at the run-time ceiling; 1 an internal failure.');
  });

  it('ends a window search whose run stops for a physical reason with exit code 4, and with --json as a stopped document', () => {
    // the drained slab of the test above, warmed from above for its first 100 s (the hold the search varies): every
    // run of the search drains it to 0 K near t* = 469 s (the heating adds 1000 W/m² × 100 s at most, a shift < 3 %)
    const file = { ...drainedSlab(), top: [{ from_s: 0, flux_W_m2: 1000 }, { from_s: 100, flux_W_m2: 0 }] };
    const path = join(work, 'drained-window.json');
    writeFileSync(path, JSON.stringify(file));
    const json = freezeline('window', path, '--json');
    expect(json.code).toBe(4);
    const doc = JSON.parse(json.out) as { stopped: { reason: string; t_s: number; message: string; vary: string; at: number } };
    expect(doc.stopped.reason).toBe('physical');
    expect(doc.stopped.vary).toBe('time');
    expect(doc.stopped.at).toBeGreaterThanOrEqual(0);
    expect(doc.stopped.at).toBeLessThanOrEqual(100);
    expect(doc.stopped.message).toMatch(/^the heat drawn from the bottom face exceeds what the stack holds/);
    expect(Math.abs(doc.stopped.t_s - drainedSlabZeroKelvinS()) / drainedSlabZeroKelvinS()).toBeLessThan(0.03);
    expect(json.err).toMatch(/drained-window\.json: at \d+(\.\d+)?, the run stopped: the heat drawn from the bottom face/);
    const words = freezeline('window', path);
    expect(words.code).toBe(4);
    expect(words.out).toBe('');
  });

  it('ships every worker entry sim/cli/*-worker.ts as its own file beside the bundle, where tinypool looks for it', () => {
    freezeline('check', demo);
    const workers = readdirSync(join(root, 'sim/cli')).filter((f) => f.endsWith('-worker.ts'));
    for (const w of workers) expect(existsSync(join(root, 'build/cli', w.replace(/\.ts$/, '.js'))), w).toBe(true);
  });
});

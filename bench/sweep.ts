/**
 * `npm run bench` (part): sweep throughput. The demo (3 layers, hot plate then free air, 3600 s) over a grid of
 * ambient × separator thickness, run by the built command (`node build/cli/main.js sweep … --jobs N`, worker threads
 * of the bundle) exactly as a user runs it, and the cost of one summary-only run in this thread for comparison.
 * The brief's target is 10 000 runs in ≤ 20 s on 2 cores. A routine bench runs SWEEP_BENCH_RUNS (default 1000) and
 * extrapolates linearly to 10 000, labelled as such; `SWEEP_BENCH_RUNS=10000 npm run bench` measures it outright.
 * Figures only: nothing here asserts a time. The load average is printed because the machine may be shared.
 */
import { spawnSync } from 'node:child_process';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import scenario from '../examples/bench-coupon.json' with { type: 'json' };
import { parseList, parseVary, planSweep, runSweepPoint } from '../sim/study/sweep.ts';

const root = process.cwd();
const RUNS = Number(process.env.SWEEP_BENCH_RUNS ?? 1000);
const SERIAL_RUNS = 40;
const TARGET_RUNS = 10_000;
const jobs = Math.min(2, availableParallelism());
const ambientCount = 100;
const thicknessCount = Math.max(1, Math.round(RUNS / ambientCount));
const runs = ambientCount * thicknessCount;
const vary = [`ambient_C=-54:74:${ambientCount}`, `layers.separator.thickness_mm=1:2:${thicknessCount}`];

// one thread: the cost of a point (parse + summary-only run + verdicts), after a warm-up for the JIT
const ok = <T>(o: { ok: true; value: T } | { ok: false; message: string }): T => { if (!o.ok) throw new Error(o.message); return o.value; };
const plan = ok(planSweep(scenario, [ok(parseVary(scenario, 'ambient_C=-54:74:40')), ok(parseList(scenario, 'layers.separator.thickness_mm=1.5'))]));
for (let i = 0; i < 5; i++) runSweepPoint(plan, i);
const t0 = performance.now();
for (let i = 0; i < SERIAL_RUNS; i++) runSweepPoint(plan, i % plan.count);
const serialMs = (performance.now() - t0) / SERIAL_RUNS;

const cli = join(root, 'build/cli/main.js');
const start = performance.now();
const r = spawnSync(process.execPath, [cli, 'sweep', join(root, 'examples/bench-coupon.json'), ...vary.flatMap((v) => ['--vary', v]), '--format', 'jsonl', '--jobs', String(jobs), '--no-progress'],
  { encoding: 'utf8', maxBuffer: 1 << 30 });
const wallS = (performance.now() - start) / 1000;
if (r.status !== 0) throw new Error(`sweep exited ${r.status}: ${r.stderr}`);
const rows = r.stdout.trim().split('\n');
const failed = rows.map((l) => (JSON.parse(l) as { error: string | null }).error).filter((e): e is string => e !== null);
const errors = failed.length;

console.log('');
console.log(`freezeline sweep benchmark — ${scenario.name}; grid ${vary.join(' × ')}`);
console.log(`  load average ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${availableParallelism()} cores`);
console.log(`  one thread: ${serialMs.toFixed(1)} ms per run (summary-only, ${SERIAL_RUNS} runs after warm-up)`);
console.log(`  ${runs} runs on ${jobs} worker threads (built CLI, process start included): ${wallS.toFixed(1)} s, ${((1000 * wallS) / runs).toFixed(2)} ms wall per run, ${errors} rows with an error`);
if (errors > 0) console.log(`  first error: ${failed[0]}`);
if (runs !== TARGET_RUNS) {
  console.log(`  EXTRAPOLATED (linear in the run count, not measured): ${TARGET_RUNS} runs ≈ ${((wallS * TARGET_RUNS) / runs).toFixed(0)} s (target ≤ 20 s on 2 cores)`);
} else {
  console.log(`  ${TARGET_RUNS} runs measured: ${wallS.toFixed(1)} s (target ≤ 20 s on 2 cores)`);
}
console.log(JSON.stringify({ sweep_runs: runs, sweep_jobs: jobs, sweep_wall_s: wallS, sweep_ms_per_run_wall: (1000 * wallS) / runs, serial_ms_per_run: serialMs, sweep_errors: errors }));

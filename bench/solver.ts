/**
 * `npm run bench`: the solver's cost, bundled by esbuild first (see package.json) so it times the single-module code
 * the browser view runs. Figures only: nothing here asserts a time (tests assert correctness; this measures).
 *
 * 1. The first solve in this fresh process (mostly JIT warm-up), then the demo at its defaults, warm.
 * 2. Scaling: the demo with 50–1600 cells at the default tolerances and at ×0.01 ("tight"), with the melt's kinks as
 *    written and smoothed over ±0.1 K (physics/melt-ramp.ts): time, accepted steps, Newton sweeps, M cell-updates/s
 *    (one cell in one Newton sweep) and the log–log slope of time and of work (cells × Newton sweeps), 200 → 1600.
 * 3. Accuracy asked in seconds: a scenario of our own (3 layers on a hot plate, then free air) at event_accuracy_s
 *    1, 0.1 and 0.01, freezeline's time and achieved error against a refined run, side by side with the scripted
 *    peer (bench/peer-bdf.ts: method of lines + variable-step BDF2) on the same grid at the cheapest of its tolerances
 *    that reaches the same accuracy; warm, interleaved (peer and freezeline alternate), and the ratio.
 * BENCH_QUICK=1 skips the two slowest scaling rows and the 0.01 s row (for a loaded machine); BENCH_PART=accuracy
 * runs only part 3 (after the first solve and the warm demo).
 */
import scenario from '../examples/bench-coupon.json' with { type: 'json' };
import type { BenchFigures } from '../sim/cli/bench-run.ts';
import { benchProblem } from '../sim/cli/bench-run.ts';
import type { Problem } from '../sim/physics/problem.ts';
import { runProblem } from '../sim/run.ts';
import { buildGrid } from '../sim/grid/mesh.ts';
import { parseScenario } from '../sim/scenario/scenario.ts';
import { toleranceFactorText } from '../sim/scenario/accuracy.ts';
import { atSettings } from '../tests/support/scenarios.ts';
import { runPeer } from './peer-bdf.ts';
import { ACCURACY_SCENARIO, DEMO_BASE_CELLS, demoProblem, parseDemo as parse } from './demo-problem.ts';

const QUICK = process.env.BENCH_QUICK === '1';
const ONLY_ACCURACY = process.env.BENCH_PART === 'accuracy';
const SCALING_CELLS = QUICK ? [50, 100, 200, 400, 800] : [50, 100, 200, 400, 800, 1600];
const RUNS = 15;
const TIGHT = 0.01;

// the scaling rows refine the demos' base grid (bench/demo-problem.ts), whose size is the first row
if (SCALING_CELLS[0] !== DEMO_BASE_CELLS) throw new Error('the first scaling row is the base grid');

/**
 * The heavy rows and the accuracy table time long runs on purpose: they lift the run-time ceiling
 * (stepGuardDefaults.maxCellSweeps, 2.5e8 cell-sweeps, about 25 s), so that no row is cut short. The ×0.01 row at 1600
 * cells, as written, takes 7.7e7 cell-sweeps on 2026-12-03, close to the ceiling (earlier code took 2.3e8, and the
 * ceiling of 4e7 then stopped it at t = 47 s of 3600 s).
 */
const LONG = { maxCellSweeps: Infinity } as const;

/** One timed run (the figures benchProblem gives, from a single run without warm-up). */
function onceTimed(problem: Problem): BenchFigures {
  const start = performance.now();
  const out = runProblem(problem, LONG);
  const ms = performance.now() - start;
  if (out.status !== 'ok') throw new Error(`the run did not finish (${out.status})`);
  return { median_ms: ms, runs: 1, cells: out.grid.n, steps: out.stats.steps, newton_iterations: out.stats.newtonIterations,
    cell_updates_per_s: (out.grid.n * out.stats.newtonIterations) / (ms / 1000) };
}

const t0 = performance.now();
const first = runProblem(parse(scenario));
const firstMs = performance.now() - t0;
if (first.status !== 'ok') throw new Error('the demo did not run');
console.log(`freezeline solver benchmark — ${scenario.name}, ${scenario.duration_s} s simulated`);
console.log(`  first solve in this fresh process: ${firstMs.toFixed(1)} ms (JIT warm-up included)`);
const base = benchProblem(parse(scenario), RUNS);
console.log(`  warm: median ${base.median_ms.toFixed(2)} ms over ${base.runs} runs; ${base.cells} cells, ${base.steps} steps, ${base.newton_iterations} Newton sweeps, ${(base.cell_updates_per_s / 1e6).toFixed(1)} M cell-updates/s`);

console.log('');
console.log('  scaling (demo, cells shared by thickness)');
console.log('  tolerances  melt kinks    cells   median ms   steps   Newton   M cell-updates/s');
const slopes: string[] = [];
for (const tol of ONLY_ACCURACY ? [] : [1, TIGHT]) {
  for (const ramp of [0, 0.1]) {
    const rows: { cells: number; ms: number; work: number }[] = [];
    for (const cells of SCALING_CELLS) {
      // the heavy rows run once, timed: the lighter rows before them have warmed the JIT (benchProblem's three
      // warm-up runs would triple a row that takes up to a minute on a loaded machine)
      const f = cells >= 800 || tol < 1 ? onceTimed(demoProblem(cells, tol, ramp)) : benchProblem(demoProblem(cells, tol, ramp), 5);
      rows.push({ cells, ms: f.median_ms, work: f.cells * f.newton_iterations });
      const label = `${tol === 1 ? 'default' : `×${tol}`}`.padEnd(10) + `  ${ramp === 0 ? 'as written' : `±${ramp} K`}`.padEnd(13);
      console.log(`  ${label} ${String(f.cells).padStart(6)}   ${f.median_ms.toFixed(1).padStart(9)}   ${String(f.steps).padStart(5)}   ${String(f.newton_iterations).padStart(6)}   ${(f.cell_updates_per_s / 1e6).toFixed(1).padStart(16)}`);
    }
    const a = rows.find((r) => r.cells === 200);
    const b = rows[rows.length - 1]!;
    if (a && b.cells > a.cells) {
      const span = Math.log(b.cells / a.cells);
      slopes.push(`  ${tol === 1 ? 'default' : `×${tol}`} tolerances, kinks ${ramp === 0 ? 'as written' : `±${ramp} K`}: log–log slope ${a.cells}→${b.cells} cells: time ${(Math.log(b.ms / a.ms) / span).toFixed(2)}, work ${(Math.log(b.work / a.work) / span).toFixed(2)}`);
    }
  }
}
console.log(slopes.join('\n'));

const EVENTS = ['molten_at_s', 'half_frozen_at_s', 'frozen_at_s'] as const;
const asked = QUICK ? [1, 0.1] : [1, 0.1, 0.01];
// each accuracy's plan, or the rule's refusal (an accuracy beyond the cell limit or the work budget is refused at
// validation, and the row says so)
const plans = asked.map((a) => {
  const parsed = parseScenario({ ...ACCURACY_SCENARIO, numerics: { event_accuracy_s: a } });
  return { a, problem: parsed.ok ? parsed.problem : undefined, refusal: parsed.ok ? '' : parsed.errors.map((e) => `${e.path}: ${e.message}`).join('; ') };
});
const accepted = plans.filter((p) => p.problem !== undefined);
// the reference: the finest row's plan two grid levels and two tolerance levels further (cells × 4, tolerances ÷ 9,
// on the curve as written), built from the plan as tests/convergence/event-accuracy.test.ts builds its own; when it exceeds the
// solver's work budget, one level of each beyond, then the next coarser row's; rows at or beyond it have no reference
const finer = (p: Problem, steps: number): Problem => {
  const a = p.numerics.accuracy!;
  return atSettings(p, { ...a, level: a.level + steps, gridRefine: a.gridRefine * 2 ** steps, toleranceDivisor: a.toleranceDivisor * 3 ** steps }, 1 / 3 ** steps);
};
let refProblem: Problem | undefined;
let found: ReturnType<typeof runProblem> | undefined;
search: for (let row = accepted.length - 1; row >= 0; row--) {
  for (const steps of [2, 1]) {
    refProblem = finer(accepted[row]!.problem!, steps);
    found = runProblem(refProblem, { detail: 'summary', ...LONG });
    if (found.status === 'ok') break search;
    console.log(`  (reference ${steps} levels beyond the ${accepted[row]!.a} s row did not finish: ${found.status === 'failed' ? found.message : found.status})`);
  }
}
if (found?.status !== 'ok' || refProblem === undefined) throw new Error('no reference run finished');
const ref = found;
const refLevel = refProblem.numerics.accuracy!.level;
const refDivisor = refProblem.numerics.accuracy!.toleranceDivisor;
const refTimes = EVENTS.map((e) => ref.summary.separator[e]);
const heatOffS = ref.summary.heat_off_s ?? ACCURACY_SCENARIO.duration_s;
console.log('');
console.log(`  accuracy asked in seconds — ${ACCURACY_SCENARIO.name}; reference: ${ref.grid.n} cells, tolerances ÷${refDivisor}: molten ${refTimes[0]?.toFixed(3)} s, half-frozen ${refTimes[1]?.toFixed(3)} s, frozen ${refTimes[2]?.toFixed(3)} s`);
console.log('  asked s   freezeline: cells    tol     ms   error s  estimate s | peer BDF: tol K     ms   error s   steps | ratio');
const worst = (times: readonly (number | null)[]) => Math.max(...times.map((t, i) => (t === null || refTimes[i] === null ? Infinity : Math.abs(t - refTimes[i]!))));
const timeIt = (f: () => void, runs: number) => {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) { const s = performance.now(); f(); out.push(performance.now() - s); }
  return out.sort((a, b) => a - b)[out.length >> 1]!;
};
for (const { a, problem, refusal } of plans) {
  if (problem === undefined) { console.log(`  ${String(a).padStart(7)}   refused at validation: ${refusal}`); continue; }
  const own = runProblem(problem, { detail: 'summary', ...LONG });
  if (own.status !== 'ok') { console.log(`  ${a}: freezeline run ${own.status}`); continue; }
  // the plan as run: a rung of the ladder below the parsed plan when the estimate met the ask first (sim/run.ts)
  const solved = own.problem;
  const plan = solved.numerics.accuracy!;
  if (plan.level >= refLevel && plan.toleranceDivisor >= refDivisor) { console.log(`  ${String(a).padStart(7)}   ${own.grid.n} cells, tolerances ÷${plan.toleranceDivisor}: no finer reference finished within the work budget`); continue; }
  const ownErr = worst(EVENTS.map((e) => own.summary.separator[e]));
  const grid = buildGrid(solved, plan.gridRefine);
  // the peer's cheapest tolerance reaching the accuracy asked on the same grid
  let peerTol = NaN;
  let peerErr = Infinity;
  let peerSteps = 0;
  for (const tol of [1, 0.3, 0.1, 0.03, 0.01, 3e-3, 1e-3, 3e-4, 1e-4]) {
    const p = runPeer(solved, grid, tol, heatOffS);
    const e = worst([p.moltenS, p.halfFrozenS, p.frozenS]);
    if (p.ok && e <= a) { peerTol = tol; peerErr = e; peerSteps = p.steps; break; }
  }
  const runs = grid.n > 500 ? 1 : 5;
  let ownMs = 0;
  let peerMs = NaN;
  // interleaved: freezeline, then the peer, repeated; each timed warm (both ran once above)
  for (let r = 0; r < 2; r++) {
    ownMs = timeIt(() => runProblem(problem, { detail: 'summary', ...LONG }), runs);
    if (Number.isFinite(peerTol)) peerMs = timeIt(() => runPeer(solved, grid, peerTol, heatOffS), runs);
  }
  const peerCell = Number.isFinite(peerTol) ? `${String(peerTol).padStart(6)} ${peerMs.toFixed(1).padStart(8)}   ${peerErr.toFixed(4).padStart(7)}   ${String(peerSteps).padStart(5)}` : '  none of its tolerances reached it       ';
  const est = plan.estimatedErrorS === undefined ? '—' : plan.estimatedErrorS.toFixed(4);
  console.log(`  ${String(a).padStart(7)}   ${String(own.grid.n).padStart(16)} ${toleranceFactorText(plan.toleranceDivisor).padStart(6)} ${ownMs.toFixed(1).padStart(6)}   ${ownErr.toFixed(4).padStart(7)}  ${est.padStart(10)} | ${peerCell} | ${Number.isFinite(peerMs) ? `${(peerMs / ownMs).toFixed(2)}×` : '—'}`);
}
console.log(JSON.stringify({ first_solve_ms: firstMs, median_ms: base.median_ms, runs: base.runs, cells: base.cells, steps: base.steps, newton_iterations: base.newton_iterations, cell_updates_per_s: base.cell_updates_per_s }));

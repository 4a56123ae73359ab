/**
 * `npm run bench`, part 3: the one-phase Stefan problem, the classic benchmark of phase-change solvers (Alexiades &
 * Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, §2.1; Voller & Cross, Int. J. Heat Mass
 * Transfer 24, 1981, used it to show the enthalpy method's staircase), as tests/support/stefan-problem.ts builds it: a
 * 10 mm salt layer liquid at its melting point, cooled through its bottom face, whose separator verdicts have exact
 * values (half frozen when the front is 5 mm in, frozen at 10 mm).
 *
 * Printed: for a wall 100 K and 5 K below T_m, each verdict time's error at the defaults and at several
 * numerics.event_accuracy_s (the time of one warm run, the plan or rung it ran at, the ladder's estimate, whether both
 * errors are within the ask); then the cost against the cells (the file's own grid) at the default tolerances and at
 * ×0.01, with the log–log slope of the work (cells × Newton sweeps). Figures only: nothing here asserts (the accuracy
 * checks are tests/verification/stefan-events.test.ts). BENCH_QUICK=1 stops the cost rows at 400 cells.
 */
import { parseScenario } from '../sim/scenario/scenario.ts';
import { runProblem } from '../sim/run.ts';
import { toleranceFactorText } from '../sim/scenario/accuracy.ts';
import { STEFAN, stefanScenario, stefanTimes } from '../tests/support/stefan-problem.ts';

const QUICK = process.env.BENCH_QUICK === '1';
/** The heavy rows time long runs on purpose (the run-time ceiling would stop them). */
const LONG = { maxCellSweeps: Infinity, detail: 'summary' } as const;
const W_MM = STEFAN.thicknessM * 1000;

function solve(value: unknown) {
  const parsed = parseScenario(value);
  if (!parsed.ok) return { refusal: parsed.errors.map((e) => e.message).join('; ') };
  runProblem(parsed.problem, LONG); // warm-up
  const start = performance.now();
  const out = runProblem(parsed.problem, LONG);
  const ms = performance.now() - start;
  if (out.status !== 'ok') return { refusal: out.status === 'failed' ? out.message : out.status };
  return { ms, out };
}

console.log('');
console.log('freezeline on the one-phase Stefan problem (10 mm salt at its melting point, wall below it; closed form)');
for (const { wallC, asks } of [{ wallC: 200, asks: [1, 0.5, 0.2, 0.1, 0.05] }, { wallC: 295, asks: [5, 2, 1, 0.5] }]) {
  const exact = stefanTimes(wallC);
  console.log(`  wall ${STEFAN.meltC - wallC} K below: λ = ${exact.lambda.toFixed(4)}, half-frozen ${exact.halfS.toFixed(2)} s, frozen ${exact.frozenS.toFixed(2)} s`);
  console.log('    asked        ms    cells  grid  tol.    estimated   half-frozen err   frozen err   within');
  for (const asked of [undefined, ...asks]) {
    const r = solve(stefanScenario(wallC, asked === undefined ? undefined : { event_accuracy_s: asked }));
    const label = (asked === undefined ? 'defaults' : `${asked} s`).padEnd(9);
    if (!('out' in r) || r.out === undefined) { console.log(`    ${label} refused: ${r.refusal}`); continue; }
    const { out, ms } = r;
    const a = out.problem.numerics.accuracy!;
    const half = out.summary.separator.half_frozen_at_s! - exact.halfS;
    const frozen = out.summary.separator.frozen_at_s! - exact.frozenS;
    const stated = a.eventAccuracyS;
    const est = a.estimatedErrorS === undefined ? '—' : `${a.estimatedErrorS.toFixed(3)} s`;
    console.log(`    ${label} ${ms.toFixed(0).padStart(6)}  ${String(out.grid.n).padStart(6)}   ×${String(a.gridRefine).padEnd(3)} ${toleranceFactorText(a.toleranceDivisor).padEnd(5)} ${est.padStart(9)}   ${half.toFixed(4).padStart(13)} s   ${frozen.toFixed(4).padStart(8)} s   ${Math.max(Math.abs(half), Math.abs(frozen)) <= stated ? 'yes' : 'NO'} (${stated} s)`);
  }
}

console.log('');
console.log('  cost against the cells (wall 100 K below; the file\'s own grid, no plan), frozen time error');
console.log('    tolerances   cells      ms    steps  rejected   Newton    work (cells × sweeps)   frozen err');
const exact = stefanTimes(200);
for (const tol of [1, 0.01]) {
  const rows: { cells: number; work: number }[] = [];
  for (const cells of QUICK ? [50, 100, 200, 400] : [50, 100, 200, 400, 800]) {
    const numerics = {
      cells_per_mm: cells / W_MM, separator_cells_per_mm: cells / W_MM, min_cells_per_layer: 1, min_separator_cells: 1,
      ...(tol === 1 ? {} : { tolerance_K: 0.2 * tol, liquid_fraction_tolerance: 4e-3 * tol }),
    };
    const parsed = parseScenario(stefanScenario(200, numerics));
    if (!parsed.ok) throw new Error(parsed.errors.map((e) => e.message).join('; '));
    const start = performance.now();
    const out = runProblem(parsed.problem, LONG);
    const ms = performance.now() - start;
    if (out.status !== 'ok') { console.log(`    ${String(cells).padStart(16)}  stopped: ${out.status === 'failed' ? out.message : out.status}`); continue; }
    const work = out.grid.n * out.stats.newtonIterations;
    rows.push({ cells, work });
    console.log(`    ${(tol === 1 ? 'default' : `×${tol}`).padEnd(10)} ${String(out.grid.n).padStart(6)} ${ms.toFixed(0).padStart(7)} ${String(out.stats.steps).padStart(8)} ${String(out.stats.rejected).padStart(9)} ${String(out.stats.newtonIterations).padStart(8)} ${String(work).padStart(18)}      ${(out.summary.separator.frozen_at_s! - exact.frozenS).toFixed(4).padStart(8)} s`);
  }
  const a = rows.find((r) => r.cells === 200);
  const b = rows[rows.length - 1];
  if (a && b && b.cells > a.cells) {
    console.log(`    ${tol === 1 ? 'default' : `×${tol}`} tolerances: log–log slope of the work ${a.cells} → ${b.cells} cells ${(Math.log(b.work / a.work) / Math.log(b.cells / a.cells)).toFixed(2)}`);
  }
}

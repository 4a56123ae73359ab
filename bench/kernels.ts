/**
 * `npm run bench` (part): the cost of each kernel of a Newton sweep, in ns per cell, on one state. The demo with 1600
 * cells at ×0.01 tolerances (bench/demo-problem.ts: the scaling row of bench/solver.ts) is run to t = 50 s (its separator melting, cells on every branch of the kernels); each
 * kernel is then called over and over on that state, and the figure is the least time per call over nine rounds
 * (the rounds absorb the machine's other load; the state and so the branches taken are the same in every call, so
 * these are the kernels' own costs, a lower bound of what a run spends in them). A whole TR-BDF2 step of 0.05 s from
 * that state is timed the same way, per cell and Newton sweep. The measurement runs in PROCESSES fresh processes and
 * the table gives each figure's least and largest over them: on this machine a whole process at times runs about 1.6×
 * slower (every kernel, T(H) 10.7 → 17 ns), which the rounds inside one process cannot see past. Figures only:
 * nothing here asserts a time.
 */
import { spawnSync } from 'node:child_process';
import { evaluate, stageJacobian, stageResidual } from '../sim/grid/discretization.ts';
import { LineSystem } from '../sim/grid/line-system.ts';
import { buildGrid } from '../sim/grid/mesh.ts';
import { createStepBuffers } from '../sim/grid/stage-system.ts';
import { solveTridiagonal } from '../sim/grid/tridiagonal.ts';
import { temperaturesOf } from '../sim/physics/material.ts';
import { solvedProblem } from '../sim/run.ts';
import type { StepReport } from '../sim/time/evolve.ts';
import { errorScaleOf, evolve, newtonSettingsOf } from '../sim/time/evolve.ts';
import type { StepOutcome } from '../sim/time/tr-bdf2.ts';
import { takeStep } from '../sim/time/tr-bdf2.ts';
import { demoProblem } from './demo-problem.ts';

const CELLS = 1600;
const AT_S = 50;
const STEP_S = 0.05;
const ROUNDS = 9;
const PROCESSES = 3;
const CHILD = process.env.FREEZELINE_KERNELS_CHILD === '1';

/** What one process measures: each kernel's ns per cell, and the step's per cell and sweep. */
interface Measured {
  readonly t1: number;
  readonly n: number;
  readonly sweeps: number;
  readonly rows: [string, number][];
  readonly step: number;
}

function measure(): Measured {
  // the scaling row `npm run bench` prints as "×0.01, as written, 1600 cells", built as that row and runProblem build it
  const problem = solvedProblem(demoProblem(CELLS, 0.01, 0));
  const gridRefine = problem.numerics.accuracy!.gridRefine;
  const grid = buildGrid(problem, gridRefine);
  const n = grid.n;

  // the state at AT_S
  const loop = evolve(problem, grid, { maxCellSweeps: Infinity });
  let report: StepReport | undefined;
  for (;;) {
    const next = loop.next();
    if (next.done) throw new Error(`the run ended before t = ${AT_S} s (${next.value.status})`);
    report = next.value;
    if (report.t1 >= AT_S) break;
  }
  const { ws, cond } = report;
  const numerics = problem.numerics;
  const line = new LineSystem(ws, errorScaleOf(problem), () => {}, cond);
  const buf = createStepBuffers(line);
  buf.U0.set(report.buf.U1);
  line.evaluate(buf.U0);
  line.readRates(buf.F0);
  line.readChannels(buf.q0);
  line.markStart();
  const newton = newtonSettingsOf(numerics.toleranceK);
  const outcome: StepOutcome = { status: 'ok', errorNorm: 0, newtonIterations: 0 };
  takeStep(line, buf, STEP_S, newton, false, outcome);
  if (outcome.status !== 'ok') throw new Error(`the timed step failed (${outcome.status})`);
  const sweeps = outcome.newtonIterations;

  /** The least time per call, ns per cell (÷ perCall cells' worth of work per call), over ROUNDS rounds of `calls`. */
  function nsPerCell(f: () => void, calls: number, perCall = 1): number {
    for (let r = 0; r < 50; r++) f();
    let best = Infinity;
    for (let round = 0; round < ROUNDS; round++) {
      const start = performance.now();
      for (let r = 0; r < calls; r++) f();
      best = Math.min(best, (performance.now() - start) / calls);
    }
    return (best * 1e6) / (n * perCall);
  }

  const U = buf.U1;
  const bCells = buf.B.subarray(1, n + 1);
  const work = new Float64Array(n + 2);
  const moved = new Float64Array(U);
  const zero = new Float64Array(n + 2);
  const size = { largest: 0, stopped: false };
  const { layerStart, layerEnd } = grid;
  const rows: [string, number][] = [
    ['evaluate (all of it)', nsPerCell(() => evaluate(ws, U, cond), 1000)],
    ['  of which T(H)', nsPerCell(() => {
      for (let l = 0; l < layerStart.length; l++) {
        temperaturesOf(ws.layerCurves[l]!, ws.layerSlopes[l]!, U, layerStart[l]!, layerEnd[l]!, ws.segmentHint, ws.T, ws.tau);
      }
    }, 1000)],
    ['stage residual', nsPerCell(() => stageResidual(ws, U, bCells, STEP_S, cond, buf.res), 1000)],
    ['stage Jacobian', nsPerCell(() => stageJacobian(ws, STEP_S, cond), 1000)],
    ['tridiagonal solve', nsPerCell(() => solveTridiagonal(n + 2, ws.lower, ws.diag, ws.upper, buf.res, buf.delta, work), 1000)],
    ['Newton update', nsPerCell(() => line.newtonUpdate(moved, zero, buf.res, size), 1000)],
    ['error norm (per step)', nsPerCell(() => line.errorNorm(buf.U0, buf.U1, buf.delta), 1000)],
    ['step start (per step)', nsPerCell(() => line.markStart(), 1000)],
  ];
  const step = nsPerCell(() => takeStep(line, buf, STEP_S, newton, false, outcome), 100, sweeps);

  return { t1: report.t1, n, sweeps, rows, step };
}

if (CHILD) {
  console.log(JSON.stringify(measure()));
} else {
  const runs: Measured[] = [];
  for (let p = 0; p < PROCESSES; p++) {
    const r = spawnSync(process.execPath, [process.argv[1]!], { encoding: 'utf8', env: { ...process.env, FREEZELINE_KERNELS_CHILD: '1' } });
    if (r.status !== 0) throw new Error(`a measuring process exited ${r.status}: ${r.stderr}`);
    runs.push(JSON.parse(r.stdout.trim().split('\n').pop()!) as Measured);
  }
  const first = runs[0]!;
  const range = (values: number[]): string => `${Math.min(...values).toFixed(1).padStart(8)} ${Math.max(...values).toFixed(1).padStart(8)}`;
  console.log('');
  console.log(`freezeline kernels — the demo with ${first.n} cells, ×0.01 tolerances, at t = ${first.t1.toFixed(2)} s; least of ${ROUNDS} rounds in each of ${PROCESSES} processes`);
  console.log('  kernel                      ns per cell: least  largest');
  first.rows.forEach(([name], k) => console.log(`  ${name.padEnd(26)}             ${range(runs.map((m) => m.rows[k]![1]))}`));
  const steps = runs.map((m) => m.step);
  const best = Math.min(...steps);
  console.log(`  a ${STEP_S} s step (${first.sweeps} Newton sweeps), per cell and sweep: ${range(steps)} ns; ${(1e3 / best).toFixed(1)} M cell-updates/s at the least (target ≥ 40)`);
  console.log(JSON.stringify({ kernels_ns_per_cell: Object.fromEntries(first.rows.map(([k], i) => [k.trim(), Math.min(...runs.map((m) => m.rows[i]![1]))])), step_ns_per_cell_sweep: best }));
}

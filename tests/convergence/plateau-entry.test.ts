// What the estimate's filter at a melt plateau (grid/line-system.ts assembleFilter) is for, and what it must not cost.
// - The work of a tight run grows with the grid, not faster: the demo at ×0.01 tolerances, refined through the
//   accuracy plan's grid factor from 200 to 1600 cells (as `npm run bench` refines it), within the log–log slope of
//   1.1 that issue 8 sets for the work (cells × Newton sweeps): its sweeps may grow by at most 8^0.1 = 1.23×. Measured
//   with the filter 10 182 → 10 134; filtered by the end state's operator, a warming cell entering its plateau was
//   estimated at a floor that did not fall with the step, and 9922 → 20 016 (slope 1.34).
// - The first cell's solidification, where a cell cools onto its plateau, which the window search reports, stays within
//   the run's stated event accuracy of the run with cells ×8 and tolerances ÷27 (three grid and tolerance levels
//   further, as tests/convergence/event-accuracy.test.ts builds its references). Measured 130.27 s against 130.37 s;
//   with cooling cells filtered by their start as well it came 2.4 s early (127.98 s).
// A grid- and step-independence check in the usual sense of a convergence study (Roache, Verification and Validation
// in Computational Science and Engineering, 1998, ch. 5): the finer run stands in for the converged answer.

import { describe, expect, it } from 'vitest';
import { runProblem } from '../../sim/run.ts';
import { evaluatePoint } from '../../sim/study/point.ts';
import { demoProblem } from '../../bench/demo-problem.ts';
import { demoOnPlate, parseOk, refinedBeyond } from '../support/scenarios.ts';

describe('the estimate\'s filter at a melt plateau', () => {
  it('keeps the work of the demo at ×0.01 tolerances within a log–log slope of 1.1 from 200 to 1600 cells', () => {
    const sweeps = [200, 1600].map((cells) => {
      const out = runProblem(demoProblem(cells, 0.01, 0), { detail: 'summary', maxCellSweeps: Infinity });
      if (out.status !== 'ok') throw new Error(`${cells} cells: the run did not finish (${out.status})`);
      return out.stats.newtonIterations;
    });
    expect(sweeps[1]!, `Newton sweeps ${sweeps.join(' → ')}`).toBeLessThanOrEqual(8 ** 0.1 * sweeps[0]!);
  });

  it('keeps the time the first separator cell starts to solidify within the stated accuracy of the refined run', () => {
    // the demo on an 800 °C plate held 89.5 s: the README's window example at its longest hold
    const problem = parseOk(demoOnPlate(800, 89.5));
    const run = evaluatePoint(problem, 89.5, null);
    const reference = evaluatePoint(refinedBeyond(problem, problem.numerics.accuracy!, 3), 89.5, null);
    expect(run.solidifying_s).not.toBeNull();
    expect(reference.solidifying_s).not.toBeNull();
    const stated = problem.numerics.accuracy!.eventAccuracyS;
    expect(Math.abs(run.solidifying_s! - reference.solidifying_s!), `${run.solidifying_s} s against ${reference.solidifying_s} s`)
      .toBeLessThanOrEqual(stated);
  });
});

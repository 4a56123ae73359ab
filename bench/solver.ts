/**
 * `npm run bench`: the solver's speed on the demo scenario (3 layers, hot plate then free air, 3600 s) at default
 * accuracy, and a scaling table over the cell count. The script is bundled by esbuild before it runs (see
 * package.json), so it times the same single-module code the browser view runs.
 * Figures only: nothing here asserts a time (tests assert correctness; this measures).
 */
import scenario from '../examples/bench-coupon.json' with { type: 'json' };
import { benchProblem } from '../sim/cli/bench-run.ts';
import { parseScenario } from '../sim/scenario/scenario.ts';

const SCALING_CELLS = [100, 200, 400, 800, 1600];
const RUNS = 15;

function problemWithCells(total: number | undefined) {
  const file = structuredClone(scenario) as unknown as { layers: { thickness_mm: number; cells?: number }[] };
  if (total !== undefined) {
    const thickness = file.layers.reduce((a, l) => a + l.thickness_mm, 0);
    let left = total;
    file.layers.forEach((l, i) => {
      const share = i === file.layers.length - 1 ? left : Math.max(1, Math.round((total * l.thickness_mm) / thickness));
      l.cells = share;
      left -= share;
    });
  }
  const parsed = parseScenario(file);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return parsed.problem;
}

const base = benchProblem(problemWithCells(undefined), RUNS);
console.log(`freezeline solver benchmark — ${scenario.name}, ${scenario.duration_s} s simulated, default accuracy`);
console.log(`  median ${base.median_ms.toFixed(2)} ms over ${base.runs} runs`);
console.log(`  ${base.cells} cells, ${base.steps} steps, ${base.newton_iterations} Newton iterations`);
console.log(`  ${(base.cell_updates_per_s / 1e6).toFixed(1)} M cell-updates/s (one cell in one Newton iteration)`);
console.log('');
console.log('  cells   median ms   steps   Newton   M cell-updates/s   µs per cell');
for (const cells of SCALING_CELLS) {
  const f = benchProblem(problemWithCells(cells), Math.max(3, Math.round(RUNS / 3)));
  console.log(`  ${String(f.cells).padStart(5)}   ${f.median_ms.toFixed(2).padStart(9)}   ${String(f.steps).padStart(5)}   ${String(f.newton_iterations).padStart(6)}   ${(f.cell_updates_per_s / 1e6).toFixed(1).padStart(16)}   ${((1000 * f.median_ms) / f.cells).toFixed(2).padStart(11)}`);
}
console.log(JSON.stringify({ median_ms: base.median_ms, runs: base.runs, cells: base.cells, steps: base.steps, newton_iterations: base.newton_iterations, cell_updates_per_s: base.cell_updates_per_s }));

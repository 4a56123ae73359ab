/**
 * `npm run bench` (part): the window search on the demo scenario and on the demo with an 800 °C plate (where the
 * anode's ignition margin binds the hold): solves, and wall time in Node for the whole search. Bundled by esbuild
 * first, like bench/solver.ts, so it times the single-module code the browser's worker runs.
 * Figures only: nothing here asserts a time or a count (the brief's target: ≤ 40 solves, ≤ 1 s in the browser).
 */
import scenario from '../examples/bench-coupon.json' with { type: 'json' };
import { parseScenario } from '../sim/scenario/scenario.ts';
import { searchWindow } from '../sim/study/window.ts';

const RUNS = 5;

function problemOf(plateC: number | undefined) {
  const file = structuredClone(scenario);
  if (plateC !== undefined) file.bottom[0]!.plate!.temperature_C = plateC;
  const parsed = parseScenario(file);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return parsed.problem;
}

function time(label: string, plateC: number | undefined) {
  const problem = problemOf(plateC);
  searchWindow(problem); // warm-up: the JIT compiles the kernels
  const ms: number[] = [];
  let solves = 0;
  let answer = '';
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    const r = searchWindow(problem);
    ms.push(performance.now() - t0);
    if (!r.ok) throw new Error(r.reason);
    solves = r.report.solves;
    answer = r.report.longest ? `longest hold ${r.report.longest.value.toFixed(1)} s` : (r.report.longest_reason ?? '');
  }
  ms.sort((a, b) => a - b);
  const median = ms[ms.length >> 1]!;
  console.log(`  ${label.padEnd(34)} ${String(solves).padStart(6)}   ${median.toFixed(0).padStart(9)}   ${(median / solves).toFixed(1).padStart(9)}   ${answer}`);
  return { label, solves, median_ms: median };
}

console.log('');
console.log(`freezeline window search — ${scenario.name}, median of ${RUNS}`);
console.log('  scenario                           solves   median ms   ms/solve   answer');
const figures = [time('demo (450 °C plate)', undefined), time('demo on an 800 °C plate', 800)];
console.log(JSON.stringify({ window_search: figures }));

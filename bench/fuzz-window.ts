/**
 * `npm run fuzz:window [-- --count N --seed S --vary time|power --save DIR --bodies]`: the long tier of the window
 * search's fuzz. N random stacks heated once and cooled (tests/fuzz/window-arbitrary.ts; with --bodies, heater bodies,
 * benches and side walls, body-arbitrary.ts, without the comparison principle's checks) through the search's properties
 * (tests/fuzz/window-check.ts), searching the hold or the heat input's strength, one after another in this process;
 * prints the count by outcome, the slowest search and its solves, and the largest figures behind the allowances.
 * Every scenario that breaks a property is written to DIR as JSON with what it broke.
 * Bundled by esbuild before it runs (package.json). Figures only: it asserts nothing.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import fc from 'fast-check';
import { bodyScenarios } from '../tests/fuzz/body-arbitrary.ts';
import { windowScenarios } from '../tests/fuzz/window-arbitrary.ts';
import { checkWindow } from '../tests/fuzz/window-check.ts';

const windowFuzzDefaults = {
  count: 300,
  /** Any fixed seed: the same seed draws the same scenarios. */
  seed: 4,
  save: '/tmp/freezeline-fuzz-window',
  /** A progress line on stderr every this many searches. */
  progressEvery: 50,
} as const;

const { values } = parseArgs({ options: { count: { type: 'string' }, seed: { type: 'string' }, save: { type: 'string' }, vary: { type: 'string' }, bodies: { type: 'boolean' } } });
const vary = values.vary ?? 'time';
if (vary !== 'time' && vary !== 'power') throw new Error(`--vary: must be time or power, got ${vary}`);
const count = Number(values.count ?? windowFuzzDefaults.count);
const seed = Number(values.seed ?? windowFuzzDefaults.seed);
const save = values.save ?? windowFuzzDefaults.save;
if (!(Number.isInteger(count) && count > 0)) throw new Error(`--count: must be a whole number > 0, got ${values.count}`);
if (!Number.isInteger(seed)) throw new Error(`--seed: must be a whole number, got ${values.seed}`);

// --bodies: heater bodies, benches and side walls (body-arbitrary.ts), where a controlled heater may make several intervals
const scenarios = fc.sample(values.bodies ? bodyScenarios : windowScenarios, { seed, numRuns: count });
const start = performance.now();
let ok = 0;
let broken = 0;
let stopped = 0;
let solves = 0;
const slowest = { ms: 0, index: -1, solves: 0 };
const worst = { marginRiseK: 0, reachFall: 0, fluxEnergyRel: 0 };
scenarios.forEach((scenario, index) => {
  const c = checkWindow(scenario, vary, !values.bodies);
  solves += c.solves;
  if (c.ms > slowest.ms) Object.assign(slowest, { ms: c.ms, index, solves: c.solves });
  if (c.worst) {
    worst.marginRiseK = Math.max(worst.marginRiseK, c.worst.marginRiseK);
    worst.reachFall = Math.max(worst.reachFall, c.worst.reachFall);
    worst.fluxEnergyRel = Math.max(worst.fluxEnergyRel, c.worst.fluxEnergyRel);
  }
  if (c.stopped !== undefined) { stopped++; process.stderr.write(`  case ${index}: stopped: ${c.stopped.slice(0, 200)}\n`); } else if (c.problems.length === 0) ok++;
  else {
    broken++;
    mkdirSync(save, { recursive: true });
    writeFileSync(`${save}/seed${seed}-case${index}.json`, `${JSON.stringify({ why: c.problems, scenario }, null, 1)}\n`);
    process.stderr.write(`  case ${index}: ${c.problems[0]}\n`);
  }
  if ((index + 1) % windowFuzzDefaults.progressEvery === 0) {
    process.stderr.write(`  … ${index + 1} of ${count} (${((performance.now() - start) / 1000).toFixed(0)} s): ${ok} kept every property, ${broken} broke one\n`);
  }
});
const seconds = (performance.now() - start) / 1000;
console.log(`freezeline window fuzz — ${count} searches varying the ${vary === 'time' ? 'hold' : 'strength of the heat input'}, seed ${seed}, ${seconds.toFixed(0)} s`);
console.log(`  ${String(ok).padStart(6)}  kept every property`);
console.log(`  ${String(stopped).padStart(6)}  stopped: a run of the search stopped for a physical reason or at the run-time ceiling`);
console.log(`  ${String(broken).padStart(6)}  broke one${broken > 0 ? ` (written to ${save})` : ''}`);
console.log(`  runs: ${solves} in all; slowest search: case ${slowest.index}, ${slowest.ms.toFixed(0)} ms (${slowest.solves} runs)`);
console.log(`  largest margin rise along the holds ${worst.marginRiseK.toFixed(4)} K, melt_reach fall ${worst.reachFall.toExponential(2)}, flux energy off q × hold by ${worst.fluxEnergyRel.toExponential(2)}`);

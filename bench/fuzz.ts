/**
 * `npm run fuzz [-- --count N --seed S --timeout-s T --threads J --save DIR --bodies]`: runs N random valid
 * scenarios (tests/fuzz/arbitrary.ts; with --bodies, heater bodies, benches and side walls: tests/fuzz/body-arbitrary.ts)
 * through the fuzz properties (tests/fuzz/check.ts) on worker threads, each with a time and a heap limit, and prints
 * the count by outcome, the slowest case and its time, and the peak memory. Every scenario that breaks a property,
 * stops at the run-time ceiling, times out or runs out of memory is written to DIR as JSON, with the property it broke.
 * Bundled by esbuild before it runs (package.json), like the benchmark. Figures only: it asserts nothing.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import fc from 'fast-check';
import { Tinypool } from 'tinypool';
import { scenarioArbitrary } from '../tests/fuzz/arbitrary.ts';
import { bodyScenarios } from '../tests/fuzz/body-arbitrary.ts';
import type { FuzzReply, FuzzTask } from './fuzz-worker.ts';

const fuzzDefaults = {
  count: 1000,
  /** Any fixed seed: the same seed draws the same scenarios. */
  seed: 9,
  /**
   * A case slower than this is a failure ("each within seconds", issue 9): above the run-time ceiling's time (2.5e8
   * cell-sweeps, about 25 s on an idle core, up to 35 s with a heater switching tens of thousands of times:
   * stepGuardDefaults.maxCellSweeps), with room for two fuzz threads sharing the machine, so a run that stops at the
   * ceiling is counted as such and a run that ignores it still times out.
   */
  timeoutS: 60,
  /** One thread: the machine is shared, and one process is asked for. */
  threads: 1,
  /** Heap per worker, MB: "a few hundred MB" is the target; a case past this is a failure. */
  heapMb: 1024,
  save: '/tmp/freezeline-fuzz',
  /** A progress line on stderr (with the tally so far) every this many cases. */
  progressEvery: 500,
} as const;

const { values } = parseArgs({
  options: {
    count: { type: 'string' }, seed: { type: 'string' }, 'timeout-s': { type: 'string' },
    threads: { type: 'string' }, save: { type: 'string' }, bodies: { type: 'boolean' },
  },
});
const count = Number(values.count ?? fuzzDefaults.count);
const seed = Number(values.seed ?? fuzzDefaults.seed);
const timeoutS = Number(values['timeout-s'] ?? fuzzDefaults.timeoutS);
const threads = Number(values.threads ?? fuzzDefaults.threads);
const saveDir = values.save ?? fuzzDefaults.save;
for (const [name, v] of [['--count', count], ['--seed', seed], ['--timeout-s', timeoutS], ['--threads', threads]] as const) {
  if (!Number.isFinite(v) || v < 0) { console.error(`${name}: expected a number ≥ 0, got ${String(v)}`); process.exit(2); }
}

// --bodies: heater bodies, benches and side walls (tests/fuzz/body-arbitrary.ts) instead of the full-range stacks
const scenarios = fc.sample(values.bodies ? bodyScenarios : scenarioArbitrary, { seed, numRuns: count });
const pool = new Tinypool({
  filename: new URL('./fuzz-worker.js', import.meta.url).href,
  minThreads: threads, maxThreads: threads,
  resourceLimits: { maxOldGenerationSizeMb: fuzzDefaults.heapMb },
});

const counts = new Map<string, number>();
const bump = (key: string) => counts.set(key, (counts.get(key) ?? 0) + 1);
let slowest = { ms: 0, index: -1, cells: 0, steps: 0 };
let heapPeakMb = 0;
let saved = 0;
const started = performance.now();
mkdirSync(saveDir, { recursive: true });

const save = (index: number, why: string) => {
  writeFileSync(`${saveDir}/seed${seed}-case${index}.json`, `${JSON.stringify({ why, scenario: scenarios[index] }, null, 1)}\n`);
  saved++;
};

/**
 * The stop at the run-time ceiling (budgetMessage, step-guards.ts): bounded, so not a timeout, but not a finish either
 * (check.ts counts it a violation), so it is counted apart and saved.
 */
const WORK_BUDGET = /^the run reached its work budget/;

/** A message without its numbers, so failures group by kind. */
const kindOf = (message: string) => message.replace(/-?\d[\d.e+-]*/g, '#').slice(0, 90);

async function runOne(index: number): Promise<void> {
  const task: FuzzTask = { index, scenario: scenarios[index]! };
  const t0 = performance.now();
  try {
    const reply = await pool.run(task, { signal: AbortSignal.timeout(timeoutS * 1000) }) as FuzzReply;
    const o = reply.outcome;
    heapPeakMb = Math.max(heapPeakMb, reply.heapMb);
    if (o.ms > slowest.ms) slowest = { ms: o.ms, index, cells: o.cells, steps: o.steps };
    if (o.kind === 'finished') bump('finished');
    else if (o.kind === 'stopped') bump(`stopped: ${kindOf(o.message)}`);
    else if (o.kind === 'refused') bump(`refused: ${kindOf(o.message)}`);
    else if (WORK_BUDGET.test(o.message)) { bump('WORK BUDGET: stopped at the run-time ceiling (step-guards.ts)'); save(index, o.message); }
    else { bump(`VIOLATION: ${kindOf(o.message)}`); save(index, o.message); }
  } catch (e) {
    const message = (e as Error).message;
    const kind = /abort|timeout/i.test(message) ? `TIMEOUT after ${timeoutS} s` : /memory/i.test(message) ? 'OUT OF MEMORY' : `CRASH: ${kindOf(message)}`;
    bump(kind);
    save(index, `${kind} (${((performance.now() - t0) / 1000).toFixed(1)} s)`);
  }
}

let next = 0;
let done = 0;
await Promise.all(Array.from({ length: Math.max(1, threads) }, async () => {
  while (next < scenarios.length) {
    await runOne(next++);
    if (++done % fuzzDefaults.progressEvery === 0) {
      const tally = [...counts].map(([k, n]) => `${n} ${k.slice(0, 40)}`).join('; ');
      console.error(`  … ${done} of ${count} (${((performance.now() - started) / 1000).toFixed(0)} s; slowest ${slowest.ms.toFixed(0)} ms; RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB): ${tally}`);
    }
  }
}));
await pool.destroy();

const seconds = (performance.now() - started) / 1000;
console.log(`freezeline fuzz — ${count} ${values.bodies ? 'body ' : ''}scenarios, seed ${seed}, ${threads} thread(s), ${seconds.toFixed(0)} s`);
for (const [key, n] of [...counts].sort((a, b) => b[1] - a[1])) console.log(`  ${String(n).padStart(6)}  ${key}`);
console.log(`  slowest: case ${slowest.index}, ${slowest.ms.toFixed(0)} ms (${slowest.cells} cells, ${slowest.steps} steps)`);
console.log(`  peak memory: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB resident (process), ${heapPeakMb.toFixed(0)} MB heap after a case (worker)`);
if (saved > 0) console.log(`  ${saved} failing scenarios written to ${saveDir}`);
console.log(JSON.stringify({ count, seed, seconds, counts: Object.fromEntries(counts), slowest, maxRssMb: process.resourceUsage().maxRSS / 1024, heapPeakMb }));

// `npm run bench`, start-up part: how long `freezeline check` on the demo takes from a cold process, against a bare
// `node -e 0` on the same machine at the same moment (the floor no command can beat). Figures, not assertions: the
// target (under 0.3 s for the command) is read from these lines, on an idle machine.
//   bundle   node build/cli/main.js            (what `freezeline` runs)
//   bin      node sim/cli/bin.js               (the `bin` entry: stale check of the sources, then the bundle)
//   source   node --import tsx sim/cli/main.ts (compiling the TypeScript on every call, as before the bundle)
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { buildCli, bundleIsStale } from '../scripts/build-cli.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const RUNS = 9;
const args = ['check', 'examples/bench-coupon.json'];
const cases = [
  ['node -e 0', ['-e', '0']],
  ['bundle', ['build/cli/main.js', ...args]],
  ['bin', ['sim/cli/bin.js', ...args]],
  ['source (tsx)', ['--import', 'tsx', 'sim/cli/main.ts', ...args]],
];

if (bundleIsStale()) await buildCli();
const median = (a) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];
/**
 * CPU time (user + system, ms) of this process's waited-for children, from /proc/self/stat (Linux; clock ticks of
 * 10 ms): unlike the wall time it hardly moves when other work shares the machine. null elsewhere.
 */
function childCpuMs() {
  try {
    const fields = readFileSync('/proc/self/stat', 'utf8').split(') ')[1].split(' ');
    return (Number(fields[13]) + Number(fields[14])) * 10; // cutime, cstime (fields 16 and 17 of proc(5))
  } catch {
    return null;
  }
}
const figures = {};
const cpu = {};
for (const [name, argv] of cases) {
  const times = [];
  const cpus = [];
  for (let i = 0; i < RUNS; i++) {
    const c0 = childCpuMs();
    const t0 = performance.now();
    const r = spawnSync(process.execPath, argv, { cwd: root, encoding: 'utf8' });
    times.push(performance.now() - t0);
    const c1 = childCpuMs();
    if (c0 !== null && c1 !== null) cpus.push(c1 - c0);
    if (r.status !== 0) throw new Error(`${name}: exit ${r.status}\n${r.stderr}`);
  }
  figures[name] = median(times);
  if (cpus.length > 0) cpu[name] = median(cpus);
}
console.log('');
console.log(`freezeline start-up — \`freezeline ${args.join(' ')}\`, median of ${RUNS} cold processes`);
for (const [name, ms] of Object.entries(figures)) {
  const c = cpu[name] === undefined ? '' : `   CPU ${String(cpu[name]).padStart(5)} ms`;
  console.log(`  ${name.padEnd(14)} wall ${ms.toFixed(0).padStart(6)} ms   (${(ms - figures['node -e 0']).toFixed(0).padStart(5)} ms above bare node)${c}`);
}
console.log(JSON.stringify({ startup_ms: figures, startup_cpu_ms: cpu }));

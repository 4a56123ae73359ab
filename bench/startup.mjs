// `npm run bench`, start-up part: how long `freezeline check` on the demo takes from a cold process, against a bare
// `node -e 0` on the same machine at the same moment (the floor no command can beat). Figures, not assertions: the
// target (under 0.3 s for the command) is read from these lines, on an idle machine.
//   bundle   node build/cli/main.js            (what `freezeline` runs)
//   bin      node sim/cli/bin.js               (the `bin` entry: stale check of the sources, then the bundle)
//   source   node --import tsx sim/cli/main.ts (compiling the TypeScript on every call, as before the bundle)
import { spawnSync } from 'node:child_process';
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
const figures = {};
for (const [name, argv] of cases) {
  const times = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, argv, { cwd: root, encoding: 'utf8' });
    times.push(performance.now() - t0);
    if (r.status !== 0) throw new Error(`${name}: exit ${r.status}\n${r.stderr}`);
  }
  figures[name] = median(times);
}
console.log('');
console.log(`freezeline start-up — \`freezeline ${args.join(' ')}\`, median of ${RUNS} cold processes`);
for (const [name, ms] of Object.entries(figures)) {
  console.log(`  ${name.padEnd(14)} ${ms.toFixed(0).padStart(6)} ms   (${(ms - figures['node -e 0']).toFixed(0).padStart(5)} ms above bare node)`);
}
console.log(JSON.stringify({ startup_ms: figures }));

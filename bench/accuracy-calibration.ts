/**
 * `npm run calibrate`: the measurements behind the accuracy rule's shares and its growth per looser tolerance level
 * (sim/scenario/accuracy.ts, accuracyDefaults.spaceShareAtDefaults, .timeShareAtDefaults and
 * .timeGrowthPerLooserLevel), so that they can be repeated when the solver changes.
 * Figures only: nothing here asserts (tests/convergence/event-accuracy.test.ts checks the promise).
 *
 * For each case (every example, the accuracy table's scenario of bench/solver.ts, the one-phase Stefan problem with
 * its wall 100 K and 5 K below the melting point, and eight random melt-and-freeze stacks, seeds 101–108 of
 * tests/support/scenarios.ts randomMeltScenario) and each pair (ℓ, k) of grid and tolerance levels the rule plans with
 * (cells × 2^ℓ, both tolerances ÷ 3^k), the separator's event times are measured at the pair's tolerances and at
 * nearby ones (both tolerances × 0.90, 0.95, …, 1.10): one run at one setting scatters by tenths of a second (the last
 * cell to melt or freeze decides an event), and a rule fitted to single runs was found thin (DEVELOPERS.md, "Accuracy
 * asked in seconds"). The error is against the Stefan problem's closed form (Alexiades & Solomon 1993, §2.1), and
 * elsewhere against the same case at cells × 16, tolerances ÷ 81 (a convergence study's reference; Roache 1998, ch. 5),
 * or × 8, ÷ 27 when that stops at the solver's run-time ceiling.
 *
 * Printed: each case's worst |error| ÷ duration at each pair; over all cases the largest at each pair, e(ℓ, k); the
 * rule's modelled error at each pair against margin × e(ℓ, k), and the pairs where it falls short; the growth per
 * looser tolerance level its shares need; and, as a guide, the shares S, T of least S + T (the modelled error at the
 * defaults, which sets the default stated accuracy) that meet every pair, with the pairs that bind.
 *
 * CALIBRATE_CASES=name,name runs only the cases named (to split the work across processes); CALIBRATE_QUICK=1 runs
 * the pair's own setting only (no nearby settings); CALIBRATE_VERBOSE=1 prints each setting's signed errors.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Problem } from '../sim/physics/problem.ts';
import { runProblem } from '../sim/run.ts';
import { accuracyDefaults } from '../sim/scenario/accuracy.ts';
import { atSettings, randomMeltScenario, seededRandom } from '../tests/support/scenarios.ts';
import { STEFAN, stefanScenario, stefanTimes } from '../tests/support/stefan-problem.ts';
import { ACCURACY_SCENARIO, parseDemo as parse } from './demo-problem.ts';

/**
 * The pairs measured: those the rule plans with, and two looser than the defaults, (0, −1) and (0, −2) (tolerances × 3,
 * × 9), where a file's own tolerances put the time part (accuracy.ts ownToleranceLevel): they keep the time share from
 * being fitted to nothing by pairs at which the grid's part dominates.
 */
const PAIRS: readonly (readonly [number, number])[] = [[0, -2], [0, -1], [0, 0], [0, 1], [1, 1], [0, 2], [1, 2], [2, 2], [0, 3], [1, 3]];
/** CALIBRATE_VERBOSE=1: each setting's signed errors too. */
const VERBOSE = process.env.CALIBRATE_VERBOSE === '1';
const FACTORS = process.env.CALIBRATE_QUICK === '1' ? [1] : [0.9, 0.95, 1, 1.05, 1.1];
/** The reference: this many grid and tolerance levels above level 0, or one fewer when it stops at the ceiling. */
const REFERENCE_LEVELS = 4;
/** The margin the shares keep over the largest error measured at each pair (as the rule's calibration always has). */
const MARGIN = 1.2;
const EVENTS = ['molten_at_s', 'half_frozen_at_s', 'frozen_at_s'] as const;
type Times = Record<(typeof EVENTS)[number], number | null>;

interface Case {
  readonly name: string;
  readonly problem: Problem;
  /** The exact times, when a closed form gives them (the Stefan problem starts fully molten: molten at 0 s). */
  readonly exact?: Times;
}

/** `p` (parsed at the defaults, level 0) at grid level `level`, tolerance level `tolLevel`, both tolerances × `factor`. */
function atPair(p: Problem, level: number, tolLevel: number, factor: number): Problem {
  const a = p.numerics.accuracy!;
  if (a.gridRefine !== 1 || a.toleranceDivisor !== 1 || a.ownGrid || a.ownTolerances) throw new Error(`${p.name}: not at the defaults`);
  return atSettings(p, { ...a, level, gridRefine: 2 ** level, toleranceDivisor: 3 ** tolLevel }, factor / 3 ** tolLevel);
}

function times(p: Problem): Times | undefined {
  const out = runProblem(p, { detail: 'summary', maxCellSweeps: Infinity });
  if (out.status === 'failed' && /work budget|cell-steps|cell-sweeps/.test(out.message)) return undefined;
  if (out.status !== 'ok') throw new Error(`${p.name}: run ${out.status}${out.status === 'failed' ? `: ${out.message}` : ''}`);
  return out.summary.separator;
}

const cases: Case[] = [];
// run from the repository's root (npm run calibrate), as the bundle lives elsewhere
const examples = join(process.cwd(), 'examples');
for (const f of readdirSync(examples).filter((n) => n.endsWith('.json')).sort()) {
  cases.push({ name: f.replace(/\.json$/, ''), problem: parse(JSON.parse(readFileSync(join(examples, f), 'utf8'))) });
}
cases.push({ name: 'bench-accuracy-scenario', problem: parse(ACCURACY_SCENARIO) });
for (const below of [100, 5]) {
  const wallC = STEFAN.meltC - below;
  const exact = stefanTimes(wallC);
  cases.push({ name: `stefan-${below}K`, problem: parse(stefanScenario(wallC)), exact: { molten_at_s: 0, half_frozen_at_s: exact.halfS, frozen_at_s: exact.frozenS } });
}
// random melt-and-freeze stacks (tests/support/scenarios.ts), on seeds the promise's test does not use (it takes 1–8)
for (let seed = 101; seed <= 108; seed++) cases.push({ name: `random-${seed}`, problem: parse(randomMeltScenario(seededRandom(seed * 7919))) });
const only = process.env.CALIBRATE_CASES?.split(',');
const chosen = only ? cases.filter((c) => only.includes(c.name)) : cases;
if (only && chosen.length !== only.length) throw new Error(`CALIBRATE_CASES names a case that is not one of: ${cases.map((c) => c.name).join(', ')}`);

console.log(`accuracy rule calibration — pairs (ℓ, k): ${PAIRS.map(([l, k]) => `(${l}, ${k})`).join(' ')}; tolerances × ${FACTORS.join(', ')}`);
console.log(`the rule now: S = ${accuracyDefaults.spaceShareAtDefaults}, T = ${accuracyDefaults.timeShareAtDefaults} (error ÷ duration at level 0), T × ${accuracyDefaults.timeGrowthPerLooserLevel} per level looser`);
/** worst[pair index]: the largest |error| ÷ duration over the cases run, and the case. */
const worst = PAIRS.map(() => ({ share: 0, errS: 0, name: '' }));
for (const c of chosen) {
  const start = performance.now();
  let ref = c.exact;
  let refLabel = 'closed form';
  for (let levels = REFERENCE_LEVELS; ref === undefined && levels >= REFERENCE_LEVELS - 1; levels--) {
    ref = times(atPair(c.problem, levels, levels, 1));
    refLabel = `cells ×${2 ** levels}, tolerances ÷${3 ** levels}`;
  }
  if (ref === undefined) throw new Error(`${c.name}: no reference within the run-time ceiling`);
  const duration = c.problem.durationS;
  const cells: string[] = [];
  PAIRS.forEach(([l, k], i) => {
    let errS = 0;
    let at = 1;
    const each: string[] = [];
    for (const factor of FACTORS) {
      const got = times(atPair(c.problem, l, k, factor));
      if (got === undefined) throw new Error(`${c.name} at (${l}, ${k}) × ${factor}: stopped at the run-time ceiling`);
      const signed = EVENTS.map((e) => {
        const a = got[e];
        const b = ref[e];
        if ((a === null) !== (b === null)) throw new Error(`${c.name} at (${l}, ${k}) × ${factor}: ${e} ${a} against the reference's ${b}`);
        if (a !== null && b !== null && Math.abs(a - b) > errS) {
          errS = Math.abs(a - b);
          at = factor;
        }
        return a === null || b === null ? '–' : (a - b).toFixed(3);
      });
      each.push(signed.join('/'));
    }
    cells.push(`(${l},${k}) ${(errS / duration).toExponential(2)} ${errS.toFixed(3)} s ×${at}${VERBOSE ? `   molten/half-frozen/frozen − reference, s, at each setting: ${each.join('  ')}` : ''}`);
    if (errS / duration > worst[i]!.share) worst[i] = { share: errS / duration, errS, name: c.name };
  });
  console.log(`\n${c.name} (${duration} s; reference: ${refLabel}, ${((performance.now() - start) / 1000).toFixed(1)} s of work)`);
  for (const line of cells) console.log(`  ${line}`);
}

console.log('\nlargest |error| ÷ duration at each pair, over the cases run');
PAIRS.forEach(([l, k], i) => console.log(`  (${l}, ${k})  ${worst[i]!.share.toExponential(2)}  (${worst[i]!.name}, ${worst[i]!.errS.toFixed(3)} s)`));

/**
 * What the shares must meet: S/2^ℓ + T·f(k) ≥ MARGIN × e(ℓ, k) at every pair, with f(k) = 2^−k for k ≥ 0 and
 * g^−k below (g: the rule's timeGrowthPerLooserLevel), as the rule models them (accuracy.ts modelledErrorS).
 */
const g = accuracyDefaults.timeGrowthPerLooserLevel;
const rows = PAIRS.map(([l, k], i) => ({ a: 1 / 2 ** l, b: k >= 0 ? 1 / 2 ** k : g ** -k, c: MARGIN * worst[i]!.share }));
const now = { s: accuracyDefaults.spaceShareAtDefaults, t: accuracyDefaults.timeShareAtDefaults };
const short = PAIRS.filter((_, i) => rows[i]!.a * now.s + rows[i]!.b * now.t < rows[i]!.c);
console.log(`\nthe rule (S = ${now.s}, T = ${now.t}, looser levels ×${g} each) falls short of ×${MARGIN} the largest error at: ${short.length === 0 ? 'no pair' : short.map(([l, k]) => `(${l}, ${k})`).join(', ')}`);
PAIRS.forEach(([l, k], i) => {
  const r = rows[i]!;
  console.log(`  (${l}, ${k})  modelled ${(r.a * now.s + r.b * now.t).toExponential(2)} against ×${MARGIN} the largest, ${r.c.toExponential(2)}`);
});
// the growth per looser level the rule's S and T need: (MARGIN·e − S/2^ℓ)/T ≤ g^−k at each looser pair
const needed = PAIRS.map(([l, k], i) => (k < 0 ? Math.max(0, (rows[i]!.c - now.s / 2 ** l) / now.t) ** (1 / -k) : 0));
console.log(`  growth per looser level these S and T need: ${Math.max(...needed).toFixed(2)}`);

/**
 * The shares of least S + T meeting the same bounds (with the rule's g): a linear programme in two unknowns, solved at
 * the vertices of its feasible region (each pair of constraint lines, and the axes, intersected). A guide, not the
 * rule: where the pairs that bind all have ℓ = 0 it puts everything into S, as they cannot tell the two parts apart.
 */
const lines = [...rows, { a: 1, b: 0, c: 0 }, { a: 0, b: 1, c: 0 }];
let best: { s: number; t: number } | undefined;
for (let i = 0; i < lines.length; i++) {
  for (let j = i + 1; j < lines.length; j++) {
    const p = lines[i]!;
    const q = lines[j]!;
    const det = p.a * q.b - p.b * q.a;
    if (Math.abs(det) < 1e-15) continue;
    const s = (p.c * q.b - p.b * q.c) / det;
    const t = (p.a * q.c - p.c * q.a) / det;
    if (s < 0 || t < 0 || rows.some((r) => r.a * s + r.b * t < r.c * (1 - 1e-9))) continue;
    if (best === undefined || s + t < best.s + best.t) best = { s, t };
  }
}
if (best !== undefined) {
  const binding = PAIRS.filter((_, i) => Math.abs(rows[i]!.a * best!.s + rows[i]!.b * best!.t - rows[i]!.c) <= 1e-9 * rows[i]!.c);
  console.log(`shares of least S + T with margin ×${MARGIN}: S = ${best.s.toExponential(2)}, T = ${best.t.toExponential(2)} (S + T = ${(best.s + best.t).toExponential(2)}); binding at ${binding.map(([l, k]) => `(${l}, ${k})`).join(', ')}`);
}

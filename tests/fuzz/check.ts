// The fuzz properties, checked on one scenario (issue 9, "A fuzz suite"):
//   finishes, or stops with a message that says what is physically wrong (never "time step fell below", never NaN);
//   every number finite; no temperature below absolute zero; the energy ledger balanced relative to its largest term
//   (or, when nothing moves, absolutely within round-off); the maximum principle when there is no heat input.
// Bounded time and memory are measured by the callers (the test tier by its timeout, `npm run fuzz` by its figures).

import { resultDocument } from '../../sim/observe/result.ts';
import { buildGrid } from '../../sim/grid/mesh.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { ZERO_C_IN_K } from '../support/scenarios.ts';

export type FuzzKind = 'finished' | 'stopped' | 'refused' | 'violation';

export interface FuzzOutcome {
  readonly kind: FuzzKind;
  /** The solver's stop message, the refusal, or what property failed. */
  readonly message: string;
  readonly ms: number;
  readonly cells: number;
  readonly steps: number;
}

/**
 * Stop messages that name a physical cause (step-guards.ts): a face or a source that draws heat even at 0 K. Anything
 * else is a violation: "the heat drawn from the stack" (no such face or source: a numerical stop in physical words)
 * and the step budget (work, not physics: validation refuses a budget that max_step_s alone would force).
 */
export const PHYSICAL_STOPS = [/^the heat drawn (from the (bottom|top) face|by the source in layer .+) exceeds what the stack holds: its temperature would fall below absolute zero/];

/**
 * Energy balance: the imbalance relative to the largest term. Each stage closes its equations to the round-off of its
 * tridiagonal solve (tr-bdf2.ts), which the stage matrix's condition number amplifies (Higham 2002, §9.5: forward
 * error ≲ κ·u). A 1 µm metal layer beside millimetres of insulation gives κ ≈ 1e6–1e7 (cell conductances from ~1e9 to ~1e4
 * W/m²K), so κ·u ≈ 1e-9; measured worst 1.8e-9 over 10 000 fuzzed scenarios. 1e-8 holds that with a margin; the
 * examples stay at ≈ 1e-14 (tests/verification/energy-ledger.test.ts).
 */
const ENERGY_REL = 1e-8;
/** Unit round-off of IEEE 754 double precision, 2⁻⁵³. */
const UNIT_ROUNDOFF = 2 ** -53;
/**
 * Maximum principle slack: the local error tolerance tolerance_K itself. The discrete M-matrix system obeys the bound
 * (Patankar 1980 §4.3), but TR-BDF2's stability function is negative for large hλ (Hosea & Shampine 1996, §2), so a
 * stiff cell next to an abrupt change (a face held away from the initial temperature) under- or overshoots on the
 * first steps by a share of the jump, which the error control accepts up to tolerance_K. Measured on 298 quick-range
 * scenarios without heat input (seed 7): worst 0.0055·tolerance_K (1.1 mK). A tenth of tolerance_K keeps an 18× margin.
 */
const MAX_PRINCIPLE_SHARE = 0.1;
function bounds(s: ScenarioFile): [number, number] | undefined {
  const temps = [s.initial_C ?? s.ambient_C, s.ambient_C];
  for (const seg of [...s.bottom, ...s.top]) {
    // a heater body is heat input whatever its control (body-arbitrary.ts draws them)
    if ((seg.flux_W_m2 ?? 0) !== 0 || (seg.power_W ?? 0) !== 0 || seg.heater !== undefined) return undefined;
    for (const t of [seg.fixed_C, seg.fluid_C, seg.surroundings_C, seg.plate?.temperature_C, seg.bench?.start_C]) if (t !== undefined) temps.push(t);
  }
  for (const l of s.layers) if (l.source_W_m3 !== undefined) return undefined;
  return [Math.min(...temps), Math.max(...temps)];
}

export function checkScenario(scenario: ScenarioFile): FuzzOutcome {
  const parsed = parseScenario(scenario);
  if (!parsed.ok) return { kind: 'refused', message: parsed.errors.map((e) => `${e.path}: ${e.message}`).join('; '), ms: 0, cells: 0, steps: 0 };
  const t0 = performance.now();
  const out = runProblem(parsed.problem);
  const ms = performance.now() - t0;
  if (out.status === 'cancelled') return { kind: 'violation', message: 'cancelled without being asked', ms, cells: 0, steps: 0 };
  if (out.status === 'failed') {
    const physical = PHYSICAL_STOPS.some((re) => re.test(out.message));
    // the stop's reason, which the CLI's exit code and the view's words follow, agrees with its message
    const agrees = physical === (out.reason === 'physical');
    // a stopped run returns no grid: its cells are counted on the plan's grid (a ladder may have stopped on a rung below)
    return { kind: physical && agrees ? 'stopped' : 'violation', message: agrees ? out.message : `stop reason ${out.reason} for: ${out.message}`, ms, cells: buildGrid(parsed.problem, parsed.problem.numerics.accuracy?.gridRefine ?? 1).n, steps: out.stats.steps };
  }
  const { record, summary, grid, stats } = out;
  const base = { ms, cells: grid.n, steps: stats.steps };
  const violation = (message: string): FuzzOutcome => ({ kind: 'violation', message, ...base });
  try {
    resultDocument(parsed.problem, grid, record, summary, stats);
  } catch (e) {
    return violation((e as Error).message);
  }
  let coldest = Infinity;
  let hottest = -Infinity;
  for (const v of record.map.data) {
    if (!Number.isFinite(v)) return violation(`map value ${v}`);
    coldest = Math.min(coldest, v);
    hottest = Math.max(hottest, v);
  }
  for (const l of record.layers) {
    for (const v of l.minC) coldest = Math.min(coldest, v);
    for (const v of l.maxC) hottest = Math.max(hottest, v);
  }
  if (coldest < -ZERO_C_IN_K) return violation(`a temperature of ${coldest} °C, below absolute zero`);
  const e = summary.energy;
  const imbalance = Math.abs(e.stored_J_m2 - (e.in_J_m2 - e.out_J_m2));
  const initialC = scenario.initial_C ?? scenario.ambient_C;
  const swingK = Math.max(hottest - initialC, initialC - coldest, 1);
  let capacity = 0;
  for (let i = 0; i < grid.n; i++) capacity += grid.materials[i]!.density * Math.max(...grid.materials[i]!.specificHeat.y) * grid.dx[i]!;
  // at rest: the round-off of summing the stored enthalpy, u·Σ|H_i|·Δx_i per step (Higham, Accuracy and Stability of
  // Numerical Algorithms, 2002, §4.2), with |H_i| ≤ ρc_p·(temperature swing) since enthalpy is counted from the start
  const atRest = UNIT_ROUNDOFF * (stats.steps + 1) * capacity * swingK;
  if (!(e.imbalance_rel <= ENERGY_REL || imbalance <= atRest)) return violation(`energy imbalance ${e.imbalance_rel} of the largest term (in ${e.in_J_m2}, out ${e.out_J_m2}, stored ${e.stored_J_m2} J/m²)`);
  const b = bounds(scenario);
  const slack = MAX_PRINCIPLE_SHARE * parsed.problem.numerics.toleranceK;
  if (b && (coldest < b[0] - slack || hottest > b[1] + slack)) {
    return violation(`without heat input the temperatures ${coldest}–${hottest} °C leave [${b[0]}, ${b[1]}] °C`);
  }
  return { kind: 'finished', message: '', ...base };
}

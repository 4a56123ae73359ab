// The properties of the operating-duration search (sim/study/window.ts), checked on one scenario of
// window-arbitrary.ts, whose shape fixes the answer's form by the comparison principle (see there):
//   the search finishes, every number in its report finite;
//   both sets are single intervals (the report says monotonic);
//   every run the search made agrees with the intervals it reports (a run that kept the margin lies in a safe interval,
//   a run that melted the separator in a molten one, and no other does), so the operating chart and the answer agree;
//   the longest hold keeps the margin, the shortest hold melts the separator;
//   along the holds run, margins do not rise and the separator's melt does not recede (comparison principle), beyond
//   the solver's own noise;
//   with a flux as the heat input, the run at the reported hold takes in q × hold (the closed form of a constant
//   imposed flux), so the heat went off where the hold says.

import { parseScenario } from '../../sim/scenario/scenario.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { runProblem } from '../../sim/run.ts';
import { holdKnob } from '../../sim/study/knob.ts';
import { keepsMargin, SolveFailure } from '../../sim/study/point.ts';
import { searchWindow, type WindowReport } from '../../sim/study/window.ts';

/**
 * How far a margin may rise from one hold to a longer one, K: the peaks carry the solver's error, each step's held to
 * tolerance_K (0.2 K at the defaults); 1 K is five times that. Measured worst 0.007 K over 300 fuzzed searches (seed 3,
 * 2026-12-04); a heat left on past its hold made it rise by 344–6120 K.
 */
const MARGIN_RISE_K = 1;
/**
 * How far melt_reach may fall from one hold to a longer one. Once molten it is the least-melted cell's highest
 * superheat over the span of its melt, ρL for these eutectics and pure salts, so 1 K of superheat is c_p/L: at most
 * 1/161 over the library's salts (L/c_p = 161–513 K, licl-kcl-eutectic the smallest). Measured: 1.1e-3 (0.23 K on
 * libr-kbr-lif-eutectic, two holds 0.25 s apart next to the molten edge; seed 6 case 130).
 */
const REACH_FALL = 1 / 161;
/**
 * The energy in from a constant flux against q × hold. The ledger integrates a constant by TR-BDF2's weights, exactly
 * but for round-off; what else counts as heat in is the cooling face's return while the cooled stack dips below the
 * ambient within the solver's tolerance (a 0.1 mm KCl disc cooled by 30.8 W/(m²·K) at −40 °C: 2.5e-7 of q × hold,
 * measured). A heat left on past its hold adds q × (duration − hold), a share of the order of one.
 */
const FLUX_ENERGY_REL = 1e-5;

export interface WindowCheck {
  /** The properties that failed, in words; empty when all hold. */
  readonly problems: readonly string[];
  readonly solves: number;
  readonly ms: number;
  /** Set when a run of the search stopped for a physical reason or at the run-time ceiling: its message. */
  readonly stopped?: string;
  /** The figures behind the allowances: the largest margin rise (K), melt_reach fall and flux energy share seen. */
  readonly worst?: { readonly marginRiseK: number; readonly reachFall: number; readonly fluxEnergyRel: number };
}

const finiteProblems = (r: WindowReport): string[] => {
  const out: string[] = [];
  JSON.stringify(r, (key, v: unknown) => {
    if (typeof v === 'number' && !Number.isFinite(v)) out.push(`${key} is ${v}`);
    return v;
  });
  return out;
};

/**
 * `comparison`: whether the comparison principle applies (window-arbitrary.ts: one heat input, removed at the hold);
 * a controlled heater (body-arbitrary.ts) may make either set several intervals, so then only the agreement of the
 * runs with the intervals, the two answers and finiteness are checked.
 */
export function checkWindow(scenario: ScenarioFile, vary: 'time' | 'power' = 'time', comparison = true): WindowCheck {
  const parsed = parseScenario(scenario);
  if (!parsed.ok) return { problems: [`refused: ${parsed.errors.map((e) => `${e.path}: ${e.message}`).join('; ')}`], solves: 0, ms: 0 };
  const problem = parsed.problem;
  const start = performance.now();
  let result;
  try {
    result = searchWindow(problem, { vary });
  } catch (e) {
    if (e instanceof SolveFailure && e.stop && e.stop.reason !== 'numerical') return { problems: [], stopped: e.message, solves: 0, ms: performance.now() - start };
    return { problems: [`threw: ${(e as Error).message}${e instanceof SolveFailure && e.stop ? ` (${e.stop.reason})` : ''}`], solves: 0, ms: performance.now() - start };
  }
  const ms = performance.now() - start;
  if (!result.ok) return { problems: [`no search: ${result.reason}`], solves: 0, ms };
  const r = result.report;
  const problems = finiteProblems(r);
  if (comparison && !r.monotonic) problems.push(`not one safe and one molten interval: safe ${JSON.stringify(r.safe)}, molten ${JSON.stringify(r.molten)}`);
  const within = (x: number, set: WindowReport['safe']) => set.some((iv) => x >= iv.from && x <= iv.to);
  for (const p of r.points) {
    if (keepsMargin(p, r.margin_K) !== within(p.value, r.safe)) {
      problems.push(`the run at ${p.value} ${keepsMargin(p, r.margin_K) ? 'keeps' : 'misses'} the margin (${p.margin_K} K) but is ${within(p.value, r.safe) ? 'inside' : 'outside'} the safe intervals`);
    }
    if ((p.molten_at_s !== null) !== within(p.value, r.molten)) {
      problems.push(`the run at ${p.value} is ${p.molten_at_s !== null ? '' : 'not '}molten but ${within(p.value, r.molten) ? 'inside' : 'outside'} the molten intervals`);
    }
  }
  const at = (x: number) => r.points.find((p) => p.value === x);
  if (r.longest && !keepsMargin(at(r.longest.value) ?? { margin_K: -Infinity }, r.margin_K)) problems.push(`the longest hold ${r.longest.value} does not keep the margin`);
  if (r.shortest && at(r.shortest.value)?.molten_at_s == null) problems.push(`the shortest hold ${r.shortest.value} does not melt the separator`);
  const worst = { marginRiseK: 0, reachFall: 0, fluxEnergyRel: 0 };
  for (let k = 1; k < r.points.length; k++) {
    const a = r.points[k - 1]!;
    const b = r.points[k]!;
    if (a.margin_K !== null && b.margin_K !== null) worst.marginRiseK = Math.max(worst.marginRiseK, b.margin_K - a.margin_K);
    if (a.melt_reach !== null && b.melt_reach !== null) worst.reachFall = Math.max(worst.reachFall, a.melt_reach - b.melt_reach);
    if (comparison && a.margin_K !== null && b.margin_K !== null && b.margin_K - a.margin_K > MARGIN_RISE_K) {
      problems.push(`the margin rises by ${(b.margin_K - a.margin_K).toFixed(3)} K from the hold ${a.value} to ${b.value}`);
    }
    if (comparison && a.melt_reach !== null && b.melt_reach !== null && a.melt_reach - b.melt_reach > REACH_FALL) {
      problems.push(`the separator's melt recedes by ${(a.melt_reach - b.melt_reach).toExponential(2)} from the hold ${a.value} to ${b.value}`);
    }
  }
  const flux = scenario.bottom[0]?.flux_W_m2;
  const hold = r.shortest?.value ?? r.longest?.value;
  if (vary === 'time' && flux !== undefined && hold !== undefined && hold > 0) {
    const knob = holdKnob(problem);
    if (typeof knob !== 'string') {
      const out = runProblem(knob.apply(hold), { detail: 'summary' });
      if (out.status !== 'ok') problems.push(`the run at the hold ${hold} did not finish`);
      else {
        const expected = flux * hold;
        const rel = Math.abs(out.summary.energy.in_J_m2 - expected) / expected;
        worst.fluxEnergyRel = rel;
        if (!(rel <= FLUX_ENERGY_REL)) problems.push(`the run at the hold ${hold} took in ${out.summary.energy.in_J_m2} J/m², not q × hold = ${expected} (relative ${rel.toExponential(2)})`);
      }
    }
  }
  return { problems, solves: r.solves, ms, worst };
}

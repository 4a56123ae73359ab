/**
 * The human summary of a run: a verdict table for the terminal. Plain text, fixed-width columns, every value with
 * its unit; words (from sim/observe/wording.ts) for a verdict with no value; numbers through sim/observe/format.ts, which never
 * prints NaN. It ends with the stated expectations, the convection note and the same hazard list as the view.
 */
import { convectionNote } from '../observe/convection-note.ts';
import type { ExpectationOutcome } from '../scenario/expect.ts';
import { formatEnergy, formatImbalance, formatMargin, formatNumber, formatTemperature, formatTime } from '../observe/format.ts';
import type { Problem } from '../physics/problem.ts';
import { accuracyLine } from '../scenario/accuracy.ts';
import type { RunRecord } from '../observe/record.ts';
import type { Summary } from '../observe/verdict.ts';
import {
  expectationWords, hazards, hazardsHeading, marginWords, noValueWords, predictionNotCertification, terms, verdictTerms,
  windowStatusWords,
} from '../observe/wording.ts';

export interface TableExtras {
  /** Outcomes of the scenario's `expect` block (sim/scenario/expect.ts); none printed when empty. */
  readonly expectations?: readonly ExpectationOutcome[];
  /** Lines of `run --require` (sim/cli/require-check.ts), printed after the expectations. */
  readonly requirements?: readonly string[];
  /** Print the solver's own convection warnings (Rayleigh ranges) beside the plain-words note. */
  readonly verbose?: boolean;
  /** Accepted steps of the run (EvolveStats.steps): a long run's record is thinned, so its rows undercount them. */
  readonly steps?: number;
}

const pad = (s: string, n: number) => s.padEnd(n);
const lpad = (s: string, n: number) => s.padStart(n);
const LABEL = 26;
const VALUE = 13;

/** Whether a recorder warning is the Rayleigh-range detail that the plain convection note summarises. */
export const isRayleighDetail = (w: string): boolean => /Rayleigh/.test(w);

/** The plain-words convection sentence, or undefined when no face was outside its correlation's range. */
export function convectionSentence(problem: Problem, record: RunRecord): string | undefined {
  const note = convectionNote(problem, record);
  if (!note?.outsideRange) return undefined;
  return `the cell is small, so the still-air correlations are used outside their published range: heat loss from the faces is uncertain by about ${note.faceLossPercent} % (the convective part by about ${note.convectionPercent} %, the spread between published correlations), and freeze times carry part of that.`;
}

/** The hazard list and the closing sentence, as lines indented by two spaces. */
export function cautionLines(): string[] {
  return [`  ${hazardsHeading}:`, ...hazards.map((h) => `  - ${h.term}: ${h.definition}`), '', `  ${predictionNotCertification}`];
}

export function expectationLines(outcomes: readonly ExpectationOutcome[]): string[] {
  if (outcomes.length === 0) return [];
  const lines = ['', '  stated expectations (expect):'];
  const width = Math.max(...outcomes.map((o) => o.statement.length));
  for (const o of outcomes) {
    lines.push(`    ${pad(o.met ? expectationWords.pass : expectationWords.fail, 8)}${pad(o.statement, width)}   run gave ${o.actual}`);
  }
  return lines;
}

export function summaryTable(problem: Problem, summary: Summary, record: RunRecord, extras: TableExtras = {}): string {
  const s = summary.separator;
  const row = (label: string, value: string) => `  ${pad(label, LABEL)}${lpad(value, VALUE)}`;
  const lines: string[] = [`freezeline — ${problem.name}`, ''];
  lines.push(row(verdictTerms.heat_off_s.term, formatTime(summary.heat_off_s, noValueWords.heat_off_s)));
  lines.push(row(verdictTerms.molten_at_s.term, formatTime(s.molten_at_s, noValueWords.molten_at_s)));
  lines.push(row(verdictTerms.half_frozen_at_s.term, formatTime(s.half_frozen_at_s, noValueWords.half_frozen_at_s)));
  lines.push(row(verdictTerms.frozen_at_s.term, formatTime(s.frozen_at_s, noValueWords.frozen_at_s)));
  lines.push(summary.safe_window_s !== null
    ? row(verdictTerms.safe_window_s.term, formatTime(summary.safe_window_s, ''))
    : `  ${pad(verdictTerms.safe_window_s.term, LABEL)}${windowStatusWords[summary.safe_window_status].sentence}`);
  lines.push('');
  lines.push(`  ${pad(terms.layer.term, 14)}${lpad(`${verdictTerms.peak_C.term}`, 10)}${lpad('at', 13)}  ${pad('binding limit', 20)}${lpad(verdictTerms.margin_K.term, 16)}`);
  for (const [id, v] of Object.entries(summary.layers)) {
    const limit = v.limit ? `${v.limit.kind} ${formatNumber(v.limit.at_C, { decimals: 0 })} °C` : noValueWords.limit;
    const flag = v.margin_K !== null && v.margin_K <= 0 ? `  ${marginWords.reached}` : id === summary.binding_layer ? `  (${marginWords.binding})` : '';
    lines.push(`  ${pad(id, 14)}${lpad(formatTemperature(v.peak_C, ''), 10)}${lpad(formatTime(v.peak_at_s, ''), 13)}  ${pad(limit, 20)}${lpad(formatMargin(v.margin_K, noValueWords.margin_K), 16)}${flag}`);
  }
  const e = summary.energy;
  lines.push('');
  lines.push(`  ${verdictTerms.energy.term}: in ${formatEnergy(e.in_J_m2)}, out ${formatEnergy(e.out_J_m2)}, stored ${formatEnergy(e.stored_J_m2)}, imbalance ${formatImbalance(e.imbalance_rel)}`);
  // the edge channel (scenario key edges) is part of in and out above; shown on its own when the run has it
  if (e.edge_out_J_m2 !== undefined) lines.push(`    of which through the side walls (edges): in ${formatEnergy(e.edge_in_J_m2 ?? 0)}, out ${formatEnergy(e.edge_out_J_m2)}`);
  const heater = summary.heater;
  if (heater) {
    lines.push(`  heater: ${formatNumber(heater.energy_J / 1e3, { significant: 3 })} kJ over ${formatTime(heater.under_stack_s, '')} under the stack, duty cycle ${formatNumber(100 * heater.duty_cycle, { decimals: 1 })} %, plate up to ${formatTemperature(heater.plate_peak_C, '')}`);
  }
  lines.push(`  run: ${formatTime(problem.durationS, '')} simulated in ${extras.steps ?? record.tS.length - 1} ${terms.step.term}s`);
  lines.push(`  ${accuracyLine(problem.numerics.accuracy)}`);
  lines.push(...expectationLines(extras.expectations ?? []));
  if (extras.requirements?.length) lines.push('', ...extras.requirements);
  const note = convectionSentence(problem, record);
  if (note) lines.push('', `  note: ${note}${extras.verbose ? '' : ' (--verbose for the Rayleigh numbers)'}`);
  for (const w of record.warnings) if (!note || !isRayleighDetail(w) || extras.verbose) lines.push(`  warning: ${w}`);
  lines.push('', ...cautionLines());
  return lines.join('\n');
}

/**
 * The human summary of a run: a verdict table for the terminal. Plain text, fixed-width columns, units in headers;
 * "never" for an event that did not happen. Numbers pass through one formatter that refuses non-finite values.
 */
import type { RunRecord } from '../record.ts';
import type { Summary } from '../verdict.ts';

/** A number for a person: fixed decimals, or "never" for null. Throws on NaN/∞ (an internal error, not a value). */
export function fmt(value: number | null, decimals = 1): string {
  if (value === null) return 'never';
  if (!Number.isFinite(value)) throw new Error(`internal error: a non-finite number (${value}) reached the output`);
  return value.toFixed(decimals);
}

const pad = (s: string, n: number) => s.padEnd(n);
const lpad = (s: string, n: number) => s.padStart(n);

const WINDOW_WORDS: Record<Summary['safe_window_status'], string> = {
  'ok': '',
  'limit-crossed': 'none: a layer reached its limit',
  'never-molten': 'none: the separator never became fully molten',
  'no-separator': 'none: no layer is marked as the separator',
  'heat-never-off': 'undetermined: the heat stays on to the end of the run',
  'still-molten-at-end': 'at least until the end of the run: the separator had not half-frozen',
};

export function summaryTable(name: string, summary: Summary, record: RunRecord, durationS: number): string {
  const s = summary.separator;
  const lines: string[] = [];
  lines.push(`freezeline — ${name}`);
  lines.push('');
  lines.push(`  heat off at              ${lpad(fmt(summary.heat_off_s), 9)} s`);
  lines.push(`  separator molten at      ${lpad(fmt(s.molten_at_s), 9)} s`);
  lines.push(`  separator half-frozen at ${lpad(fmt(s.half_frozen_at_s), 9)} s`);
  lines.push(`  separator frozen at      ${lpad(fmt(s.frozen_at_s), 9)} s`);
  const words = WINDOW_WORDS[summary.safe_window_status];
  lines.push(`  safe window              ${summary.safe_window_s !== null ? `${lpad(fmt(summary.safe_window_s), 9)} s` : words}`);
  lines.push('');
  lines.push(`  ${pad('layer', 14)}${lpad('peak °C', 9)}${lpad('at s', 9)}  ${pad('binding limit', 24)}${lpad('margin K', 9)}`);
  for (const [id, v] of Object.entries(summary.layers)) {
    const limit = v.limit ? `${v.limit.kind} ${fmt(v.limit.at_C, 0)} °C` : '—';
    const flag = v.margin_K !== null && v.margin_K <= 0 ? '  LIMIT REACHED' : id === summary.binding_layer ? '  (binding)' : '';
    lines.push(`  ${pad(id, 14)}${lpad(fmt(v.peak_C), 9)}${lpad(fmt(v.peak_at_s, 0), 9)}  ${pad(limit, 24)}${lpad(v.margin_K === null ? '—' : fmt(v.margin_K), 9)}${flag}`);
  }
  const e = summary.energy;
  lines.push('');
  lines.push(`  energy: in ${fmt(e.in_J_m2 / 1e3)} kJ/m², out ${fmt(e.out_J_m2 / 1e3)} kJ/m², stored ${fmt(e.stored_J_m2 / 1e3)} kJ/m², imbalance ${e.imbalance_rel.toExponential(1)}`);
  lines.push(`  run: ${fmt(durationS, 0)} s simulated in ${record.tS.length - 1} steps`);
  for (const w of record.warnings) lines.push(`  warning: ${w}`);
  lines.push('');
  lines.push('  A prediction, not a safety certification: local codes, your lab\'s safety rules and licensed practice come first.');
  return lines.join('\n');
}

/**
 * The operating chart of a window search as CSV (RFC 4180, one header row, units in the column names): one row per
 * run, in order of the varied input — its value, the smallest margin to any limit and which layer and limit that is,
 * whether the run keeps the required margin and melts the separator, and the usable window after heat off.
 * A quantity that does not exist (no limit on file, never molten) is an empty cell, never "NaN".
 */
import { csvNumber } from '../observe/format.ts';
import { kToC } from '../physics/units.ts';
import { keepsMargin } from './point.ts';
import type { WindowReport } from './window.ts';

const quote = (s: string): string => (/[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
const num = (v: number | null): string => (v === null ? '' : csvNumber(v));

/** The varied input's column name, e.g. `hold_s`, `plate_temperature_C`. */
export function valueColumn(r: Pick<WindowReport, 'knob'>): string {
  const k = r.knob;
  if (k.vary === 'time') return 'hold_s';
  const unit = k.unit === '°C' ? 'C' : k.unit === 'W/m²' ? 'W_m2' : k.unit === 'W/m³' ? 'W_m3' : k.unit;
  return `${k.label.split(' (')[0]!.replace(/ /g, '_')}_${unit}`;
}

export function operatingCsv(r: WindowReport): string {
  const header = [valueColumn(r), 'smallest_margin_K', 'binding_layer', 'binding_limit', 'binding_at_s', 'keeps_margin',
    'separator_molten', 'heat_off_s', 'usable_window_s', ...(r.until_liquid !== null ? [`until_liquid_${r.until_liquid}_s`] : []), 'solidifying_after_s'];
  const rows = r.points.map((p) => {
    const b = p.binding;
    return [
      csvNumber(r.knob.unit === '°C' ? kToC(p.value) : p.value), num(p.margin_K), quote(b?.layer ?? ''), b?.kind ?? '', num(b?.at_s ?? null),
      keepsMargin(p, r.margin_K) ? '1' : '0', p.molten_at_s !== null ? '1' : '0', num(p.heat_off_s), num(p.window_s),
      ...(r.until_liquid !== null ? [num(p.until_liquid_s)] : []), num(p.solidifying_s),
    ].join(',');
  });
  return `${[header.map(quote).join(','), ...rows].join('\r\n')}\r\n`;
}

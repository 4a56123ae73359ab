/**
 * A sweep's rows as text: JSON Lines (one `{ index, inputs, summary, error }` object per line, numbers exact) or CSV
 * (one line per point: the inputs, then every verdict, then the error; numbers at about 6 significant figures).
 * A verdict that does not exist is an empty CSV cell and null in JSON, never a number.
 */
import { csvNumber } from '../observe/format.ts';
import type { SweepRow } from './sweep.ts';

export const jsonlRow = (row: SweepRow): string => JSON.stringify(row);

const SUMMARY_COLUMNS = ['heat_off_s', 'molten_at_s', 'half_frozen_at_s', 'frozen_at_s', 'safe_window_s', 'safe_window_status', 'binding_layer'] as const;
const LAYER_COLUMNS = ['peak_C', 'peak_at_s', 'limit', 'margin_K'] as const;

/** CSV cell: numbers at about 6 significant figures, text quoted when it holds a comma, quote or line break. */
function cell(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return csvNumber(v);
  const s = String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvHeader(inputKeys: readonly string[], layerIds: readonly string[]): string {
  const layerCols = layerIds.flatMap((id) => LAYER_COLUMNS.map((c) => `${id}.${c}`));
  return ['index', ...inputKeys, ...SUMMARY_COLUMNS, ...layerCols, 'energy.imbalance_rel', 'warnings', 'error'].map(cell).join(',');
}

export function csvRow(row: SweepRow, inputKeys: readonly string[], layerIds: readonly string[]): string {
  const s = row.summary;
  const summaryCells = [
    s?.heat_off_s, s?.separator.molten_at_s, s?.separator.half_frozen_at_s, s?.separator.frozen_at_s,
    s?.safe_window_s, s?.safe_window_status, s?.binding_layer,
  ];
  const layerCells = layerIds.flatMap((id) => {
    const l = s && Object.hasOwn(s.layers, id) ? s.layers[id] : undefined;
    return [l?.peak_C, l?.peak_at_s, l?.limit ? `${l.limit.kind} ${l.limit.at_C} °C` : undefined, l?.margin_K];
  });
  const warnings = s && s.warnings.length > 0 ? s.warnings.join(' | ') : undefined;
  return [row.index, ...inputKeys.map((k) => row.inputs[k]), ...summaryCells, ...layerCells, s?.energy.imbalance_rel, warnings, row.error].map(cell).join(',');
}

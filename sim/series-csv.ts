/**
 * The series of a run as CSV (RFC 4180, comma-separated, one header row, units in the column names): time, each
 * layer's min/mean/max temperature, liquid fractions of the layers that melt, and the two face temperatures.
 * One writer for the CLI (`run --csv`) and the browser view's export. A non-finite value (never expected: the
 * result is checked) is written as an empty cell rather than as "NaN".
 */
import type { RunRecord } from './record.ts';

/** The columns a CSV needs: a RunRecord, or the view's copy of one without its map. */
export type SeriesColumns = Pick<RunRecord, 'tS' | 'layers' | 'bottomC' | 'topC'>;

const cell = (v: number): string => (Number.isFinite(v) ? String(v) : '');
const quote = (name: string): string => (/[",\n\r]/.test(name) ? `"${name.replace(/"/g, '""')}"` : name);

export function seriesCsv(record: SeriesColumns): string {
  const columns: [string, Float64Array][] = [['t_s', record.tS]];
  for (const l of record.layers) {
    columns.push([`${l.id}_min_C`, l.minC], [`${l.id}_mean_C`, l.meanC], [`${l.id}_max_C`, l.maxC]);
    if (l.liquidFraction) columns.push([`${l.id}_liquid_fraction`, l.liquidFraction]);
  }
  columns.push(['bottom_face_C', record.bottomC], ['top_face_C', record.topC]);
  const lines = [columns.map(([name]) => quote(name)).join(',')];
  for (let j = 0; j < record.tS.length; j++) lines.push(columns.map(([, a]) => cell(a[j]!)).join(','));
  return `${lines.join('\r\n')}\r\n`;
}

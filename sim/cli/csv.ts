/**
 * The series of a run as CSV (RFC 4180): one row per recorded time, columns with units in their names.
 * Layer columns: <id>_min_C, <id>_mean_C, <id>_max_C and, for melting layers, <id>_liquid_fraction.
 */
import type { RunRecord } from '../record.ts';

const quote = (s: string): string => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

export function seriesCsv(record: RunRecord): string {
  const header = ['t_s', 'bottom_face_C', 'top_face_C'];
  const columns: Float64Array[] = [record.tS, record.bottomC, record.topC];
  for (const l of record.layers) {
    header.push(`${l.id}_min_C`, `${l.id}_mean_C`, `${l.id}_max_C`);
    columns.push(l.minC, l.meanC, l.maxC);
    if (l.liquidFraction) { header.push(`${l.id}_liquid_fraction`); columns.push(l.liquidFraction); }
  }
  const rows = [header.map(quote).join(',')];
  for (let j = 0; j < record.tS.length; j++) rows.push(columns.map((c) => String(c[j])).join(','));
  return `${rows.join('\r\n')}\r\n`;
}

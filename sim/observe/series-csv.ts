/**
 * The series of a run as CSV (RFC 4180, comma-separated, one header row, units in the column names): time, each
 * layer's min/mean/max temperature, liquid fractions of the layers that melt, and the two face temperatures.
 * One writer for the CLI (`run --csv`) and the browser view's export. Numbers carry about 6 significant figures
 * (sim/observe/format.ts `csvNumber`); a non-finite value (never expected: the result is checked) is written as an empty cell
 * rather than as "NaN".
 *
 * Two row sets: every recorded point (`seriesCsv`), or the scenario's requested output times (`outputTimesCsv`), with
 * the probe temperatures added as columns. The solver lands a step on each output time, so those rows are recorded
 * values; a time between two records (never expected) is interpolated linearly.
 */
import { csvNumber } from './format.ts';
import type { RunRecord } from './record.ts';

/** The columns a CSV needs: a RunRecord, or the view's copy of one without its map. */
export type SeriesColumns = Pick<RunRecord, 'tS' | 'layers' | 'bottomC' | 'topC'>;

const quote = (name: string): string => (/[",\n\r]/.test(name) ? `"${name.replace(/"/g, '""')}"` : name);

function columnsOf(record: SeriesColumns): [string, Float64Array][] {
  const columns: [string, Float64Array][] = [['t_s', record.tS]];
  for (const l of record.layers) {
    columns.push([`${l.id}_min_C`, l.minC], [`${l.id}_mean_C`, l.meanC], [`${l.id}_max_C`, l.maxC]);
    if (l.liquidFraction) columns.push([`${l.id}_liquid_fraction`, l.liquidFraction]);
  }
  columns.push(['bottom_face_C', record.bottomC], ['top_face_C', record.topC]);
  return columns;
}

const csv = (header: readonly string[], rows: readonly (readonly number[])[]): string =>
  `${[header.map(quote).join(','), ...rows.map((r) => r.map(csvNumber).join(','))].join('\r\n')}\r\n`;

export function seriesCsv(record: SeriesColumns): string {
  const columns = columnsOf(record);
  const rows: number[][] = [];
  for (let j = 0; j < record.tS.length; j++) rows.push(columns.map(([, a]) => a[j]!));
  return csv(columns.map(([name]) => name), rows);
}

/** Value of a recorded column at time t, linear between the two recorded points around it (exact on a record). */
function at(tS: Float64Array, values: Float64Array, t: number): number {
  let j = 0;
  while (j < tS.length - 1 && tS[j + 1]! <= t) j++;
  if (tS[j] === t || j === tS.length - 1) return values[j]!;
  const w = (t - tS[j]!) / (tS[j + 1]! - tS[j]!);
  return values[j]! * (1 - w) + values[j + 1]! * w;
}

/** Probe columns: a name ("probe_1.5mm_C", with the probe's label when it has one) per probe. */
export interface ProbeColumns {
  readonly labels: readonly string[];
  readonly probes: Pick<RunRecord['probes'], 'xMm' | 'tS' | 'tC'>;
}

/** One row per requested output time: the series columns there, then one column per probe. */
export function outputTimesCsv(record: SeriesColumns, outputTimesS: readonly number[], probe: ProbeColumns): string {
  const columns = columnsOf(record);
  const header = [...columns.map(([name]) => name),
    ...probe.probes.xMm.map((x, i) => `probe_${csvNumber(x)}mm${probe.labels[i] ? ` (${probe.labels[i]})` : ''}_C`)];
  const rows = outputTimesS.map((t) => {
    const k = probe.probes.tS.indexOf(t);
    return [t, ...columns.slice(1).map(([, a]) => at(record.tS, a, t)), ...probe.probes.tC.map((series) => (k >= 0 ? series[k]! : Number.NaN))];
  });
  return csv(header, rows);
}

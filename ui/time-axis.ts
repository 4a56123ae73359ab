/**
 * The time axis of a chart: seconds for short spans, minutes for long runs (from the same 10 min at which event times
 * switch to minutes and seconds, sim/observe/format.ts), so a 3600 s run reads 0–60 min. A chart's x values are
 * (t − offset) / scale; the offset lets a chart count from heat off. The hover header always carries the unit.
 */
import type { LayoutAxis } from 'plotly.js-dist-min';
import { formatDefaults } from './format.ts';

export interface TimeAxis {
  /** Seconds per unit of x. */
  readonly scale: 1 | 60;
  /** Time at x = 0, s. */
  readonly offsetS: number;
  readonly unit: 's' | 'min';
  /** Axis title with its unit. */
  readonly title: string;
}

/** The axis for a span of `spanS` seconds, counted from `offsetS` (`from` names that origin in the title). */
export function timeAxis(spanS: number, offsetS = 0, from?: string): TimeAxis {
  const minutes = spanS >= formatDefaults.minutesFromS;
  const unit = minutes ? 'min' : 's';
  return { scale: minutes ? 60 : 1, offsetS, unit, title: `${from ? `time after ${from}` : 'time'}, ${unit}` };
}

/** x of a time t (s). */
export const xOf = (a: TimeAxis, tS: number): number => (tS - a.offsetS) / a.scale;

/** The x values of a series of times (a new array). */
export function xsOf(a: TimeAxis, tS: ArrayLike<number>): Float64Array {
  const out = new Float64Array(tS.length);
  for (let k = 0; k < tS.length; k++) out[k] = (tS[k]! - a.offsetS) / a.scale;
  return out;
}

/** `t = 12.50 min` for a hover template (0.01 min = 0.6 s, 0.1 s below 10 min: the event-time precision). */
export const hoverTime = (a: TimeAxis, x = '%{x'): string => (a.unit === 'min' ? `t = ${x}:.2f} min` : `t = ${x}:.1f} s`);

/** Plotly x-axis settings: title with unit, hover format, and the unified hover header with the unit. */
export function xAxisLayout(a: TimeAxis, extra: Partial<LayoutAxis> = {}): Partial<LayoutAxis> {
  return {
    title: { text: a.title }, automargin: true, zeroline: false, gridcolor: '#e4e8ec',
    hoverformat: a.unit === 'min' ? '.2f' : '.1f',
    ...({ unifiedhovertitle: { text: `${a.offsetS > 0 ? 'after heat off, ' : ''}${hoverTime(a)}` } } as Partial<LayoutAxis>),
    ...extra,
  };
}

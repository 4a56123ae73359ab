/**
 * A window search in words a designer reads, for the CLI and the browser view alike: one sentence per answer
 * (longest hold, shortest hold, usable window, binding constraint) and one line per interval. Numbers go through
 * sim/observe/format.ts (no NaN ever reaches the text); a quantity that does not exist is said in words, with the reason.
 */
import { formatMargin, formatNumber, formatTemperature, formatTime } from '../observe/format.ts';
import { kToC } from '../physics/units.ts';
import type { Interval } from './bracket.ts';
import type { WindowReport } from './window.ts';

/** A value of the varied input with its unit: a time as "14:20 min:s", a temperature in °C, else the number. */
export function showValue(report: Pick<WindowReport, 'knob'>, v: number): string {
  const k = report.knob;
  if (k.unit === 's') return formatTime(v, '—');
  if (k.unit === '°C') return formatTemperature(kToC(v), '—');
  return `${formatNumber(v, { significant: 4 })} ${k.unit}`;
}

/** A step of the varied input: a time, or a temperature difference in K, or the number with its unit. */
function showStep(report: Pick<WindowReport, 'knob'>, d: number): string {
  const u = report.knob.unit;
  if (u === 's') return formatTime(d, '—');
  return `${formatNumber(d, { significant: 3 })} ${u === '°C' ? 'K' : u}`;
}

export interface WindowWords {
  readonly longest: string;
  readonly shortest: string;
  readonly window: string;
  readonly binding: string;
  readonly safeIntervals: readonly string[];
  readonly moltenIntervals: readonly string[];
  readonly method: string;
}

const intervalText = (r: WindowReport, i: Interval): string =>
  `${showValue(r, i.from)}${i.fromRangeEnd ? ' (bottom of the range)' : ''} to ${showValue(r, i.to)}${i.toRangeEnd ? ' (top of the range)' : ''}`;

export function windowWords(r: WindowReport): WindowWords {
  const time = r.knob.vary === 'time';
  const most = time ? 'hold at most' : `${r.knob.label} at most`;
  const least = time ? 'hold at least' : `${r.knob.label} at least`;
  const m = `${formatNumber(r.margin_K, { decimals: 0 })} K`;
  let longest: string;
  let binding: string;
  if (r.longest) {
    const b = r.longest.binding;
    longest = b
      ? `${most} ${showValue(r, r.longest.value)} (${b.layer} reaches ${b.kind} − ${m} then, at ${formatTime(b.at_s, '—')})`
      : `${most} ${showValue(r, r.longest.value)}`;
    binding = b ? `${b.layer}: ${b.kind} limit ${formatTemperature(b.limit_C, '—')}, peak ${formatTemperature(b.peak_C, '—')} at ${formatTime(b.at_s, '—')}` : 'none';
  } else if (r.no_limit) {
    const n = r.no_limit;
    longest = `no limit for any ${time ? 'hold' : 'value'} up to ${showValue(r, r.knob.hi)}: ${n.layer} ${n.settled ? 'settles' : 'is still rising'} at ${formatTemperature(n.settles_C, '—')}, ${formatMargin(n.margin_K, '—')} below its ${n.kind} limit`;
    binding = `none binds; closest: ${n.layer} (${n.kind}), ${formatMargin(n.margin_K, '—')} margin`;
  } else {
    longest = `${most}: none — ${r.longest_reason ?? 'no value keeps the margin'}`;
    binding = r.points.every((p) => p.margin_K === null) ? 'none: no layer has a limit on file' : 'none: no value keeps the margin';
  }
  const shortest = r.shortest
    ? `${least} ${showValue(r, r.shortest.value)} for a fully molten separator (${r.shortest.layer} molten at ${formatTime(r.shortest.molten_at_s, 'never')})`
    : `${least}: none — ${r.shortest_reason ?? ''}`;
  let window = 'usable window: none — no value keeps the margin';
  const w = r.window;
  if (w) {
    const where = `${showValue(r, w.value)} (${w.chosen === 'longest' ? (time ? 'the longest hold' : 'the largest safe value') : w.chosen === 'own' ? "the scenario's own" : 'as asked'})`;
    const p = w.point;
    if (p.window_s === null) window = `usable window ${time ? 'after heat off at' : `with the ${r.knob.label} at`} ${where}: none — ${w.reason ?? ''}`;
    else {
      const parts = [`usable for ${formatTime(p.window_s, '—')} to half-frozen`];
      if (r.until_liquid !== null) parts.push(`${formatTime(p.until_liquid_s, 'beyond the run')} to liquid fraction ${formatNumber(r.until_liquid, { significant: 3 })}`);
      parts.push(`the first cell starts to solidify after ${formatTime(p.solidifying_s, '—')}`);
      window = time ? `after heat off at ${where}: ${parts.join('; ')}`
        : `with the ${r.knob.label} at ${where}, after heat off at ${formatTime(p.heat_off_s, '—')}: ${parts.join('; ')}`;
    }
    if (!w.safe) window += ` — NOT within the ${m} margin there`;
  }
  return {
    longest, shortest, window, binding,
    safeIntervals: r.safe.map((i) => intervalText(r, i)),
    moltenIntervals: r.molten.map((i) => intervalText(r, i)),
    method: `${r.solves} solves: scan every ${showStep(r, r.scan_spacing)} from ${showValue(r, r.knob.lo)} to ${showValue(r, r.knob.hi)}, edges to within ${showStep(r, r.tolerance)}`,
  };
}

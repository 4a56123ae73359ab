/**
 * The one place numbers become text, for the CLI, the CSV, the HTML report and the browser view. Every number passes
 * through `formatNumber`, which refuses non-finite values: the output shows a dash instead, never "NaN" or
 * "Infinity". A quantity with no value (null) is written as words chosen by the caller (sim/observe/wording.ts), never as a
 * number with a unit.
 *
 * Precision (the precision a number deserves, not the solver's):
 *   margins           whole kelvin ("169 K"): the limits themselves are known to a few kelvin at best
 *   event times       0.1 s below 10 min ("84.9 s"), minutes and seconds from 10 min ("15:59 min:s")
 *   CSV and energy    about 6 significant figures
 */

/** What is shown when a value that should be a number is not one. */
export const NO_VALUE = '—';

export const formatDefaults = {
  /** From this duration on, times read as minutes and seconds: a reader counts minutes, not hundreds of seconds. */
  minutesFromS: 600,
  /** Significant figures in CSV and energy figures: well above the solver's accuracy, short enough to read. */
  csvSignificant: 6,
  /** Below this magnitude (and above 1/this) a significant-figures number switches to exponent form. */
  exponentBelow: 1e-3,
  exponentFrom: 1e7,
  /** A relative energy imbalance below this is floating-point round-off (the ledger closes exactly otherwise). */
  roundOffBelow: 1e-12,
} as const;

export interface NumberStyle {
  /** Fixed decimals (default 1). */
  readonly decimals?: number;
  /** Significant digits instead of fixed decimals (switches to exponent form for very small or large values). */
  readonly significant?: number;
}

export function formatNumber(v: unknown, style: NumberStyle = {}): string {
  if (typeof v !== 'number' || !Number.isFinite(v)) return NO_VALUE;
  if (style.significant !== undefined) {
    const a = Math.abs(v);
    if (a !== 0 && (a < formatDefaults.exponentBelow || a >= formatDefaults.exponentFrom)) {
      return v.toExponential(Math.max(style.significant - 1, 0)).replace(/\.?0+e/, 'e');
    }
    // toPrecision writes 679062 with 3 digits as "6.79e+5": round to the digits, then print the plain decimal
    return trimZeros(String(Number(v.toPrecision(style.significant))));
  }
  const text = v.toFixed(style.decimals ?? 1);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

function trimZeros(text: string): string {
  if (!text.includes('.') || text.includes('e')) return text;
  return text.replace(/\.?0+$/, '');
}

/** A time in seconds as plain text (`959.3`), or `never` for a time that does not happen (null). */
export const formatSeconds = (v: number | null): string => (v === null ? 'never' : formatNumber(v, { decimals: 1 }));

/**
 * An event time or a duration with its unit: "84.9 s" below 10 min, "15:59 min:s" from 10 min (rounded to the
 * second), or the words given for null.
 */
export function formatTime(v: number | null, whenNull: string): string {
  if (v === null) return whenNull;
  if (!Number.isFinite(v)) return NO_VALUE;
  const tenths = Math.round(v * 10) / 10;
  if (Math.abs(tenths) < formatDefaults.minutesFromS) return `${formatNumber(tenths, { decimals: 1 })} s`;
  const whole = Math.round(Math.abs(v));
  const sign = v < 0 ? '-' : '';
  return `${sign}${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')} min:s`;
}

/** A margin in whole kelvin with its unit ("169 K"), or the words given for null. */
export function formatMargin(v: number | null, whenNull: string): string {
  if (v === null) return whenNull;
  return Number.isFinite(v) ? `${formatNumber(v, { decimals: 0 })} K` : NO_VALUE;
}

/** A temperature in °C to 0.1 °C with its unit, or the words given for null. */
export function formatTemperature(v: number | null, whenNull: string): string {
  if (v === null) return whenNull;
  return Number.isFinite(v) ? `${formatNumber(v, { decimals: 1 })} °C` : NO_VALUE;
}

/** A number at about 6 significant figures, for energy figures and CSV cells. */
export const formatSignificant = (v: number): string => formatNumber(v, { significant: formatDefaults.csvSignificant });

/** A CSV cell: about 6 significant figures, plain decimal where it fits; empty (never "NaN") for a non-finite value. */
export function csvNumber(v: number): string {
  if (!Number.isFinite(v)) return '';
  return String(Number(v.toPrecision(formatDefaults.csvSignificant)));
}

/** An energy per area, J/m², as kJ/m² at about 6 significant figures with the unit. */
export const formatEnergy = (jPerM2: number): string => `${formatSignificant(jPerM2 / 1e3)} kJ/m²`;

/** The energy ledger's relative imbalance: two figures, or "below 1e-12 (round-off)" where its digits are noise. */
export function formatImbalance(rel: number): string {
  if (!Number.isFinite(rel)) return NO_VALUE;
  return Math.abs(rel) < formatDefaults.roundOffBelow ? `below ${formatDefaults.roundOffBelow.toExponential(0)} (round-off)` : formatNumber(rel, { significant: 2 });
}

/** A value for an input box: the number exactly as stored, a string as typed, empty for anything else. */
export function inputText(v: unknown): string {
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  if (typeof v === 'string') return v;
  return '';
}

/**
 * What the person typed → the JSON value to store. A well-formed finite number becomes a number; empty means the key
 * is absent; anything else is kept as the text typed, so the solver reports it beside the field.
 */
export function parseNumberInput(text: string): number | string | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  if (/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) {
    const v = Number(t);
    if (Number.isFinite(v)) return v;
  }
  return t;
}

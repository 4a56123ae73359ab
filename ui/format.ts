/**
 * The one place numbers become text. Every number shown on the page goes through `formatNumber`, which refuses
 * non-finite values: the page prints a dash instead, never "NaN" or "Infinity".
 */
export const NO_VALUE = '—';

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
    if (a !== 0 && (a < 1e-3 || a >= 1e7)) return v.toExponential(Math.max(style.significant - 1, 0));
    return trimZeros(v.toPrecision(style.significant));
  }
  const text = v.toFixed(style.decimals ?? 1);
  return text === '-0' || /^-0\.0*$/.test(text) ? text.slice(1) : text;
}

function trimZeros(text: string): string {
  if (!text.includes('.') || text.includes('e')) return text;
  return text.replace(/\.?0+$/, '');
}

/** A time in seconds as plain text (`959.3`), or `never` for a time that does not happen (null). */
export const formatSeconds = (v: number | null): string => (v === null ? 'never' : formatNumber(v, { decimals: 1 }));

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

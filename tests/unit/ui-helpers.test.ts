// The browser view's pure helpers, where a slip would break a promise of the view: numbers never shown as NaN, a
// field error finds its input, the share link round-trips any text, and the view's "heater removed at" control
// agrees with the solver's own definition of heat-off (the view reads drafts, so it keeps its own copy of the rule).
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatPath as simFormatPath } from '../../sim/field-errors.ts';
import { parseScenario } from '../../sim/scenario.ts';
import { heatOffTime } from '../../sim/verdict.ts';
import { decodeBase64Url, encodeBase64Url } from '../../ui/base64url.ts';
import { formatNumber, formatSeconds, NO_VALUE, parseNumberInput } from '../../ui/format.ts';
import { heaterOffRow } from '../../ui/heat-off.ts';
import type { Json, JsonObject } from '../../ui/json.ts';
import { getAt, parsePath, setAt } from '../../ui/paths.ts';

describe('ui/format', () => {
  it('formatNumber() prints a dash, never NaN or Infinity, for anything that is not a finite number', () => {
    for (const v of [Number.NaN, Infinity, -Infinity, undefined, null, '12', {}]) expect(formatNumber(v)).toBe(NO_VALUE);
    expect(formatNumber(959.3384)).toBe('959.3');
    expect(formatNumber(-0.01)).toBe('0.0');
  });

  it('formatSeconds() writes "never" for an event that does not happen', () => {
    expect(formatSeconds(null)).toBe('never');
    expect(formatSeconds(84.94)).toBe('84.9');
  });

  it('parseNumberInput() keeps anything that is not a plain finite number as typed, so the solver can name it', () => {
    expect(parseNumberInput(' 1.5 ')).toBe(1.5);
    expect(parseNumberInput('-2e3')).toBe(-2000);
    expect(parseNumberInput('')).toBeUndefined();
    expect(parseNumberInput('1e400')).toBe('1e400');
    expect(parseNumberInput('thick')).toBe('thick');
  });
});

describe('ui/paths', () => {
  it('parsePath() reads the paths the solver writes in its field errors', () => {
    const parts = ['layers', 1, 'thickness_mm'] as const;
    expect(parsePath(simFormatPath(parts))).toEqual(parts);
    expect(parsePath(simFormatPath(['bottom', 0, 'plate', 'temperature_C']))).toEqual(['bottom', 0, 'plate', 'temperature_C']);
  });

  it('setAt() and getAt() write and read the draft at a path, and never touch prototypes', () => {
    const draft: JsonObject = { layers: [{ id: 'a' }] };
    setAt(draft, 'layers[0].thickness_mm', 2);
    expect(getAt(draft, 'layers[0].thickness_mm')).toBe(2);
    expect(getAt(draft, 'layers[0].constructor')).toBeUndefined();
    expect(getAt(draft, '__proto__')).toBeUndefined();
  });
});

describe('ui/base64url', () => {
  it('round-trips UTF-8 text (RFC 4648 §5 alphabet, no padding) and refuses what is not base64url', () => {
    const text = JSON.stringify({ name: 'LiCl–KCl at 352 °C, ε = 0.3', n: [1, 2, 3] });
    const code = encodeBase64Url(text);
    expect(code).toMatch(/^[A-Za-z0-9_-]*$/);
    expect(decodeBase64Url(code)).toBe(text);
    expect(decodeBase64Url('%%%')).toBeUndefined();
  });
});

describe('ui/heat-off', () => {
  const dir = new URL('../../examples/', import.meta.url);
  it.each(readdirSync(dir).filter((f) => f.endsWith('.json')))('heaterOffRow() on %s points at the row where the solver says the heat goes off', (file) => {
    const json = JSON.parse(readFileSync(new URL(file, dir), 'utf8')) as JsonObject;
    const parsed = parseScenario(json);
    if (!parsed.ok) throw new Error('example invalid');
    const row = heaterOffRow(json.bottom as Json);
    expect(row).toBeDefined();
    const rows = json.bottom as JsonObject[];
    expect(rows[row!]!.from_s).toBe(heatOffTime(parsed.problem));
  });
});

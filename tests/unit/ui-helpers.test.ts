// The browser view's pure helpers, where a slip would break a promise of the view: numbers never shown as NaN, a
// field error finds its input, the share link round-trips any text, and the view's "heater removed at" control
// agrees with the solver's own definition of heat-off (the view reads the draft through the core's rule, ui/heat-off.ts).
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatPath as simFormatPath } from '../../sim/scenario/field-errors.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { heatOffTime } from '../../sim/observe/verdict.ts';
import { decodeBase64Url, encodeBase64Url } from '../../ui/base64url.ts';
import { formatNumber, formatSeconds, NO_VALUE, parseNumberInput } from '../../ui/format.ts';
import { heaterOffRow } from '../../ui/heat-off.ts';
import { cautionDefaults, scenarioCautions } from '../../ui/cautions.ts';
import { layerColours } from '../../ui/colours.ts';
import { fieldsToFill } from '../../ui/incomplete.ts';
import { footprintAreaM2, shownIn, toWPerM3, unitUnavailable } from '../../ui/source-units.ts';
import { timeAxis, xOf } from '../../ui/time-axis.ts';
import { formatDefaults } from '../../sim/observe/format.ts';
import type { Summary } from '../../sim/observe/verdict.ts';
import fc from 'fast-check';
import { assertClose } from '../support/assert-close.ts';
import type { JsonObject } from '../../ui/json.ts';
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
    const row = heaterOffRow(json);
    expect(row).toBeDefined();
    const rows = json.bottom as JsonObject[];
    expect(rows[row!]!.from_s).toBe(heatOffTime(parsed.problem));
  });

  it('heaterOffRow() still finds the row in a refused draft (a thickness typed as text, then rows out of time order)', () => {
    const draft = JSON.parse(readFileSync(new URL('bench-coupon.json', dir), 'utf8')) as JsonObject;
    ((draft.layers as JsonObject[])[0]!).thickness_mm = 'abc';
    expect(parseScenario(draft).ok).toBe(false);
    const rows = draft.bottom as JsonObject[];
    // the example heats from the bottom with a plate, then rests in air (its own description)
    expect(rows[0]!.plate).toBeDefined();
    expect(heaterOffRow(draft)).toBe(1);
    // "heat off at" typed as 0 puts the row before the plate's start: the control must still point at it
    rows[1]!.from_s = 0;
    expect(heaterOffRow(draft)).toBe(1);
  });

  it('heaterOffRow() counts heater power and flux as one net flux, as the solver does', () => {
    // 0.1 W over a 25 mm disc is 0.1 / (π·0.025²/4) = 203.7 W/m² (plane geometry), less than the 1000 W/m² drawn off:
    // the row is a net loss, so the heating ends at the row before it
    const draft = JSON.parse(readFileSync(new URL('bench-coupon.json', dir), 'utf8')) as JsonObject;
    draft.footprint = { diameter_mm: 25 };
    draft.bottom = [{ from_s: 0, power_W: 5 }, { from_s: 100, power_W: 0.1, flux_W_m2: -1000 }, { from_s: 200, emissivity: 0.3 }];
    expect(heaterOffRow(draft)).toBe(1);
    (draft.bottom[1] as JsonObject).flux_W_m2 = -100;
    expect(heaterOffRow(draft)).toBe(2);
  });
});

describe('ui/source-units', () => {
  const disc = { footprint: { diameter_mm: 25 } } as JsonObject;
  it('footprintAreaM2() is π d²/4 for a disc and w × l for a rectangle (plane geometry), undefined without a footprint', () => {
    // rel 1e-15: the same closed form evaluated in another order, only round-off differs
    assertClose(footprintAreaM2(disc)!, (Math.PI * 0.025 * 0.025) / 4, { rel: 1e-15 });
    assertClose(footprintAreaM2({ footprint: { width_mm: 30, length_mm: 20 } })!, 0.03 * 0.02, { rel: 1e-15 });
    expect(footprintAreaM2({})).toBeUndefined();
    expect(footprintAreaM2({ footprint: { diameter_mm: -1 } })).toBeUndefined();
  });

  it('toWPerM3() turns watts over the footprint into W/m³ by the layer volume A·t, and W/kg by the density', () => {
    const c = { areaM2: 1e-3, thicknessMm: 2, material: { rho: 1740 } };
    // 1 W in a layer of 1e-3 m² × 2e-3 m = 2e-6 m³ is 5e5 W/m³; 1 W/kg of a 1740 kg/m³ metal is 1740 W/m³
    assertClose(toWPerM3('W', c)!, 5e5, { rel: 1e-15 });
    assertClose(toWPerM3('W/kg', c)!, 1740, { rel: 0 });
    expect(toWPerM3('W/m³', c)).toBe(1);
    expect(toWPerM3('W', { ...c, areaM2: undefined })).toBeUndefined();
    expect(unitUnavailable('W', { ...c, areaM2: undefined })).toMatch(/footprint/);
    expect(toWPerM3('W/kg', { ...c, material: { rho: [[20, 1740]] } })).toBeUndefined();
  });

  it('shownIn() reads a stored W/m³ back in the unit it was typed in', () => {
    const c = { areaM2: (Math.PI * 0.025 ** 2) / 4, thicknessMm: 1.5, material: { rho: 1648 } };
    for (const typed of [0.5, 3, 12.25]) expect(shownIn('W', typed * toWPerM3('W', c)!, c)).toBe(String(typed));
  });
});

describe('ui/incomplete', () => {
  it('fieldsToFill() lists the empty required fields of a heat-source row, and the solver refuses exactly those', () => {
    const draft = JSON.parse(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8')) as JsonObject;
    ((draft.layers as JsonObject[])[1]!).source_W_m3 = [{ from_s: 0 }];
    const toFill = fieldsToFill(draft);
    expect(toFill).toEqual(['layers[1].source_W_m3[0].value', 'layers[1].source_W_m3[0].to_s']);
    const parsed = parseScenario(draft);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.errors.map((e) => e.path).sort()).toEqual([...toFill].sort());
  });

  it('fieldsToFill() leaves a value that is there but wrong to the solver', () => {
    expect(fieldsToFill({ layers: [{ source_W_m3: [{ from_s: 0, to_s: 5, value: 'abc' }] }] })).toEqual([]);
  });
});

describe('ui/colours', () => {
  it('layerColours() gives distinct colours to up to 8 ids, and the same colours whatever their order in the stack', () => {
    fc.assert(fc.property(fc.uniqueArray(fc.string({ minLength: 1, maxLength: 12 }), { minLength: 1, maxLength: 8 }), (ids) => {
      const a = layerColours(ids);
      const b = layerColours([...ids].reverse());
      expect(new Set(a.values()).size).toBe(ids.length);
      for (const id of ids) expect(b.get(id)).toBe(a.get(id));
    }));
  });
});

describe('ui/cautions', () => {
  const summary = (peakC: number, marginK: number | null): Summary => ({
    heat_off_s: 900, separator: { molten_at_s: 80, half_frozen_at_s: 960, frozen_at_s: 980 },
    layers: { anode: { peak_C: peakC, peak_at_s: 900, limit: marginK === null ? null : { kind: 'ignition', at_C: peakC + marginK }, margin_K: marginK, limits: [] } },
    safe_window_s: 60, safe_window_status: 'ok', binding_layer: 'anode', energy: { in_J_m2: 0, out_J_m2: 0, stored_J_m2: 0, imbalance_rel: 0 },
  });
  const mg = { name: 'magnesium', title: 'Magnesium, pure' };
  it('scenarioCautions() notes a magnesium layer at or below the thin threshold, not a thicker one', () => {
    const at = (mm: number) => scenarioCautions([{ id: 'anode', thicknessMm: mm, material: mg }], summary(393, 257)).map((c) => c.kind);
    expect(at(cautionDefaults.thinMagnesiumMm)).toEqual(['thin-magnesium']);
    expect(at(cautionDefaults.thinMagnesiumMm * 2)).toEqual([]);
    expect(scenarioCautions([{ id: 'a', thicknessMm: 0.2, material: { name: 'nickel', title: 'Nickel' } }], summary(393, 257))).toEqual([]);
  });

  it('scenarioCautions() flags a margin at or below the no-margin threshold, and not a reached limit (the verdict says that)', () => {
    const kinds = (m: number) => scenarioCautions([{ id: 'anode', thicknessMm: 5, material: mg }], summary(600, m)).map((c) => c.kind);
    expect(kinds(cautionDefaults.noMarginK)).toEqual(['no-margin']);
    expect(kinds(cautionDefaults.noMarginK + 1)).toEqual([]);
    expect(kinds(0)).toEqual([]);
  });
});

describe('ui/time-axis', () => {
  it('timeAxis() reads minutes from the duration at which event times switch to min:s (sim/observe/format.ts)', () => {
    expect(timeAxis(formatDefaults.minutesFromS - 1).unit).toBe('s');
    const a = timeAxis(3600);
    expect(a.unit).toBe('min');
    expect(xOf(a, 900)).toBe(15);
    expect(xOf(timeAxis(100, 900, 'heat off'), 955)).toBe(55);
  });
});

// Bad input is refused by parseScenario()/parseScenarioText() before any computation, with an error whose path names
// the field and whose message shows the offending value (DESIGN.md, "Bad input"; CONVENTIONS.md: errors name the
// field and the value, e.g. `layers[1].thickness_mm: must be > 0, got -1.5`). One case per row.

import { describe, expect, it } from 'vitest';
import { parseScenario, parseScenarioText } from '../../sim/scenario/scenario.ts';
import type { FieldError } from '../../sim/scenario/scenario.ts';
import { PLAIN, scenario } from '../support/scenarios.ts';

type Json = Record<string, unknown>;

/** A valid scenario: three layers, a contact, a heater schedule, probes and output times. */
function valid(): Json {
  return structuredClone(scenario({
    duration_s: 3600, ambient_C: 22, initial_C: 22,
    footprint: { diameter_mm: 25 },
    materials: {
      metal: PLAIN,
      salt: { ...PLAIN, melt: { solidus_C: 350, liquidus_C: 354, latent_J_kg: 2e5 }, limits: [{ kind: 'service', at_C: 600 }] },
    },
    layers: [
      { id: 'L0', material: 'metal', thickness_mm: 1 },
      { id: 'L1', material: 'salt', thickness_mm: 1.5, separator: true },
      { id: 'L2', material: 'metal', thickness_mm: 2, source_W_m3: [{ from_s: 0, to_s: 5, value: 1e5 }] },
    ],
    contacts: [{ below: 'L0', above: 'L1', resistance_m2K_W: 1e-4 }],
    bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 900, convection_W_m2K: 6, emissivity: 0.4 }],
    top: [{ from_s: 0, convection_W_m2K: 12, emissivity: 0.3 }],
    output: { times_s: [600, 900], probes_mm: [0, 1, 4.5] },
  })) as Json;
}

/**
 * The valid scenario with the value at a dotted path (with [i] indices, e.g. "layers[1].thickness_mm") set, or
 * deleted with `undefined`; more [path, value] pairs may follow.
 */
function edit(path: string, value: unknown, ...more: [string, unknown][]): Json {
  const root = valid();
  for (const [p, val] of [[path, value] as [string, unknown], ...more]) {
    const keys = p.replace(/\[(\d+)\]/g, '.$1').split('.');
    let node = root as Record<string, unknown>;
    for (const k of keys.slice(0, -1)) node = node[k] as Record<string, unknown>;
    const lastKey = keys[keys.length - 1]!;
    if (val === undefined) delete node[lastKey];
    else Object.defineProperty(node, lastKey, { value: val, enumerable: true, writable: true, configurable: true });
  }
  return root;
}

interface Case {
  /** What is wrong. */
  readonly what: string;
  /** The input: a parsed value, or JSON text. */
  readonly input: { value: unknown } | { text: string };
  /** The path the error must name, exactly. */
  readonly path: string;
  /** A piece of the message that shows the offending value. */
  readonly shows: string;
}

const v = (value: unknown) => ({ value });
const text = (t: string) => ({ text: t });

const cases: Case[] = [
  { what: 'a negative thickness', input: v(edit('layers[1].thickness_mm', -1.5)), path: 'layers[1].thickness_mm', shows: '-1.5' },
  { what: 'a zero thickness', input: v(edit('layers[1].thickness_mm', 0)), path: 'layers[1].thickness_mm', shows: 'got 0' },
  { what: 'a missing thickness', input: v(edit('layers[1].thickness_mm', undefined)), path: 'layers[1].thickness_mm', shows: 'required' },
  { what: 'a non-numeric thickness', input: v(edit('layers[1].thickness_mm', 'thick')), path: 'layers[1].thickness_mm', shows: '"thick"' },
  { what: 'a misspelt key in a layer', input: v(edit('layers[0].thicknes_mm', 1)), path: 'layers[0].thicknes_mm', shows: 'thickness_mm' },
  { what: 'a misspelt top-level key', input: v(edit('ambiant_C', 22)), path: 'ambiant_C', shows: 'ambient_C' },
  { what: 'an unknown material', input: v(edit('layers[0].material', 'unobtainium')), path: 'layers[0].material', shows: '"unobtainium"' },
  { what: 'a material name that is a path', input: v(edit('layers[0].material', '../x')), path: 'layers[0].material', shows: '"../x"' },
  { what: 'a material named __proto__', input: v(edit('layers[0].material', '__proto__')), path: 'layers[0].material', shows: '"__proto__"' },
  {
    what: 'an inline material named __proto__ (in text)',
    input: text(JSON.stringify(valid()).replace('"materials":{', '"materials":{"__proto__":{"k_W_mK":1,"rho_kg_m3":1,"cp_J_kgK":1},')),
    path: 'materials.__proto__', shows: '"__proto__"',
  },
  { what: 'a zero conductivity', input: v(edit('materials.metal.k_W_mK', 0)), path: 'materials.metal.k_W_mK', shows: 'got 0' },
  { what: 'a negative conductivity', input: v(edit('materials.metal.k_W_mK', -1)), path: 'materials.metal.k_W_mK', shows: '-1' },
  { what: 'a negative density', input: v(edit('materials.metal.rho_kg_m3', -2000)), path: 'materials.metal.rho_kg_m3', shows: '-2000' },
  { what: 'a zero density', input: v(edit('materials.metal.rho_kg_m3', 0)), path: 'materials.metal.rho_kg_m3', shows: 'got 0' },
  { what: 'a zero specific heat', input: v(edit('materials.metal.cp_J_kgK', 0)), path: 'materials.metal.cp_J_kgK', shows: 'got 0' },
  { what: 'a negative value in a cp table', input: v(edit('materials.metal.cp_J_kgK', [[0, 1000], [100, -5]])), path: 'materials.metal.cp_J_kgK[1][1]', shows: '-5' },
  { what: 'an unsorted table', input: v(edit('materials.metal.k_W_mK', [[100, 1], [50, 2]])), path: 'materials.metal.k_W_mK[1][0]', shows: '50' },
  { what: 'a table with a repeated temperature', input: v(edit('materials.metal.cp_J_kgK', [[100, 900], [100, 1000]])), path: 'materials.metal.cp_J_kgK[1][0]', shows: '100' },
  { what: 'an empty table', input: v(edit('materials.metal.cp_J_kgK', [])), path: 'materials.metal.cp_J_kgK', shows: '0 entries' },
  { what: 'a solidus above the liquidus', input: v(edit('materials.salt.melt.solidus_C', 360)), path: 'materials.salt.melt.solidus_C', shows: '360' },
  { what: 'a negative latent heat', input: v(edit('materials.salt.melt.latent_J_kg', -1)), path: 'materials.salt.melt.latent_J_kg', shows: '-1' },
  { what: 'an unknown limit kind', input: v(edit('materials.salt.limits[0].kind', 'explosion')), path: 'materials.salt.limits[0].kind', shows: '"explosion"' },
  { what: 'an emissivity above 1', input: v(edit('top[0].emissivity', 1.2)), path: 'top[0].emissivity', shows: '1.2' },
  { what: 'a negative emissivity', input: v(edit('bottom[1].emissivity', -0.1)), path: 'bottom[1].emissivity', shows: '-0.1' },
  { what: 'face segments out of time order', input: v(edit('bottom[1].from_s', 0)), path: 'bottom[1].from_s', shows: 'got 0' },
  { what: 'a negative segment time', input: v(edit('bottom[0].from_s', -5)), path: 'bottom[0].from_s', shows: '-5' },
  { what: 'fixed_C together with other terms', input: v(edit('top[0].fixed_C', 100)), path: 'top[0].fixed_C', shows: 'convection_W_m2K' },
  { what: 'a contact naming an unknown layer', input: v(edit('contacts[0].above', 'nowhere')), path: 'contacts[0].above', shows: '"nowhere"' },
  { what: 'a contact between layers that do not touch', input: v(edit('contacts[0].above', 'L2')), path: 'contacts[0].above', shows: '"L2"' },
  { what: 'a negative contact resistance', input: v(edit('contacts[0].resistance_m2K_W', -1e-4)), path: 'contacts[0].resistance_m2K_W', shows: '-0.0001' },
  { what: 'a negative plate conductance', input: v(edit('bottom[0].plate.conductance_W_m2K', -500)), path: 'bottom[0].plate.conductance_W_m2K', shows: '-500' },
  { what: 'a negative convection coefficient', input: v(edit('top[0].convection_W_m2K', -12)), path: 'top[0].convection_W_m2K', shows: '-12' },
  { what: 'a zero duration', input: v(edit('duration_s', 0)), path: 'duration_s', shows: 'got 0' },
  { what: 'a negative duration', input: v(edit('duration_s', -10)), path: 'duration_s', shows: '-10' },
  { what: 'an empty stack', input: v(edit('layers', [])), path: 'layers', shows: '0 entries' },
  { what: 'a duplicate layer id', input: v(edit('layers[2].id', 'L0')), path: 'layers[2].id', shows: '"L0"' },
  { what: 'an empty layer id', input: v(edit('layers[0].id', '')), path: 'layers[0].id', shows: '""' },
  { what: 'a probe above the stack', input: v(edit('output.probes_mm[2]', 99)), path: 'output.probes_mm[2]', shows: '99' },
  { what: 'a probe below the stack', input: v(edit('output.probes_mm[0]', -1)), path: 'output.probes_mm[0]', shows: '-1' },
  { what: 'an output time after the end', input: v(edit('output.times_s[1]', 4000)), path: 'output.times_s[1]', shows: '4000' },
  { what: 'a negative output time', input: v(edit('output.times_s[0]', -1)), path: 'output.times_s[0]', shows: '-1' },
  { what: 'an initial temperature below absolute zero', input: v(edit('initial_C', -300)), path: 'initial_C', shows: '-300' },
  { what: 'a plate temperature below absolute zero', input: v(edit('bottom[0].plate.temperature_C', -274)), path: 'bottom[0].plate.temperature_C', shows: '-274' },
  {
    what: 'a source ending before it starts',
    input: v(edit('layers[2].source_W_m3[0].from_s', 4, ['layers[2].source_W_m3[0].to_s', 2])),
    path: 'layers[2].source_W_m3[0].to_s', shows: 'got 2',
  },
  { what: 'a number written as a string', input: v(edit('duration_s', '3600')), path: 'duration_s', shows: '"3600"' },
  { what: 'a number too large for a double (1e400, in text)', input: text(JSON.stringify(valid()).replace('"thickness_mm":1.5', '"thickness_mm":1e400')), path: 'layers[1].thickness_mm', shows: 'Infinity' },
  { what: 'a file that is not JSON', input: text('{ "freezeline": 1, '), path: '(file)', shows: 'not valid JSON' },
  { what: 'an empty file', input: text('  \n'), path: '(file)', shows: 'empty' },
  { what: 'a file holding a list', input: text('[1, 2]'), path: '(file)', shows: 'an array' },
  { what: 'a file holding a number', input: text('42'), path: '(file)', shows: 'number' },
  { what: 'a file holding null', input: text('null'), path: '(file)', shows: 'null' },
  { what: 'an unknown format version', input: v(edit('freezeline', 2)), path: 'freezeline', shows: '2' },
];

function parse(input: Case['input']) {
  return 'text' in input ? parseScenarioText(input.text) : parseScenario(input.value);
}

describe('scenario errors', () => {
  it('parseScenario() accepts the valid base scenario the cases below break', () => {
    expect(parseScenario(valid()).ok).toBe(true);
  });

  it.each(cases.map((c) => [c.what, c] as const))('parseScenario() refuses %s, naming the field and the value', (_what, c) => {
    const prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();
    const result = parse(c.input);
    expect(result.ok).toBe(false);
    const errors: readonly FieldError[] = result.ok ? [] : result.errors;
    const named = errors.filter((e) => e.path === c.path);
    expect(named, `errors: ${JSON.stringify(errors)}`).not.toHaveLength(0);
    expect(named.some((e) => e.message.includes(c.shows)), `errors at ${c.path}: ${JSON.stringify(named)}`).toBe(true);
    // no input, however named, reaches Object.prototype
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
    expect(({} as Record<string, unknown>).k_W_mK).toBeUndefined();
  });
});

// Messages for people (issue 7, "Messages for people"): a value of the wrong kind reads
// `expected a number in mm, got the text "abc"`, with the unit read off the key's suffix and written with the SI
// Brochure's symbols (BIPM, The International System of Units, 9th ed. 2019, §5.4.3 and Table 4 for °C); an unknown
// material names the nearest known one and lists every name the scenario could use.

import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { capErrors, clip, unitOfPath } from '../../sim/scenario/field-errors.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { PLAIN, scenario } from '../support/scenarios.ts';

type Json = Record<string, unknown>;

function base(): Json {
  return structuredClone(scenario({
    duration_s: 100, materials: { metal: PLAIN }, footprint: { diameter_mm: 20 },
    layers: [{ id: 'a', material: 'metal', thickness_mm: 1 }, { id: 'b', material: 'metal', thickness_mm: 1 }],
  })) as Json;
}

function messageAt(s: Json, path: string): string {
  const result = parseScenario(s);
  expect(result.ok).toBe(false);
  const found = result.ok ? undefined : result.errors.find((e) => e.path === path);
  expect(found, JSON.stringify(result)).toBeDefined();
  return found!.message;
}

const layer = (s: Json, i: number) => (s.layers as Json[])[i]!;

describe('messages for people', () => {
  it('parseScenario() says "expected a number in mm, got the text "abc"" for a thickness given as text', () => {
    const s = base();
    layer(s, 0).thickness_mm = 'abc';
    expect(messageAt(s, 'layers[0].thickness_mm')).toBe('expected a number in mm, got the text "abc"');
  });

  it('parseScenario() gives the unit of the key in the message for °C, s, W/(m²·K), m²·K/W and W/m³', () => {
    const s = base();
    s.ambient_C = 'warm';
    s.bottom = [{ from_s: 'soon', convection_W_m2K: 5 }];
    s.top = [{ from_s: 0, plate: { temperature_C: 400, conductance_W_m2K: 'high' } }];
    s.contacts = [{ below: 'a', above: 'b', resistance_m2K_W: 'some' }];
    layer(s, 1).source_W_m3 = [{ from_s: 0, to_s: 5, value: 'lots' }];
    expect(messageAt(s, 'ambient_C')).toBe('expected a number in °C, got the text "warm"');
    expect(messageAt(s, 'bottom[0].from_s')).toBe('expected a number in s, got the text "soon"');
    expect(messageAt(s, 'top[0].plate.conductance_W_m2K')).toBe('expected a number in W/(m²·K), got the text "high"');
    expect(messageAt(s, 'contacts[0].resistance_m2K_W')).toBe('expected a number in m²·K/W, got the text "some"');
    expect(messageAt(s, 'layers[1].source_W_m3[0].value')).toBe('expected a number in W/m³, got the text "lots"');
  });

  it('parseScenario() points into a property table: a temperature column in °C, a value column in the key\'s unit', () => {
    const s = base();
    (s.materials as Json).metal = { ...PLAIN, k_W_mK: [[20, 1], ['hot', 2]], cp_J_kgK: [[20, 'x']] };
    expect(messageAt(s, 'materials.metal.k_W_mK[1][0]')).toBe('expected a number in °C, got the text "hot"');
    expect(messageAt(s, 'materials.metal.cp_J_kgK[0][1]')).toBe('expected a number in J/(kg·K), got the text "x"');
  });

  it('parseScenario() writes °C beside the temperatures of an unsorted table and a solidus above its liquidus', () => {
    const s = base();
    (s.materials as Json).metal = { ...PLAIN, k_W_mK: [[100, 1], [50, 2]], melt: { solidus_C: 360, liquidus_C: 354, latent_J_kg: 1 } };
    expect(messageAt(s, 'materials.metal.k_W_mK[1][0]')).toBe('temperatures must increase strictly, got 50 °C after 100 °C');
    expect(messageAt(s, 'materials.metal.melt.solidus_C')).toBe('must be ≤ liquidus_C (354 °C), got 360 °C');
  });

  it('unitOfPath() reads every unit suffix of the format, longest first (m²·K/W is not read as W)', () => {
    const cases: [PropertyKey[], string | undefined][] = [
      [['layers', 0, 'thickness_mm'], 'mm'],
      [['materials', 'm', 'rho_kg_m3'], 'kg/m³'],
      [['materials', 'm', 'melt', 'latent_J_kg'], 'J/kg'],
      [['bottom', 0, 'flux_W_m2'], 'W/m²'],
      [['bottom', 0, 'power_W'], 'W'],
      [['contacts', 0, 'resistance_m2K_W'], 'm²·K/W'],
      [['numerics', 'tolerance_K'], 'K'],
      [['output', 'times_s', 3], 's'],
      [['top', 0, 'emissivity'], undefined],
    ];
    for (const [path, unit] of cases) expect(unitOfPath(path), path.join('.')).toBe(unit);
  });

  it('parseScenario() names the nearest material to a misspelt one and lists the library as it is on disk', () => {
    const s = base();
    layer(s, 1).material = 'nickle';
    const message = messageAt(s, 'layers[1].material');
    expect(message).toContain('did you mean "nickel"?');
    expect(message).toContain("this file's materials: metal");
    const onDisk = readdirSync(new URL('../../materials/', import.meta.url)).filter((f) => f.endsWith('.json')).map((f) => f.slice(0, -5));
    for (const name of onDisk) expect(message).toContain(name);
    expect(message.endsWith('got "nickle"')).toBe(true);
  });

  it('parseScenario() names the nearest layer to a misspelt id in a contact and lists the layers', () => {
    const s = base();
    s.contacts = [{ below: 'A', above: 'bb', resistance_m2K_W: 1e-4 }];
    expect(messageAt(s, 'contacts[0].below')).toBe('unknown layer id (did you mean "a"?); the layers, bottom to top: "a", "b"; got "A"');
    expect(messageAt(s, 'contacts[0].above')).toContain('did you mean "b"?');
  });

  it('parseScenario() suggests nothing for a name unlike any material', () => {
    const s = base();
    layer(s, 1).material = 'unobtainium';
    expect(messageAt(s, 'layers[1].material')).not.toContain('did you mean');
  });

  it('capErrors() keeps 20 errors and counts the rest; clip() cuts a long text and states its length', () => {
    const many = Array.from({ length: 25 }, (_, i) => ({ path: `p${i}`, message: 'm' }));
    const capped = capErrors(many);
    expect(capped).toHaveLength(21);
    expect(capped[20]!.message).toBe('and 5 more errors (only the first 20 are listed)');
    expect(capErrors(many.slice(0, 20))).toHaveLength(20);
    expect(clip('y'.repeat(1000))).toBe(`${'y'.repeat(60)}… (1000 characters)`);
  });
});

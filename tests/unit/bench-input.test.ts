// The scenario's bench key (sim/scenario/bench-input.ts): accepted as written, refused with a message that names the
// field and the value. The expected properties are the inline material's own numbers and the library file's
// (materials/ceramic-tile.json: k 1.0 W/(m·K), ρ 2000 kg/m³, c_p 850 J/(kg·K)).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { coefficientTrace } from '../../sim/observe/coefficients.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';
import { scenario, toK } from '../support/scenarios.ts';

const file = (segment: Record<string, unknown>, duration = 600) => ({
  ...scenario({
    duration_s: duration, ambient_C: 22, initial_C: 300,
    materials: { slab: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1000 }, stone: { k_W_mK: 2, rho_kg_m3: 2500, cp_J_kgK: 800 } },
    layers: [{ id: 'slab', material: 'slab', thickness_mm: 2 }],
  }),
  bottom: [{ from_s: 0, convection_W_m2K: 10 }, { from_s: 100, ...segment }],
});

function errorsOf(value: unknown): string[] {
  const parsed = parseScenario(value);
  return parsed.ok ? [] : parsed.errors.map((e) => `${e.path}: ${e.message}`);
}

describe('scenario bench key', () => {
  it('parseScenario() builds a bench face from a library material, at ambient, in perfect contact by default', () => {
    const parsed = parseScenario(file({ bench: { material: 'ceramic-tile' } }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const c = parsed.problem.bottom[1]!.condition;
    if (c.kind !== 'bench') throw new Error(`expected a bench, got ${c.kind}`);
    // the library file's numbers (materials/ceramic-tile.json); exact up to round-off
    assertClose(c.bench.conductivityWPerMK, 1.0, { rel: 1e-12 }, 'k');
    assertClose(c.bench.capacityJPerM3K, 2000 * 850, { rel: 1e-12 }, 'ρc');
    assertClose(c.bench.startK, toK(22), { rel: 1e-12 }, 'start');
    expect(c.bench.contactWPerM2K).toBeUndefined();
  });

  it('parseScenario() takes the contact conductance and the starting temperature as given', () => {
    const parsed = parseScenario(file({ bench: { material: 'stone', contact_W_m2K: 500, start_C: 40 } }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const c = parsed.problem.bottom[1]!.condition;
    if (c.kind !== 'bench') throw new Error(`expected a bench, got ${c.kind}`);
    expect(c.bench.contactWPerM2K).toBe(500);
    assertClose(c.bench.startK, toK(40), { rel: 1e-12 }, 'start');
    assertClose(c.bench.capacityJPerM3K, 2500 * 800, { rel: 1e-12 }, 'ρc');
  });

  it('parseScenario() takes a bench thickness in mm, and refuses one ≤ 0 naming the field and the value', () => {
    const parsed = parseScenario(file({ bench: { material: 'stone', thickness_mm: 12 } }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const c = parsed.problem.bottom[1]!.condition;
    if (c.kind !== 'bench') throw new Error(`expected a bench, got ${c.kind}`);
    assertClose(c.bench.thicknessM!, 0.012, { rel: 1e-12 }, 'thickness, m');
    expect(errorsOf(file({ bench: { material: 'stone', thickness_mm: 0 } }))).toContain('bottom[1].bench.thickness_mm: must be > 0, got 0');
  });

  it('parseScenario() refuses a bench beside another face term, naming both', () => {
    expect(errorsOf(file({ bench: { material: 'stone' }, emissivity: 0.5 })))
      .toContain('bottom[1].bench: a face on a bench takes no other term, got also emissivity');
  });

  it('parseScenario() refuses an unknown bench material by name', () => {
    expect(errorsOf(file({ bench: { material: 'marble-slab' } })).join('\n')).toMatch(/bottom\[1\]\.bench\.material: .*marble-slab/);
  });

  it('parseScenario() refuses a zero or negative contact conductance, naming the field and the value', () => {
    expect(errorsOf(file({ bench: { material: 'stone', contact_W_m2K: 0 } }))).toContain('bottom[1].bench.contact_W_m2K: must be > 0, got 0');
    expect(errorsOf(file({ bench: { material: 'stone', contact_W_m2K: -5 } }))).toContain('bottom[1].bench.contact_W_m2K: must be > 0, got -5');
  });

  it('parseScenario() refuses a misspelt bench key and a bench that melts at the temperatures the file names', () => {
    expect(errorsOf(file({ bench: { material: 'stone', contact_W_mK: 500 } })).join('\n')).toMatch(/bottom\[1\]\.bench\.contact_W_mK: unknown key \(did you mean "contact_W_m2K"\?\)/);
    // magnesium's solidus (about 650 °C, materials/magnesium.json) is below a 700 °C bench start
    expect(errorsOf(file({ bench: { material: 'magnesium', start_C: 700 } })).join('\n'))
      .toMatch(/bottom\[1\]\.bench\.material: the bench is modelled without melting, and "magnesium" melts from/);
  });

  it('parseScenario() refuses a bench segment that starts at the end of the run', () => {
    const f = { ...file({}), bottom: [{ from_s: 600, bench: { material: 'stone' } }] };
    expect(errorsOf(f)).toContain('bottom[0].from_s: a bench segment must start before the end of the run (duration_s 600), got 600');
  });

  it('coefficientTrace() lists the bench with the source texts of its material file', () => {
    const parsed = parseScenario(file({ bench: { material: 'ceramic-tile' } }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const lines = coefficientTrace(parsed.problem).filter((c) => c.what.startsWith('bottom face from 100 s: bench'));
    // the sources as written in the library file on disk, not as the code holds them
    const onDisk = JSON.parse(readFileSync(new URL('../../materials/ceramic-tile.json', import.meta.url), 'utf8')) as { sources: Record<string, string> };
    const props = lines.find((c) => c.what.includes('bench properties'));
    expect(props?.source).toContain(onDisk.sources['k_W_mK']);
    expect(props?.source).toContain(onDisk.sources['rho_kg_m3']);
    expect(props?.source).toContain(onDisk.sources['cp_J_kgK']);
    expect(lines.find((c) => c.what.includes('bench surface'))?.source).toContain('materials/ceramic-tile.json');
    expect(lines.find((c) => c.what.includes('contact'))?.value).toBe('perfect contact');
    // 4·√(α·t) over the 500 s from the segment to the end, α = 1/(2000·850): 68.6 mm (hand computation)
    expect(lines.find((c) => c.what.includes('bench cells'))?.value).toBe(`60 cells graded ×1.1 to ${(4e3 * Math.sqrt(500 / (2000 * 850))).toPrecision(6)} mm deep`);
  });
});

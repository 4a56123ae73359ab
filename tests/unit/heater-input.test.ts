// The scenario's heater key (sim/scenario/heater-input.ts): accepted as written, refused with a message that names the
// field and the value. The expected plate capacity is ρ·c_p·t from the inline material's own numbers.
import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';
import { scenario } from '../support/scenarios.ts';

const heater = (over: Record<string, unknown> = {}) => ({
  power_W: 150, plate: { material: 'steel', thickness_mm: 6 }, contact_W_m2K: 2000,
  control: { kind: 'on-off', set_point_C: 420, band_K: 5, sensor: 'plate' }, ...over,
});

const file = (segment: Record<string, unknown>, footprint = true) => ({
  ...scenario({
    duration_s: 600, materials: { slab: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1000 }, steel: { k_W_mK: 20, rho_kg_m3: 7900, cp_J_kgK: 500 } },
    layers: [{ id: 'slab', material: 'slab', thickness_mm: 2 }],
    ...(footprint ? { footprint: { diameter_mm: 25 } } : {}),
  }),
  bottom: [{ from_s: 0, ...segment }],
});

function errorsOf(value: unknown): string[] {
  const parsed = parseScenario(value);
  return parsed.ok ? [] : parsed.errors.map((e) => `${e.path}: ${e.message}`);
}

describe('scenario heater key', () => {
  it('parseScenario() builds a heater face with the plate capacity ρ·c·t and the power over the footprint', () => {
    const parsed = parseScenario(file({ heater: heater() }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const c = parsed.problem.bottom[0]!.condition;
    expect(c.kind).toBe('heater');
    if (c.kind !== 'heater') return;
    // the inputs' own numbers: 7900 kg/m³ · 500 J/kg·K · 0.006 m; 150 W over π·(0.025 m)²/4; exact up to round-off
    assertClose(c.heater.capacityJPerM2K, 7900 * 500 * 0.006, { rel: 1e-12 }, 'J/m²K');
    assertClose(c.heater.powerWPerM2, 150 / (Math.PI * 0.025 ** 2 / 4), { rel: 1e-12 }, 'W/m²');
    expect(c.heater.control).toEqual({ kind: 'on-off', bandK: 5, sensor: { kind: 'plate' } });
  });

  it('parseScenario() refuses a heater beside another face term, naming both', () => {
    expect(errorsOf(file({ heater: heater(), emissivity: 0.5 }))).toContain('bottom[0].heater: a face on a heater takes no other term, got also emissivity');
  });

  it('parseScenario() refuses a heater without a footprint', () => {
    expect(errorsOf(file({ heater: heater() }, false)).join('\n')).toMatch(/bottom\[0\]\.heater\.power_W: needs the scenario's footprint/);
  });

  it('parseScenario() refuses an unknown plate material by name', () => {
    expect(errorsOf(file({ heater: heater({ plate: { material: 'unobtainium', thickness_mm: 6 } }) })).join('\n'))
      .toMatch(/bottom\[0\]\.heater\.plate\.material: .*unobtainium/);
  });

  it('parseScenario() refuses an on-off heater with no set-point, and one with two', () => {
    expect(errorsOf(file({ heater: heater({ control: { kind: 'on-off', band_K: 5, sensor: 'plate' } }) })).join('\n'))
      .toMatch(/bottom\[0\]\.heater\.control\.set_point_C: an on-off heater needs a set-point/);
    expect(errorsOf(file({ heater: heater({ set_points: [{ at_s: 0, set_point_C: 300 }] }) })).join('\n'))
      .toMatch(/bottom\[0\]\.heater\.control\.set_point_C: give the set-point here or as heater\.set_points, not both/);
  });

  it('parseScenario() refuses a sensor that is neither the plate nor a layer, and set-points out of order', () => {
    expect(errorsOf(file({ heater: heater({ control: { kind: 'on-off', set_point_C: 420, band_K: 5, sensor: 'anode' } }) })).join('\n'))
      .toMatch(/bottom\[0\]\.heater\.control\.sensor: must be "plate" or a layer id \("slab"\), got "anode"/);
    const ramp = { control: { kind: 'on-off', band_K: 5, sensor: 'plate' }, set_points: [{ at_s: 100, set_point_C: 300 }, { at_s: 50, set_point_C: 400 }] };
    expect(errorsOf(file({ heater: heater(ramp) })).join('\n')).toMatch(/bottom\[0\]\.heater\.set_points\[1\]\.at_s: points must be in time order, got 50 after 100/);
  });

  it('parseScenario() refuses a non-positive power and band, naming the field and the value', () => {
    const text = errorsOf(file({ heater: heater({ power_W: -5, control: { kind: 'on-off', set_point_C: 420, band_K: 0, sensor: 'plate' } }) })).join('\n');
    expect(text).toMatch(/bottom\[0\]\.heater\.power_W: must be > 0.*-5/);
    expect(text).toMatch(/bottom\[0\]\.heater\.control\.band_K: must be > 0.*0/);
  });
});

describe('scenario heater key, PI control', () => {
  it('parseScenario() reads a PI control with the default 1 s period, and refuses a period that would need too many samples', () => {
    const parsed = parseScenario(file({ heater: heater({ control: { kind: 'pi', set_point_C: 420, gain_W_K: 5, integral_s: 30, sensor: 'slab' } }) }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const c = parsed.problem.bottom[0]!.condition;
    expect(c.kind === 'heater' && c.heater.control).toEqual({ kind: 'pi', gainWPerK: 5, integralS: 30, periodS: 1, sensor: { kind: 'layer', index: 0, id: 'slab' } });
    // 600 s at 1e-4 s would be 6e6 samples, each a step
    expect(errorsOf(file({ heater: heater({ control: { kind: 'pi', set_point_C: 420, gain_W_K: 5, integral_s: 30, period_s: 1e-4, sensor: 'plate' } }) })).join('\n'))
      .toMatch(/bottom\[0\]\.heater\.control\.period_s: must be ≥ duration_s \/ 100000 .*got 0\.0001/);
  });
});

describe('set-point schedule', () => {
  it('setPointAt() holds before the first point, ramps linearly between points and holds after the last', async () => {
    const { setPointAt } = await import('../../sim/physics/heater.ts');
    const points = [{ atS: 100, tK: 400 }, { atS: 300, tK: 600 }, { atS: 500, tK: 600 }];
    // hand-computed from the points: a ramp of 1 K/s from 100 s to 300 s, then a hold
    expect(setPointAt(points, 0)).toBe(400);
    assertClose(setPointAt(points, 150), 450, { rel: 1e-15 }, 'on the ramp');
    expect(setPointAt(points, 400)).toBe(600);
    expect(setPointAt(points, 900)).toBe(600);
  });
});

/**
 * A face segment's `heater` (scenario-schema.ts) → the heater face condition in SI (physics/heater.ts), with field-named
 * errors. The plate's areal heat capacity is ρ·c_p·t with c_p read at one temperature, the middle of the initial
 * temperature and the highest set-point (the initial temperature for constant power): the plate is one lumped node
 * of constant capacity, so its c_p varies over the run by what the table gives between those temperatures (about
 * 10 % for steel between 20 and 420 °C; that is the model error of this choice).
 */
import type { Material } from '../physics/material.ts';
import { sensibleCapacity } from '../physics/material.ts';
import type { HeaterControl, HeaterSensor, SetPoint } from '../physics/heater.ts';
import type { FaceCondition, Footprint } from '../physics/problem.ts';
import { cToK, mmToM } from '../physics/units.ts';
import type { FieldError } from './field-errors.ts';
import { libraryMaterial, unknownMaterialMessage } from './library.ts';
import type { FaceSegmentFile, HeaterFile, ScenarioFile } from './scenario-schema.ts';

export const heaterInputDefaults = {
  /** PI sampling period when the file gives none, s: a lab controller samples a few times a second to once a second. */
  periodS: 1,
  /** Most PI samples a run may hold: each is a step (a day at 1 s would be 86 400). */
  maxSamples: 100_000,
} as const;

const OTHER_TERMS = ['flux_W_m2', 'power_W', 'convection_W_m2K', 'fluid_C', 'emissivity', 'surroundings_C', 'plate', 'fixed_C'] as const;

const show = (v: unknown): string => JSON.stringify(v);

/** The set-point schedule of an on-off heater, checked: one number in the control, or `set_points` in time order. */
function setPoints(h: HeaterFile, path: string, durationS: number, errors: FieldError[]): SetPoint[] {
  const own = h.control.kind !== 'constant' ? h.control.set_point_C : undefined;
  if (h.control.kind === 'constant') {
    if (h.set_points) errors.push({ path: `${path}.set_points`, message: `a constant-power heater has no set-point; remove it or use "kind": "on-off", got ${show(h.set_points)}` });
    return [];
  }
  if (own !== undefined && h.set_points) {
    errors.push({ path: `${path}.control.set_point_C`, message: `give the set-point here or as heater.set_points, not both, got ${own} and a schedule` });
  }
  if (own !== undefined) return [{ atS: 0, tK: cToK(own) }];
  if (!h.set_points) {
    errors.push({ path: `${path}.control.set_point_C`, message: `an ${h.control.kind} heater needs a set-point: set_point_C here, or a schedule heater.set_points, got neither` });
    return [];
  }
  h.set_points.forEach((p, i) => {
    const prev = h.set_points![i - 1];
    if (prev && !(p.at_s > prev.at_s)) errors.push({ path: `${path}.set_points[${i}].at_s`, message: `points must be in time order, got ${p.at_s} after ${prev.at_s}` });
    if (p.at_s > durationS) errors.push({ path: `${path}.set_points[${i}].at_s`, message: `must be ≤ duration_s (${durationS}), got ${p.at_s}` });
  });
  return h.set_points.map((p) => ({ atS: p.at_s, tK: cToK(p.set_point_C) }));
}

function control(h: HeaterFile, path: string, s: ScenarioFile, errors: FieldError[]): HeaterControl {
  const c = h.control;
  if (c.kind === 'constant') return { kind: 'constant' };
  const index = s.layers.findIndex((l) => l.id === c.sensor);
  if (c.sensor !== 'plate' && index < 0) {
    errors.push({ path: `${path}.control.sensor`, message: `must be "plate" or a layer id (${s.layers.map((l) => show(l.id)).join(', ')}), got ${show(c.sensor)}` });
  }
  const sensor: HeaterSensor = c.sensor === 'plate' ? { kind: 'plate' } : { kind: 'layer', index: Math.max(index, 0), id: c.sensor };
  if (c.kind === 'on-off') return { kind: 'on-off', bandK: c.band_K, sensor };
  const periodS = c.period_s ?? heaterInputDefaults.periodS;
  if (s.duration_s / periodS > heaterInputDefaults.maxSamples) {
    errors.push({ path: `${path}.control.period_s`, message: `must be ≥ duration_s / ${heaterInputDefaults.maxSamples} (${s.duration_s / heaterInputDefaults.maxSamples} s): every sample is a step, got ${periodS}` });
  }
  return { kind: 'pi', gainWPerK: c.gain_W_K, integralS: c.integral_s, periodS, sensor };
}

/** The heater face condition of a segment with a `heater`; errors name the fields. */
export function heaterCondition(seg: FaceSegmentFile, path: string, s: ScenarioFile, footprint: Footprint | undefined,
  materials: ReadonlyMap<string, Material>, errors: FieldError[]): FaceCondition {
  const h = seg.heater!;
  const hp = `${path}.heater`;
  const others = OTHER_TERMS.filter((k) => seg[k] !== undefined);
  if (others.length > 0) errors.push({ path: hp, message: `a face on a heater takes no other term, got also ${others.join(', ')}` });
  if (!footprint) errors.push({ path: `${hp}.power_W`, message: `needs the scenario's footprint (the plate's area), got ${h.power_W} without one` });
  const name = h.plate.material;
  const material = materials.get(name) ?? libraryMaterial(name);
  if (!material) errors.push({ path: `${hp}.plate.material`, message: unknownMaterialMessage(name, Object.keys(s.materials ?? {})) });
  const points = setPoints(h, hp, s.duration_s, errors);
  const initialK = cToK(s.initial_C ?? s.ambient_C);
  const refK = points.length > 0 ? 0.5 * (initialK + Math.max(...points.map((p) => p.tK))) : initialK;
  if (material?.melt && Math.max(refK, ...points.map((p) => p.tK)) >= material.melt.solidusK) {
    errors.push({ path: `${hp}.plate.material`, message: `the plate would reach the solidus of ${show(name)}; pick a plate material that stays solid, got ${show(name)}` });
  }
  const areaM2 = footprint?.areaM2 ?? 1;
  return {
    kind: 'heater',
    heater: {
      powerW: h.power_W,
      powerWPerM2: h.power_W / areaM2,
      areaM2,
      capacityJPerM2K: material ? sensibleCapacity(material, refK) * mmToM(h.plate.thickness_mm) : 1,
      contactWPerM2K: h.contact_W_m2K,
      lossWPerM2K: h.loss_W_m2K ?? 0,
      lossToK: cToK(s.ambient_C),
      control: control(h, hp, s, errors),
      setPoints: points,
    },
  };
}

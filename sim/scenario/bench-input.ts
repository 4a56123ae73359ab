/**
 * A face segment's `bench` (scenario-schema.ts) → the bench face condition in SI (physics/bench.ts), with field-named
 * errors. The bench's k and ρ·c_p are read at one temperature, its starting temperature (start_C, or ambient_C): the
 * solid is linear, so its properties cannot follow the few millimetres next to the face that warm up. For a ceramic
 * tile or a steel bench the tables change by a few per cent over the first hundred kelvin (the library files), which is
 * the model error of this choice. The bench does not melt in the model: a material whose solidus is at or below the
 * hottest temperature the file names (initial, ambient, the bench's start, held faces, plates, set-points) is refused.
 */
import type { Material } from '../physics/material.ts';
import { evalTable, sensibleCapacity } from '../physics/material.ts';
import type { FaceCondition } from '../physics/problem.ts';
import { ADIABATIC } from '../physics/problem.ts';
import { cToK, kToC, mmToM } from '../physics/units.ts';
import type { FieldError } from './field-errors.ts';
import { libraryMaterial, unknownMaterialMessage } from './library.ts';
import type { FaceSegmentFile, ScenarioFile } from './scenario-schema.ts';

const OTHER_TERMS = ['flux_W_m2', 'power_W', 'convection_W_m2K', 'fluid_C', 'emissivity', 'surroundings_C', 'plate', 'fixed_C', 'heater'] as const;

const show = (v: unknown): string => JSON.stringify(v);

/** The hottest temperature the file names, °C: what a bench must stay solid at. */
function hottestNamedC(s: ScenarioFile): number {
  const temps = [s.ambient_C, s.initial_C ?? s.ambient_C];
  for (const seg of [...s.bottom, ...s.top]) {
    if (seg.fixed_C !== undefined) temps.push(seg.fixed_C);
    if (seg.plate) temps.push(seg.plate.temperature_C);
    if (seg.bench?.start_C !== undefined) temps.push(seg.bench.start_C);
    const c = seg.heater?.control;
    if (c && c.kind !== 'constant' && c.set_point_C !== undefined) temps.push(c.set_point_C);
    for (const p of seg.heater?.set_points ?? []) temps.push(p.set_point_C);
  }
  return Math.max(...temps);
}

/** The bench face condition of a segment with a `bench`, for the time from its start to the end of the run; errors name the fields. */
export function benchCondition(seg: FaceSegmentFile, path: string, s: ScenarioFile,
  materials: ReadonlyMap<string, Material>, errors: FieldError[]): FaceCondition {
  const b = seg.bench!;
  const bp = `${path}.bench`;
  const others = OTHER_TERMS.filter((k) => seg[k] !== undefined);
  if (others.length > 0) errors.push({ path: bp, message: `a face on a bench takes no other term, got also ${others.join(', ')}` });
  const material = materials.get(b.material) ?? libraryMaterial(b.material);
  if (!material) errors.push({ path: `${bp}.material`, message: unknownMaterialMessage(b.material, Object.keys(s.materials ?? {})) });
  const hottest = hottestNamedC(s);
  if (material?.melt && kToC(material.melt.solidusK) <= hottest) {
    errors.push({ path: `${bp}.material`, message: `the bench is modelled without melting, and ${show(b.material)} melts from ${kToC(material.melt.solidusK).toFixed(1)} °C, at or below the ${hottest} °C the file names; pick a bench that stays solid, got ${show(b.material)}` });
  }
  const restS = s.duration_s - seg.from_s;
  if (!(restS > 0)) errors.push({ path: `${path}.from_s`, message: `a bench segment must start before the end of the run (duration_s ${s.duration_s}), got ${seg.from_s}` });
  if (!material || !(restS > 0)) return ADIABATIC; // refused above: the problem is not built
  const startK = cToK(b.start_C ?? s.ambient_C);
  const k = evalTable(material.conductivity, startK);
  const rhoC = sensibleCapacity(material, startK);
  return {
    kind: 'bench',
    bench: {
      material,
      conductivityWPerMK: k,
      capacityJPerM3K: rhoC,
      propertiesAtK: startK,
      contactWPerM2K: b.contact_W_m2K,
      startK,
      thicknessM: b.thickness_mm === undefined ? undefined : mmToM(b.thickness_mm),
    },
  };
}

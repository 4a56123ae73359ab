/**
 * The scenario's `edges` key → the edge-loss term every layer carries (sim/physics/edge-loss.ts), in SI: P/A from the
 * footprint (footprintGeometry), the side wall's height as the whole stack's, air and surroundings at ambient_C, and
 * the sleeve's material (the scenario's own, then the library) and geometry. Errors name the field and the value.
 */
import type { EdgeLoss } from '../physics/edge-loss.ts';
import { sleeveGeometry } from '../physics/edge-loss.ts';
import type { CellHeatTerm } from '../physics/heat-terms.ts';
import type { Material } from '../physics/material.ts';
import { footprintGeometry } from '../physics/problem.ts';
import { cToK, mmToM } from '../physics/units.ts';
import type { FieldError } from './field-errors.ts';
import { libraryMaterial, unknownMaterialMessage } from './library.ts';
import type { ScenarioFile } from './scenario-schema.ts';

const show = (v: unknown): string => JSON.stringify(v);

/**
 * The edge term of every layer ([] when the scenario has no `edges` or `"loss": false`). `materials` holds the
 * scenario's inline materials already built (scenario.ts). Errors go to `errors`.
 */
export function edgeTerms(s: ScenarioFile, materials: ReadonlyMap<string, Material>, errors: FieldError[]): CellHeatTerm[] {
  const e = s.edges;
  if (!e || !e.loss) return [];
  if (!s.footprint) {
    errors.push({ path: 'edges.loss', message: `needs the scenario's footprint (its perimeter over area sets the side loss per volume), got ${show(e.loss)} without one` });
    return [];
  }
  const { areaM2, perimeterM } = footprintGeometry(s.footprint);
  let sleeve: EdgeLoss['sleeve'];
  if (e.sleeve) {
    const name = e.sleeve.material;
    const material = materials.get(name) ?? (Object.hasOwn(s.materials ?? {}, name) ? undefined : libraryMaterial(name));
    if (!material) {
      // an inline material that failed to build has its own errors already
      if (!Object.hasOwn(s.materials ?? {}, name)) {
        errors.push({ path: 'edges.sleeve.material', message: unknownMaterialMessage(name, Object.keys(s.materials ?? {})) });
      }
      return [];
    }
    if (material.melt) {
      errors.push({
        path: 'edges.sleeve.material',
        message: `a sleeve is a steady conduction resistance here, so its material must not melt; got ${show(name)}, which melts at ${(material.melt.solidusK - cToK(0)).toFixed(0)} °C`,
      });
      return [];
    }
    sleeve = { conductivity: material.conductivity, ...sleeveGeometry(s.footprint, mmToM(e.sleeve.thickness_mm)) };
  }
  const conv = e.convection_W_m2K ?? 'natural';
  const loss: EdgeLoss = {
    perimeterPerArea: perimeterM / areaM2,
    heightM: mmToM(s.layers.reduce((sum, l) => sum + l.thickness_mm, 0)),
    convection: conv === 'natural' ? { kind: 'natural' } : { kind: 'fixed', coefficient: conv },
    emissivity: e.emissivity,
    ambientK: cToK(s.ambient_C),
    sleeve,
  };
  return [{ kind: 'edge', loss }];
}

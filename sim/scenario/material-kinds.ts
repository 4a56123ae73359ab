/**
 * An inline material of the scenario → Material, by kind: properties given directly (material-file.ts), a LiCl–KCl
 * mixture by composition (salt-mixture.ts), or a porous matrix filled with a salt (composite.ts). Errors name the field.
 */
import { compositeMaterial } from '../physics/composite.ts';
import type { FieldError } from './field-errors.ts';
import { libraryMaterial, unknownMaterialMessage } from './library.ts';
import type { Limit, Material } from '../physics/material.ts';
import { materialFromFile } from './material-file.ts';
import type { CompositeFile } from './rig-schema.ts';
import { liclMoleFraction, saltMixtureMaterial } from './salt-mixture.ts';
import type { InlineMaterialFile, MaterialEntryFile } from './scenario-schema.ts';
import { cToK } from '../physics/units.ts';

const show = (v: unknown): string => JSON.stringify(v);

function compositeOf(name: string, c: CompositeFile, path: string, errors: FieldError[]): Material | undefined {
  const matrix = libraryMaterial(c.matrix);
  if (!matrix) errors.push({ path: `${path}.matrix`, message: unknownMaterialMessage(c.matrix, []) });
  else if (matrix.melt) errors.push({ path: `${path}.matrix`, message: `the matrix must be a material that does not melt, got ${show(c.matrix)}` });
  let salt: Material | undefined;
  if (typeof c.salt === 'string') {
    salt = libraryMaterial(c.salt);
    if (!salt) errors.push({ path: `${path}.salt`, message: unknownMaterialMessage(c.salt, []) });
    else if (!salt.melt) errors.push({ path: `${path}.salt`, message: `the salt must have melt data, got ${show(c.salt)}` });
  } else {
    const x = liclMoleFraction(c.salt, `${path}.salt`, errors);
    if (x !== undefined) salt = saltMixtureMaterial(`${name} salt`, x);
  }
  const fill = c.fill ?? 1;
  if (!(c.porosity * fill > 0)) {
    errors.push({ path: `${path}.porosity`, message: `porosity × fill must be > 0 (without salt the composite is its matrix), got ${c.porosity} × ${fill}` });
  }
  if (!matrix || matrix.melt || !salt?.melt || !(c.porosity * fill > 0)) return undefined;
  return compositeMaterial({ name, matrix, salt, porosity: c.porosity, fill });
}

/** Builds an inline material; undefined (with errors pushed) when it cannot be built. */
export function inlineMaterial(name: string, entry: MaterialEntryFile, path: string, errors: FieldError[]): Material | undefined {
  if (entry.salt || entry.composite) {
    const built = entry.salt
      ? (() => {
        const x = liclMoleFraction(entry.salt, `${path}.salt`, errors);
        return x === undefined ? undefined : saltMixtureMaterial(name, x);
      })()
      : compositeOf(name, entry.composite!, `${path}.composite`, errors);
    if (!built) return undefined;
    // the entry's own title and limits apply to a modelled material too (nothing given is ignored)
    const own: Limit[] = (entry.limits ?? []).map((l) => ({ kind: l.kind, atK: cToK(l.at_C), source: l.source, note: l.note }));
    return { ...built, title: entry.title ?? built.title, limits: [...built.limits, ...own], from: `the scenario file's ${path} (${entry.salt ? 'LiCl–KCl mixture' : 'composite'})` };
  }
  const { salt: _s, composite: _c, k_W_mK, rho_kg_m3, cp_J_kgK, ...rest } = entry;
  // the schema has already required the three properties of a material given directly
  if (k_W_mK === undefined || rho_kg_m3 === undefined || cp_J_kgK === undefined) return undefined;
  const plain: InlineMaterialFile = { ...rest, k_W_mK, rho_kg_m3, cp_J_kgK };
  return materialFromFile(name, plain, path, errors);
}

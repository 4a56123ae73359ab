/**
 * A material record from a file (inline in a scenario, or materials/*.json) → the Material model in SI.
 * Tables must have strictly increasing temperatures; the solidus may not lie above the liquidus.
 */
import type { FieldError } from './field-errors.ts';
import type { Limit, Material, Table } from '../physics/material.ts';
import { buildMaterial } from '../physics/material.ts';
import type { InlineMaterialFile, LibraryMaterialFile, PropertyFile } from './scenario-schema.ts';
import { cToK } from '../physics/units.ts';

function toTable(p: PropertyFile, path: string, errors: FieldError[]): Table {
  if (typeof p === 'number') return { tK: Float64Array.of(cToK(0)), y: Float64Array.of(p) };
  for (let i = 1; i < p.length; i++) {
    if (!(p[i]![0] > p[i - 1]![0])) {
      errors.push({ path: `${path}[${i}][0]`, message: `temperatures must increase strictly, got ${p[i]![0]} °C after ${p[i - 1]![0]} °C` });
    }
  }
  return { tK: Float64Array.from(p, (r) => cToK(r[0])), y: Float64Array.from(p, (r) => r[1]) };
}

/** Builds a Material from an inline or library material record; errors go to `errors` under `path`. */
export function materialFromFile(name: string, file: InlineMaterialFile | LibraryMaterialFile, path: string,
  errors: FieldError[]): Material {
  const conductivity = toTable(file.k_W_mK, `${path}.k_W_mK`, errors);
  const specificHeat = toTable(file.cp_J_kgK, `${path}.cp_J_kgK`, errors);
  const m = file.melt;
  if (m && m.solidus_C > m.liquidus_C) {
    errors.push({ path: `${path}.melt.solidus_C`, message: `must be ≤ liquidus_C (${m.liquidus_C} °C), got ${m.solidus_C} °C` });
  }
  const limits: Limit[] = (file.limits ?? []).map((l) => ({ kind: l.kind, atK: cToK(l.at_C), source: l.source, note: l.note }));
  return buildMaterial({
    name,
    title: file.title ?? name,
    conductivity,
    density: file.rho_kg_m3,
    specificHeat,
    melt: m ? { solidusK: cToK(m.solidus_C), liquidusK: cToK(m.liquidus_C), latentJPerKg: m.latent_J_kg } : undefined,
    limits,
    sources: file.sources ?? {},
    from: path.startsWith('materials/') ? path : `the scenario file's ${path}`,
  });
}


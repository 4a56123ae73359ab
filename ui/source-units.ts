/**
 * A heat source in the unit a person thinks in, converted at the edge: the file keeps W/m³ (`source_W_m3`), the view
 * also takes and shows the total power of the layer over the footprint (W) and the power per kilogram (W/kg).
 *
 *   W/m³ = W / (A · t)      A footprint area, t layer thickness (the layer's volume over the footprint)
 *   W/m³ = W/kg · ρ         ρ the layer material's density
 */
import { footprintGeometry } from '../sim/index.ts';
import { asNumber, asObject, type JsonObject } from './json.ts';
import type { MaterialInfo } from './materials.ts';

export type SourceUnit = 'W/m³' | 'W' | 'W/kg';

export const SOURCE_UNITS: readonly { readonly unit: SourceUnit; readonly label: string }[] = [
  { unit: 'W/m³', label: 'W/m³' },
  { unit: 'W', label: 'W total' },
  { unit: 'W/kg', label: 'W/kg' },
];

/** The footprint's area, m², from a disc's diameter or a rectangle's width and length; undefined if not given. */
export function footprintAreaM2(scenario: JsonObject): number | undefined {
  const fp = asObject(scenario.footprint);
  const d = asNumber(fp.diameter_mm);
  const w = asNumber(fp.width_mm);
  const len = asNumber(fp.length_mm);
  if (d !== undefined) return d > 0 ? footprintGeometry({ diameter_mm: d }).areaM2 : undefined;
  if (w !== undefined && len !== undefined && w > 0 && len > 0) return footprintGeometry({ width_mm: w, length_mm: len }).areaM2;
  return undefined;
}

/** What a conversion needs to know about the layer. */
export interface SourceContext {
  readonly areaM2: number | undefined;
  readonly thicknessMm: number | undefined;
  readonly material: Pick<MaterialInfo, 'rho'>;
}

/**
 * W/m³ per one of `unit`: multiply a value in `unit` by it to get W/m³. Undefined when the layer lacks what the
 * conversion needs (no footprint, no thickness, a density that is not one number).
 */
export function toWPerM3(unit: SourceUnit, c: SourceContext): number | undefined {
  if (unit === 'W/m³') return 1;
  if (unit === 'W') {
    const t = c.thicknessMm;
    return c.areaM2 !== undefined && t !== undefined && t > 0 ? 1 / (c.areaM2 * (t / 1000)) : undefined;
  }
  const rho = typeof c.material.rho === 'number' && c.material.rho > 0 ? c.material.rho : undefined;
  return rho;
}

/** Why a unit cannot be used for this layer, in words; undefined if it can. */
export function unitUnavailable(unit: SourceUnit, c: SourceContext): string | undefined {
  if (toWPerM3(unit, c) !== undefined) return undefined;
  if (unit === 'W') return c.areaM2 === undefined ? 'needs a footprint' : 'needs a thickness above 0';
  return 'needs the material\'s density';
}

/**
 * A stored W/m³ value shown in `unit`, as text for an input box: six significant figures, so that a value typed in
 * that unit reads back as typed (the conversion itself is exact to double precision).
 */
export function shownIn(unit: SourceUnit, wPerM3: number, c: SourceContext): string | undefined {
  const f = toWPerM3(unit, c);
  if (f === undefined) return undefined;
  return String(Number((wPerM3 / f).toPrecision(6)));
}

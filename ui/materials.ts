/**
 * What the page needs to know about a material named in the draft: from the scenario's own `materials`, or from the
 * bundled library (with its sources). Only for display; the solver resolves materials itself. A material the file
 * gives by a model (a salt-soaked matrix, a LiCl–KCl mixture) is built by the core (`inlineMaterial`), so the page
 * shows the properties the run will use, not a second computation.
 */
import { inlineMaterial, kToC, libraryFile, libraryNames, materialEntrySchema, type FieldError, type Material, type Table } from '../sim/index.ts';
import { asList, asNumber, asObject, asString, isObject, type Json, type JsonObject } from './json.ts';

export interface MaterialLimit { readonly kind: string; readonly atC: number | undefined; readonly source?: string; readonly note?: string }

export interface MaterialInfo {
  readonly name: string;
  readonly origin: 'library' | 'file' | 'unknown';
  readonly title: string;
  readonly k: Json | undefined;
  readonly rho: Json | undefined;
  readonly cp: Json | undefined;
  readonly melt: { readonly solidusC: number; readonly liquidusC: number; readonly latentJPerKg: number | undefined } | undefined;
  readonly limits: readonly MaterialLimit[];
  readonly sources: Readonly<Record<string, string>>;
  readonly notes: string | undefined;
}

export interface MaterialChoice { readonly name: string; readonly label: string }

/** The material names to offer: the file's own first, then the library. */
export function materialChoices(draft: JsonObject): MaterialChoice[] {
  const own = asObject(draft.materials);
  const kind = (e: Json | undefined): string => (!isObject(e) ? '' : e.composite !== undefined ? 'salt-soaked matrix, '
    : e.salt !== undefined ? 'LiCl–KCl mixture, ' : '');
  const inline = Object.keys(own).map((name) => ({ name, label: `${name} (${kind(own[name])}in this file)` }));
  const library = libraryNames().map((name) => ({ name, label: name }));
  return [...inline, ...library];
}

function meltOf(v: Json | undefined): MaterialInfo['melt'] {
  const m = asObject(v);
  const solidusC = asNumber(m.solidus_C);
  const liquidusC = asNumber(m.liquidus_C);
  if (solidusC === undefined || liquidusC === undefined) return undefined;
  return { solidusC, liquidusC, latentJPerKg: asNumber(m.latent_J_kg) };
}

function limitsOf(v: Json | undefined): MaterialLimit[] {
  return asList(v).filter(isObject).map((l) => ({
    kind: asString(l.kind) ?? 'limit', atC: asNumber(l.at_C), source: asString(l.source), note: asString(l.note),
  }));
}

function sourcesOf(v: Json | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, s] of Object.entries(asObject(v))) if (typeof s === 'string') out[k] = s;
  return out;
}

const libraryCache = new Map<string, MaterialInfo>();

/** The Material the core builds from the file's own entry of this name, or the core's words on why it cannot. */
export function modelledMaterial(draft: JsonObject, name: string): { ok: true; material: Material } | { ok: false; errors: string[] } {
  const shape = materialEntrySchema.safeParse(asObject(draft.materials)[name]);
  if (!shape.success) return { ok: false, errors: ['a field of the entry is not filled in as the format asks (see the fields marked in red)'] };
  const errors: FieldError[] = [];
  const material = inlineMaterial(name, shape.data, `materials.${name}`, errors);
  return material && errors.length === 0 ? { ok: true, material } : { ok: false, errors: errors.map((e) => e.message) };
}

/** A core table (K) as the file writes one: [[T_C, v], …]. */
const tableJson = (t: Table): Json => Array.from(t.tK, (tK, j) => [kToC(tK), t.y[j]!]);

function modelledInfo(name: string, m: Material): MaterialInfo {
  return {
    name, origin: 'file', title: m.title, k: tableJson(m.conductivity), rho: m.density, cp: tableJson(m.specificHeat),
    melt: m.melt ? { solidusC: kToC(m.melt.solidusK), liquidusC: kToC(m.melt.liquidusK), latentJPerKg: m.melt.latentJPerKg } : undefined,
    limits: m.limits.map((l) => ({ kind: l.kind, atC: kToC(l.atK), source: l.source, note: l.note })),
    sources: { ...m.sources }, notes: undefined,
  };
}

export function materialInfo(draft: JsonObject, name: string): MaterialInfo {
  const inline = asObject(draft.materials);
  if (Object.hasOwn(inline, name) && isObject(inline[name])) {
    const m = inline[name];
    if (m.composite !== undefined || m.salt !== undefined) {
      const built = modelledMaterial(draft, name);
      if (built.ok) return modelledInfo(name, built.material);
    }
    return {
      name, origin: 'file', title: asString(m.title) ?? name, k: m.k_W_mK, rho: m.rho_kg_m3, cp: m.cp_J_kgK,
      melt: meltOf(m.melt), limits: limitsOf(m.limits), sources: sourcesOf(m.sources), notes: asString(m.notes),
    };
  }
  const cached = libraryCache.get(name);
  if (cached) return cached;
  const lib = libraryFile(name);
  if (lib) {
    const asJson = JSON.parse(JSON.stringify(lib)) as JsonObject;
    const info: MaterialInfo = {
      name, origin: 'library', title: lib.title ?? name, k: asJson.k_W_mK, rho: asJson.rho_kg_m3, cp: asJson.cp_J_kgK,
      melt: meltOf(asJson.melt), limits: limitsOf(asJson.limits), sources: sourcesOf(asJson.sources), notes: lib.notes,
    };
    libraryCache.set(name, info);
    return info;
  }
  return { name, origin: 'unknown', title: name, k: undefined, rho: undefined, cp: undefined, melt: undefined, limits: [], sources: {}, notes: undefined };
}

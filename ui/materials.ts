/**
 * What the page needs to know about a material named in the draft: from the scenario's own `materials`, or from the
 * bundled library (with its sources). Only for display; the solver resolves materials itself.
 */
import { libraryFile, libraryNames } from '../sim/index.ts';
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
  const inline = Object.keys(own).map((name) => ({
    name, label: `${name} (${isObject(own[name]) && own[name].composite !== undefined ? 'salt-soaked matrix, ' : ''}in this file)`,
  }));
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

export function materialInfo(draft: JsonObject, name: string): MaterialInfo {
  const inline = asObject(draft.materials);
  if (Object.hasOwn(inline, name) && isObject(inline[name])) {
    const m = inline[name];
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

/**
 * Structural edits of the layer stack in the draft: add, remove, move, rename. Contacts belong to a pair of
 * neighbouring layers; after any edit, a contact survives only if its two layers are still neighbours (in either
 * order), and is rewritten bottom-to-top.
 */
import { inputText } from './format.ts';
import { asList, asObject, asString, isObject, type Json, type JsonObject } from './json.ts';

const layersOf = (d: JsonObject): Json[] => {
  if (!Array.isArray(d.layers)) d.layers = [];
  return d.layers as Json[];
};

const idOf = (layer: Json | undefined): string => asString(asObject(layer).id) ?? '';

/** Index in `contacts` of the contact between layer i and layer i + 1, or -1. */
export function contactIndex(d: JsonObject, i: number): number {
  const layers = asList(d.layers);
  const below = idOf(layers[i]);
  const above = idOf(layers[i + 1]);
  return asList(d.contacts).findIndex((c) => {
    const o = asObject(c);
    return (o.below === below && o.above === above) || (o.below === above && o.above === below);
  });
}

/**
 * Keeps the contacts whose layers are still neighbours, written below → above in stack order. Returns a sentence for
 * each contact dropped because its layers are no longer neighbours, so the person is told, not surprised.
 */
export function tidyContacts(d: JsonObject): string[] {
  if (!Array.isArray(d.contacts)) return [];
  const kept: Json[] = [];
  const layers = asList(d.layers);
  for (let i = 0; i + 1 < layers.length; i++) {
    const k = contactIndex(d, i);
    if (k < 0) continue;
    const c = asObject(d.contacts[k]);
    kept.push({ ...c, below: idOf(layers[i]), above: idOf(layers[i + 1]) });
  }
  const ids = layers.map(idOf);
  const dropped: string[] = [];
  for (const c of d.contacts) {
    const o = asObject(c);
    const below = asString(o.below) ?? '';
    const above = asString(o.above) ?? '';
    if (!ids.includes(below) && !ids.includes(above)) {
      kept.push(c); // names no layer of the stack at all: left for the solver to report
    } else if (!kept.some((k) => { const x = asObject(k); return (x.below === below && x.above === above) || (x.below === above && x.above === below); })) {
      dropped.push(`The contact resistance between ${below} and ${above} (${inputText(o.resistance_m2K_W)} m²·K/W) was removed: they are no longer neighbours.`);
    }
  }
  d.contacts = kept;
  if (kept.length === 0) delete d.contacts;
  return dropped;
}

function freshId(d: JsonObject): string {
  const ids = new Set(asList(d.layers).map(idOf));
  for (let n = ids.size + 1; ; n++) if (!ids.has(`layer-${n}`)) return `layer-${n}`;
}

/** A new layer on top of the stack. */
export function addLayer(d: JsonObject, material: string): string[] {
  layersOf(d).push({ id: freshId(d), material, thickness_mm: 1 });
  return tidyContacts(d);
}

export function removeLayer(d: JsonObject, i: number): string[] {
  layersOf(d).splice(i, 1);
  return tidyContacts(d);
}

/** Swaps layer i with its neighbour (`by` = −1 down, +1 up). */
export function moveLayer(d: JsonObject, i: number, by: -1 | 1): string[] {
  const layers = layersOf(d);
  const j = i + by;
  if (j < 0 || j >= layers.length) return [];
  [layers[i], layers[j]] = [layers[j]!, layers[i]!];
  return tidyContacts(d);
}

/** Renames a layer and the contacts that name it. */
export function renameLayer(d: JsonObject, i: number, id: string): void {
  const layer = layersOf(d)[i];
  if (!isObject(layer)) return;
  const old = idOf(layer);
  for (const c of asList(d.contacts)) {
    if (!isObject(c)) continue;
    if (c.below === old) c.below = id;
    if (c.above === old) c.above = id;
  }
  layer.id = id;
}

/** Sets the contact resistance between layer i and i + 1 (undefined: perfect contact, the entry is removed). */
export function setContact(d: JsonObject, i: number, resistance: Json | undefined): void {
  const k = contactIndex(d, i);
  if (resistance === undefined) {
    if (k >= 0 && Array.isArray(d.contacts)) d.contacts.splice(k, 1);
    if (Array.isArray(d.contacts) && d.contacts.length === 0) delete d.contacts;
    return;
  }
  const c = asList(d.contacts)[k];
  if (k >= 0 && isObject(c)) {
    c.resistance_m2K_W = resistance;
    return;
  }
  const layers = asList(d.layers);
  if (!Array.isArray(d.contacts)) d.contacts = [];
  d.contacts.push({ below: idOf(layers[i]), above: idOf(layers[i + 1]), resistance_m2K_W: resistance });
}

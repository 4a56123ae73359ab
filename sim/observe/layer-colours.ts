/**
 * One colour per layer id, shared by the browser view (editor, cross-section, charts) and the HTML report, so a layer
 * reads the same colour in both. Colours of our own, distinct on screen and on a grey-scale print.
 */
const LAYER_COLOURS = ['#2f6db3', '#c2571a', '#3f8f3a', '#8a4fb0', '#a8841a', '#1f9a8f', '#b03a6e', '#56616b'] as const;

/** A small string hash (FNV-1a, 32 bit), to give an id a preferred palette slot. */
function hashId(id: string): number {
  let x = 0x811c9dc5;
  for (let k = 0; k < id.length; k++) x = Math.imul(x ^ id.charCodeAt(k), 0x01000193) >>> 0;
  return x;
}

/**
 * Each id takes its preferred slot of the palette (from its hash), or the next free one; ids are placed in sorted
 * order, so the colours depend on the set of ids only: moving a layer up or down keeps its colour. Distinct while
 * there are no more layers than colours.
 */
export function layerColours(ids: readonly string[]): Map<string, string> {
  const out = new Map<string, string>();
  const taken = new Set<number>();
  for (const id of [...new Set(ids)].sort()) {
    let slot = hashId(id) % LAYER_COLOURS.length;
    for (let k = 0; k < LAYER_COLOURS.length && taken.has(slot); k++) slot = (slot + 1) % LAYER_COLOURS.length;
    taken.add(slot);
    if (taken.size >= LAYER_COLOURS.length) taken.clear();
    out.set(id, LAYER_COLOURS[slot]!);
  }
  return out;
}

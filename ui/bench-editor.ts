/**
 * A face row of the kind "bench surface" (the segment's `bench` key; README "A bench surface"): after lift-off the
 * face rests on a solid of a named material, through an optional contact conductance (default: perfect contact), from
 * an optional start temperature (default: ambient), semi-infinite or of a given thickness insulated beneath. The material is "to fill in" on a new row
 * (ui/incomplete.ts); a wrong value is the core's to name beside its field. Test hooks: `<side>-bench-<j>-material`,
 * `…-contact`, `…-start`, `…-thickness`.
 */
import type { DraftStore } from './draft.ts';
import { h } from './dom.ts';
import { numberField } from './fields.ts';
import { choiceField, plateChoices } from './heater-editor.ts';
import { asList, asObject, isObject, type JsonObject } from './json.ts';

/** The fieldset of a bench row; `rowPath` is the row's path (`bottom[1]`). */
export function benchTerm(store: DraftStore, rowPath: string, id: string): HTMLElement {
  const p = `${rowPath}.bench`;
  return h('fieldset', { class: 'term bench-surface', 'data-path-group': p }, h('legend', {}, 'bench surface'),
    choiceField(store, `${p}.material`, `${id}-material`, 'bench material',
      'A semi-infinite solid under the face (a tile, a steel top): library materials that stay solid, after the file\'s own.',
      '(choose a material)', plateChoices(store.current())),
    numberField(store, { path: `${p}.contact_W_m2K`, label: 'contact conductance', unit: 'W/(m²·K)', testid: `${id}-contact`, placeholder: 'perfect', hint: 'Between the face and the bench; empty is perfect contact, the upper bound of the heat it draws.' }),
    numberField(store, { path: `${p}.start_C`, label: 'bench at', unit: '°C', testid: `${id}-start`, placeholder: 'ambient', hint: 'Temperature of the whole bench when the face is set on it.' }),
    numberField(store, { path: `${p}.thickness_mm`, label: 'thickness', unit: 'mm', testid: `${id}-thickness`, placeholder: '∞ deep', hint: 'A bench top of this thickness, insulated beneath; empty is a semi-infinite solid.' }));
}

/** Paths of the bench fields left empty (only the material is required), in the solver's path notation. */
export function benchFieldsToFill(draft: JsonObject): string[] {
  const out: string[] = [];
  for (const side of ['bottom', 'top'] as const) {
    asList(draft[side]).forEach((row, j) => {
      const bench = asObject(row).bench;
      if (isObject(bench) && !Object.hasOwn(bench, 'material')) out.push(`${side}[${j}].bench.material`);
    });
  }
  return out;
}

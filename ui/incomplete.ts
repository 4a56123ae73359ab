/**
 * "To fill in" versus "wrong": a heat-source row just added has empty required fields (its value, its end), and so do
 * side-wall losses just switched on (the emissivity), a sleeve just added (its material, its thickness), and a face
 * row just made a heater body (its power, plate, contact, control settings: ui/heater-editor.ts) or a bench (its
 * material: ui/bench-editor.ts). Those
 * are not errors — nothing was typed yet — so the page marks them "to fill in" and requests no run until they are
 * filled; a value that is there but wrong is the solver's to name, beside its field, as usual. Only an absent key
 * counts as empty: text or a bad number is sent to the solver.
 */
import { h } from './dom.ts';
import { benchFieldsToFill } from './bench-editor.ts';
import { heaterFieldsToFill } from './heater-editor.ts';
import { asList, isObject, type JsonObject } from './json.ts';

/** The keys every interval of a layer's heat source needs (scenario format, DESIGN.md). */
const REQUIRED = ['value', 'from_s', 'to_s'] as const;

/** Paths of the required fields left empty in heat-source rows, in the solver's path notation. */
export function fieldsToFill(draft: JsonObject): string[] {
  const out: string[] = [];
  asList(draft.layers).forEach((layer, i) => {
    if (!isObject(layer)) return;
    asList(layer.source_W_m3).forEach((row, j) => {
      if (!isObject(row)) return;
      for (const key of REQUIRED) if (!Object.hasOwn(row, key)) out.push(`layers[${i}].source_W_m3[${j}].${key}`);
    });
  });
  // side-wall losses (ui/edges-editor.ts): switched on with the emissivity still to give, or a sleeve just added
  if (isObject(draft.edges)) {
    if (!Object.hasOwn(draft.edges, 'emissivity')) out.push('edges.emissivity');
    const sleeve = draft.edges.sleeve;
    if (isObject(sleeve)) for (const key of ['material', 'thickness_mm']) if (!Object.hasOwn(sleeve, key)) out.push(`edges.sleeve.${key}`);
  }
  // a face row just made a heater body (ui/heater-editor.ts): its power, plate, contact and control settings
  out.push(...heaterFieldsToFill(draft), ...benchFieldsToFill(draft));
  return out;
}

const TODO_CLASS = 'field-todo';

/** Marks each empty field "to fill in" (replacing earlier marks); returns how many inputs were marked. */
export function markFieldsToFill(root: ParentNode, paths: readonly string[]): number {
  for (const e of root.querySelectorAll(`.${TODO_CLASS}`)) e.remove();
  for (const e of root.querySelectorAll('.to-fill')) e.classList.remove('to-fill');
  let marked = 0;
  for (const path of paths) {
    const input = root.querySelector(`[data-path="${CSS.escape(path)}"]`);
    if (!input) continue;
    input.classList.add('to-fill');
    (input.closest('.field') ?? input.parentElement)?.append(h('span', { class: TODO_CLASS, 'data-testid': TODO_CLASS }, 'to fill in'));
    marked += 1;
  }
  return marked;
}

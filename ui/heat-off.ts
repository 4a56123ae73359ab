/**
 * Where the bottom heating ends, by the solver's own rule (sim/observe/verdict.ts `heatInputs`, which reads
 * sim/physics/faces.ts `isHeatInput`): the first bottom row that follows a heating row and is not one itself. Its
 * `from_s` is "heat off at …". The view keeps no copy of the rule: it reads the draft through the core's parser.
 *
 * The draft is often mid-edit and refused as a whole (a thickness typed as "abc", a row moved out of time order), yet
 * whether a row heats depends on that row alone. So when the draft is refused, each bottom row is read on its own
 * inside a stand-in scenario that holds only it: a one-layer stack and a footprint, neither of which decides whether a
 * row heats (heater power over any positive area is a positive flux). A row the core refuses even there counts as not
 * heating; the editor names its fault beside it.
 */
import { heatInputs, holdKnob, parseScenario, type Problem } from '../sim/index.ts';
import { asList, asObject, type Json, type JsonObject } from './json.ts';
import { getAt, setAt } from './paths.ts';

export const heatOffDefaults = {
  /** A library material for the stand-in layer (any material does: the layer does not decide whether a row heats). */
  standInMaterial: 'alumina',
  /** Stand-in footprint, mm: power_W needs one, and its size cannot change the sign of the flux. */
  standInDiameterMm: 25,
} as const;

/** One bottom row, starting at 0 s, inside a scenario that holds nothing else the parser could refuse. */
function standIn(row: Json | undefined): JsonObject {
  return {
    freezeline: 1,
    ambient_C: 20,
    duration_s: 1,
    footprint: { diameter_mm: heatOffDefaults.standInDiameterMm },
    layers: [{ id: 'stand-in', material: heatOffDefaults.standInMaterial, thickness_mm: 1 }],
    bottom: [{ ...asObject(row), from_s: 0 }],
    top: [],
  };
}

const bottomHeatInputs = (problem: Problem): Set<number> =>
  new Set(heatInputs(problem).flatMap((h) => (h.kind === 'face' && h.side === 'bottom' ? [h.segment] : [])));

/** Which bottom rows are heat inputs, by the core's rule: on the whole draft, else row by row. */
function heatingRows(draft: JsonObject): { count: number; heating: Set<number> } {
  const whole = parseScenario(draft);
  if (whole.ok) return { count: whole.problem.bottom.length, heating: bottomHeatInputs(whole.problem) };
  const rows = asList(draft.bottom);
  const heating = new Set<number>();
  rows.forEach((row, j) => {
    const alone = parseScenario(standIn(row));
    if (alone.ok && bottomHeatInputs(alone.problem).has(0)) heating.add(j);
  });
  return { count: rows.length, heating };
}

/** Index of the bottom row where the heating ends, or undefined if none does. */
export function heaterOffRow(draft: JsonObject): number | undefined {
  const { count, heating } = heatingRows(draft);
  for (let j = 1; j < count; j++) {
    if (heating.has(j - 1) && !heating.has(j)) return j;
  }
  return undefined;
}

/**
 * Every file field that holds "heat off at", by the core's rule (sim/study/knob.ts `holdKnob`, the window search's
 * own list): the `from_s` of the face row after each heating row and the `to_s` of each source interval (heat_W_kg,
 * joule, source_W_m3) that ends at the same time. A pellet's end is its start plus its burn time, not a key of its
 * own: it is listed apart and not moved.
 */
export interface HeatOffFields {
  /** Paths in the core's notation; the first is the control's own (`data-path`), the others move with it. */
  readonly paths: readonly string[];
  /** Layer ids of the pellets that end at heat off too (left alone). */
  readonly pellets: readonly string[];
  /** Why the list is not the core's full one (the draft is refused, or the heat never goes off), if it is not. */
  readonly note: string | undefined;
}

const PELLET = /^layers\[(\d+)\]\.pellet\b/;

/** The paths the hold knob names, split into fields to move and pellets to leave alone. */
function fromKnob(draft: JsonObject, parts: readonly string[]): HeatOffFields {
  const layerId = (i: number): string => String(asObject(asList(draft.layers)[i]).id ?? `layer ${i + 1}`);
  const pellets = parts.flatMap((p) => { const m = PELLET.exec(p); return m ? [layerId(Number(m[1]))] : []; });
  return { paths: parts.filter((p) => !PELLET.test(p)), pellets, note: undefined };
}

/** True when every path exists in the draft and holds one and the same value (the fields were moved together). */
function stillTogether(draft: JsonObject, paths: readonly string[]): boolean {
  if (paths.length === 0) return false;
  const first = getAt(draft, paths[0]!);
  return paths.every((p) => { const v = getAt(draft, p); return v !== undefined && v === first; }) || paths.every((p) => getAt(draft, p) === undefined);
}

/**
 * The fields the "heat off at" control moves. On a draft the core reads, the hold knob's list. `keep` is the list in
 * use so far: it stays while it still holds one value everywhere and either the draft is refused (a value half typed,
 * e.g. "6" on the way to "600", puts a source's end before its start) or `typing` (the control has the focus: a value
 * that makes another input the last to end must not make the control jump to that input mid-word). Otherwise, on a
 * refused draft, the bottom row where the heating ends (read row by row, above).
 */
export function heatOffFields(draft: JsonObject, keep?: readonly string[], typing = false): HeatOffFields | { readonly reason: string } {
  const kept = keep !== undefined && stillTogether(draft, keep) ? { paths: keep, pellets: [], note: undefined } : undefined;
  if (kept && typing) return kept;
  const parsed = parseScenario(draft);
  const knob = parsed.ok ? holdKnob(parsed.problem) : undefined;
  if (knob !== undefined && typeof knob !== 'string') return fromKnob(draft, knob.fields);
  if (kept && !parsed.ok) return kept;
  const j = heaterOffRow(draft);
  if (j === undefined) return { reason: typeof knob === 'string' ? knob : 'no bottom row ends the heating; add a row without a plate or heater to remove it' };
  return { paths: [`bottom[${j}].from_s`], pellets: [], note: typeof knob === 'string' ? knob : 'the scenario cannot be read as it stands, so only this row moves' };
}

/** Writes `value` at every path, in place (undefined removes the key everywhere, as clearing one field does). */
export function setHeatOff(draft: JsonObject, paths: readonly string[], value: Json | undefined): void {
  for (const p of paths) setAt(draft, p, value);
}

/** A path in a reader's words: "bottom row 2 start", "anode Joule heat end". */
export function heatOffFieldWords(draft: JsonObject, path: string): string {
  const face = /^(bottom|top)\[(\d+)\]\.from_s$/.exec(path);
  if (face) return `${face[1]} row ${Number(face[2]) + 1} start`;
  const src = /^layers\[(\d+)\]\.(joule|heat_W_kg|source_W_m3)(?:\[(\d+)\])?\.to_s$/.exec(path);
  if (!src) return path;
  const id = String(asObject(asList(draft.layers)[Number(src[1])]).id ?? `layer ${Number(src[1]) + 1}`);
  const what = src[2] === 'joule' ? 'Joule heat' : src[2] === 'heat_W_kg' ? 'W/kg heat' : 'heat source';
  return `${id} ${what}${src[3] !== undefined ? ` ${Number(src[3]) + 1}` : ''} end`;
}

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
import { heatInputs, parseScenario, type Problem } from '../sim/index.ts';
import { asList, asObject, type Json, type JsonObject } from './json.ts';

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

/**
 * Where the bottom heating ends, by the solver's own rule (sim/observe/verdict.ts `heatInputs`, which reads
 * sim/physics/faces.ts `isHeatInput`): the first bottom row that follows a heating row and is not one itself. Its
 * `from_s` is "heat off at …". The view keeps no copy of the rule: it reads the draft through the core's parser.
 *
 * The draft is often mid-edit and refused as a whole (a thickness typed as "abc"), yet its bottom rows may be fine. So
 * when the draft is refused, the rows are read once more inside a stand-in scenario that holds only them: a one-layer
 * stack and a footprint, neither of which decides whether a row heats (heater power over any positive area is a
 * positive flux).
 */
import { heatInputs, parseScenario, type Problem } from '../sim/index.ts';
import { asList, asNumber, asObject, type Json, type JsonObject } from './json.ts';

export const heatOffDefaults = {
  /** A library material for the stand-in layer (any material does: the layer does not decide whether a row heats). */
  standInMaterial: 'alumina',
  /** Stand-in footprint, mm: power_W needs one, and its size cannot change the sign of the flux. */
  standInDiameterMm: 25,
} as const;

/** The draft's bottom rows inside a scenario that holds nothing else the parser could refuse. */
function standIn(bottom: Json | undefined): JsonObject {
  const starts = asList(bottom).map((row) => asNumber(asObject(row).from_s) ?? 0);
  return {
    freezeline: 1,
    ambient_C: 20,
    duration_s: Math.max(1, ...starts) + 1,
    footprint: { diameter_mm: heatOffDefaults.standInDiameterMm },
    layers: [{ id: 'stand-in', material: heatOffDefaults.standInMaterial, thickness_mm: 1 }],
    bottom: bottom ?? [],
    top: [],
  };
}

function problemOf(draft: JsonObject): Problem | undefined {
  const whole = parseScenario(draft);
  if (whole.ok) return whole.problem;
  const rows = parseScenario(standIn(draft.bottom));
  return rows.ok ? rows.problem : undefined;
}

/** Index of the bottom row where the heating ends, or undefined if none does (or the rows cannot be read). */
export function heaterOffRow(draft: JsonObject): number | undefined {
  const problem = problemOf(draft);
  if (!problem) return undefined;
  const heating = new Set(heatInputs(problem).flatMap((h) => (h.kind === 'face' && h.side === 'bottom' ? [h.segment] : [])));
  for (let j = 1; j < problem.bottom.length; j++) {
    if (heating.has(j - 1) && !heating.has(j)) return j;
  }
  return undefined;
}

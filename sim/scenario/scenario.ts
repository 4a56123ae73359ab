/**
 * Reading a scenario: JSON text or a parsed value → a checked Problem in SI, or a list of field errors.
 * Every error names the field path and the value (`layers[1].thickness_mm: must be > 0, got -1.5`); nothing is
 * clamped or guessed. Material names are looked up in the scenario's own `materials`, then in the bundled library
 * (materials/), by exact name in a map: a name is never read as a path, and `__proto__` is just an unknown name.
 */
import type { Material } from '../physics/material.ts';
import { layerHeatSources } from './heat-sources.ts';
import { edgeTerms } from './edge-terms.ts';
import { inlineMaterial } from './material-kinds.ts';
import { benchCondition } from './bench-input.ts';
import { heaterCondition } from './heater-input.ts';
import type { FaceCondition, FaceSegment, Footprint, Layer, Numerics, Problem } from '../physics/problem.ts';
import { footprintGeometry } from '../physics/problem.ts';
import { capErrors, formatPath, formatZodIssue, nearestWord, quote, type FieldError } from './field-errors.ts';
import { readJsonText } from './json-text.ts';
import { libraryMaterial, unknownMaterialMessage } from './library.ts';
import { scenarioLimitDefaults, sizeErrors, workErrors } from './scenario-limits.ts';
import { applyAccuracy } from './accuracy.ts';
import type { FaceSegmentFile, ScenarioFile } from './scenario-schema.ts';
import { labelDepths, stackProbes } from '../grid/probes.ts';
import { scenarioSchema } from './scenario-schema.ts';
import { cToK, mmToM } from '../physics/units.ts';

/** A value as written in the file; a long text is cut (field-errors.ts). */
const show = (v: unknown): string => (typeof v === 'string' ? quote(v) : JSON.stringify(v));

export type { FieldError } from './field-errors.ts';

export const scenarioDefaults = {
  /**
   * Local error tolerances per step, on temperature (K) and on liquid fraction. At these values the time error of the
   * event times is below 0.15 s on the demo and 0.7 s (0.02 %) on the insulated example, well inside the 0.1 %
   * promise, and probe temperatures move by < 0.04 K against a 25× tighter run; the spatial error dominates.
   */
  toleranceK: 0.2,
  liquidFractionTolerance: 4e-3,
  /** Cells per millimetre of layer, and the floor per layer. */
  cellsPerMm: 4,
  minCellsPerLayer: 8,
  /**
   * The separator's melt front is resolved to O(Δx) by the enthalpy method, so it gets finer cells: 24 cells in a
   * 1.5 mm separator keep the demo's event times within 0.5 s of a 4× finer run (tests/convergence).
   */
  separatorCellsPerMm: 16,
  minSeparatorCells: 16,
  /**
   * Most cells the per-millimetre rule gives one layer: thick layers get coarser cells rather than thousands. The
   * enthalpy method places a front to O(Δx), so an event time's error relative to the layer's own time scale goes as
   * 1/cells; 256 separator cells resolve a thick separator ~10× finer, relative to its thickness, than the 24 that
   * keep the demo's 1.5 mm separator within 0.5 s, and 128 graded cells carry a non-melting layer's heat and storage
   * (the cap binds above 16 mm of separator and 32 mm of other layers). Before it, a 100 mm separator took 1600 cells
   * and its front crossed them one by one for 19-100 s (fuzz seed 12, the default-numerics timeouts). A file's own
   * `cells_per_mm` (or `separator_cells_per_mm`) lifts the cap for those layers; a layer's `cells` is used as given.
   */
  maxCellsPerLayer: 128,
  maxSeparatorCells: 256,
  /** Largest step as a share of the duration, so the curves are drawn smoothly. */
  maxStepShare: 1 / 100,
} as const;

export type ParseResult =
  | { readonly ok: true; readonly scenario: ScenarioFile; readonly problem: Problem }
  | { readonly ok: false; readonly errors: readonly FieldError[] };

const MATERIAL_NAME = /^[A-Za-z0-9][A-Za-z0-9_.+-]*$/;

/**
 * Parses scenario JSON text (json-text.ts: a byte-order mark is skipped; a key given twice is refused with both lines;
 * a syntax error gives its line and column). At most about 20 errors are listed, then "and N more".
 */
export function parseScenarioText(text: string): ParseResult {
  if (text.trim() === '' && text.length <= scenarioLimitDefaults.maxTextChars) return fail('(file)', 'is empty; expected a JSON object');
  const read = readJsonText(text, { maxChars: scenarioLimitDefaults.maxTextChars, maxDepth: scenarioLimitDefaults.maxNestingDepth });
  if (!read.ok) return { ok: false, errors: capErrors(read.errors) };
  return parseScenario(read.value);
}

/**
 * Checks a parsed JSON value against the contract and the limits of scenario-limits.ts, and builds the Problem.
 * At most about 20 errors are listed, then "and N more".
 */
export function parseScenario(value: unknown): ParseResult {
  const result = parseUncapped(value);
  return result.ok ? result : { ok: false, errors: capErrors(result.errors) };
}

function parseUncapped(value: unknown): ParseResult {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    return fail('(file)', `must be a JSON object, got ${value === null ? 'null' : Array.isArray(value) ? 'an array' : typeof value}`);
  }
  // material names are checked on the raw keys: a schema's record output silently drops a key such as `__proto__`
  const nameErrors = materialNameErrors((value as { materials?: unknown }).materials);
  // oversized lists are refused before the schema walks them: one message, not one per entry
  const sizes = sizeErrors(value);
  if (sizes.length > 0) return { ok: false, errors: [...nameErrors, ...sizes] };
  const shape = scenarioSchema.safeParse(value, { reportInput: true });
  if (!shape.success) return { ok: false, errors: [...nameErrors, ...shape.error.issues.flatMap(formatZodIssue)] };
  if (nameErrors.length > 0) return { ok: false, errors: nameErrors };
  const errors: FieldError[] = [];
  const problem = buildProblem(shape.data, errors);
  if (errors.length > 0 || !problem) return { ok: false, errors };
  return { ok: true, scenario: shape.data, problem };
}

function materialNameErrors(materials: unknown): FieldError[] {
  if (typeof materials !== 'object' || materials === null || Array.isArray(materials)) return [];
  const maxChars = scenarioLimitDefaults.maxIdChars;
  return Object.keys(materials).filter((name) => !MATERIAL_NAME.test(name) || name.length > maxChars).map((name) => ({
    path: formatPath(['materials', name]),
    message: name.length > maxChars
      ? `a material name holds at most ${maxChars} characters (scenarioLimitDefaults.maxIdChars), got ${show(name)}`
      : `a material name starts with a letter or digit and holds only letters, digits and _ . + -, got ${show(name)}`,
  }));
}

function fail(path: string, message: string): ParseResult {
  return { ok: false, errors: [{ path, message }] };
}


function footprintOf(f: ScenarioFile['footprint']): Footprint | undefined {
  return f ? footprintGeometry(f) : undefined;
}

function faceSchedule(segments: readonly FaceSegmentFile[], side: 'bottom' | 'top', s: ScenarioFile,
  footprint: Footprint | undefined, materials: ReadonlyMap<string, Material>, errors: FieldError[]): FaceSegment[] {
  const ambientK = cToK(s.ambient_C);
  return segments.map((seg, i) => {
    const path = `${side}[${i}]`;
    if (i > 0 && !(seg.from_s > segments[i - 1]!.from_s)) {
      errors.push({ path: `${path}.from_s`, message: `segments must be in time order, got ${seg.from_s} after ${segments[i - 1]!.from_s}` });
    }
    if (seg.from_s > s.duration_s) {
      errors.push({ path: `${path}.from_s`, message: `must be ≤ duration_s (${s.duration_s}), got ${seg.from_s}` });
    }
    let condition: FaceCondition;
    if (seg.bench !== undefined) {
      condition = benchCondition(seg, path, s, materials, errors);
    } else if (seg.heater !== undefined) {
      condition = heaterCondition(seg, path, s, footprint, materials, errors);
    } else if (seg.fixed_C !== undefined) {
      const others = (['flux_W_m2', 'power_W', 'convection_W_m2K', 'fluid_C', 'emissivity', 'surroundings_C', 'plate'] as const)
        .filter((k) => seg[k] !== undefined);
      if (others.length > 0) {
        errors.push({ path: `${path}.fixed_C`, message: `a held face takes no other term, got also ${others.join(', ')}` });
      }
      condition = { kind: 'fixed', tK: cToK(seg.fixed_C) };
    } else {
      const needsFootprint = seg.convection_W_m2K === 'natural' ? 'convection_W_m2K' : seg.power_W !== undefined ? 'power_W' : undefined;
      if (needsFootprint && !footprint) {
        errors.push({ path: `${path}.${needsFootprint}`, message: `needs the scenario's footprint, got ${show(seg[needsFootprint])} without one` });
      }
      const conv = seg.convection_W_m2K;
      condition = {
        kind: 'terms',
        fluxWPerM2: (seg.flux_W_m2 ?? 0) + (seg.power_W !== undefined && footprint ? seg.power_W / footprint.areaM2 : 0),
        convection: conv === undefined || conv === 0 ? { kind: 'none' } : conv === 'natural' ? { kind: 'natural' } : { kind: 'fixed', coefficient: conv },
        fluidK: seg.fluid_C !== undefined ? cToK(seg.fluid_C) : ambientK,
        emissivity: seg.emissivity ?? 0,
        surroundingsK: seg.surroundings_C !== undefined ? cToK(seg.surroundings_C) : ambientK,
        plate: seg.plate ? { tK: cToK(seg.plate.temperature_C), conductance: seg.plate.conductance_W_m2K } : undefined,
      };
    }
    return { fromS: seg.from_s, condition };
  });
}

function resolveMaterials(s: ScenarioFile, errors: FieldError[]): Map<string, Material> {
  const found = new Map<string, Material>();
  const inline = s.materials ?? {};
  for (const name of Object.keys(inline)) {
    const built = inlineMaterial(name, inline[name]!, `materials.${name}`, errors);
    if (built) found.set(name, built);
  }
  s.layers.forEach((layer, i) => {
    // an inline material that failed to build has its own errors already: it is not unknown
    if (found.has(layer.material) || Object.hasOwn(inline, layer.material)) return;
    const lib = MATERIAL_NAME.test(layer.material) ? libraryMaterial(layer.material) : undefined;
    if (lib) found.set(layer.material, lib);
    else errors.push({ path: `layers[${i}].material`, message: unknownMaterialMessage(layer.material, Object.keys(inline)) });
  });
  return found;
}

function buildLayers(s: ScenarioFile, materials: Map<string, Material>, errors: FieldError[]): Layer[] {
  const seen = new Set<string>();
  return s.layers.map((l, i) => {
    if (seen.has(l.id)) errors.push({ path: `layers[${i}].id`, message: `layer ids must be unique, got ${show(l.id)} twice` });
    seen.add(l.id);
    const material = materials.get(l.material);
    if (l.separator && material && !material.melt) {
      errors.push({
        path: `layers[${i}].separator`,
        message: `layer ${show(l.id)} is marked as the separator, but its material ${show(l.material)} has no melt data; a separator holds the salt that melts and freezes`,
      });
    }
    const src = l.source_W_m3;
    const sources = src === undefined ? [] : typeof src === 'number' ? [{ fromS: 0, toS: s.duration_s, value: src }]
      : src.map((iv, j) => {
        if (!(iv.to_s > iv.from_s)) {
          errors.push({ path: `layers[${i}].source_W_m3[${j}].to_s`, message: `must be > from_s (${iv.from_s}), got ${iv.to_s}` });
        }
        for (const key of ['from_s', 'to_s'] as const) {
          if (iv[key] > s.duration_s) {
            errors.push({ path: `layers[${i}].source_W_m3[${j}].${key}`, message: `must be ≤ duration_s (${s.duration_s}): the run ends before it, got ${iv[key]}` });
          }
        }
        return { fromS: iv.from_s, toS: iv.to_s, value: iv.value };
      });
    // a pellet, Joule heat or W/kg join the W/m³ schedule here, so the solver and the ledger see one kind of source
    if (material) sources.push(...layerHeatSources(l, material.density, mmToM(l.thickness_mm), footprintOf(s.footprint), s.duration_s, `layers[${i}]`, errors));
    return {
      id: l.id, material: material as Material, thicknessM: mmToM(l.thickness_mm),
      separator: l.separator === true, sources, cells: l.cells,
    };
  });
}

/** An id that names no layer: the nearest one (a likely typo) and the ids there are. */
function unknownLayerMessage(id: string, s: ScenarioFile): string {
  const ids = s.layers.map((l) => l.id);
  const hint = nearestWord(id, ids);
  return `unknown layer id${hint ? ` (did you mean ${show(hint)}?)` : ''}; the layers, bottom to top: ${ids.map(show).join(', ')}; got ${show(id)}`;
}

function contactResistances(s: ScenarioFile, errors: FieldError[]): number[] {
  const index = new Map(s.layers.map((l, i) => [l.id, i] as const));
  const resistances = new Array<number>(Math.max(s.layers.length - 1, 0)).fill(0);
  const set = new Set<number>();
  (s.contacts ?? []).forEach((c, i) => {
    const below = index.get(c.below);
    const above = index.get(c.above);
    if (below === undefined) errors.push({ path: `contacts[${i}].below`, message: unknownLayerMessage(c.below, s) });
    if (above === undefined) errors.push({ path: `contacts[${i}].above`, message: unknownLayerMessage(c.above, s) });
    if (below === undefined || above === undefined) return;
    if (above !== below + 1) {
      errors.push({ path: `contacts[${i}].above`, message: `must be the layer directly above ${show(c.below)} (${show(s.layers[below + 1]?.id ?? null)}), got ${show(c.above)}` });
      return;
    }
    if (set.has(below)) errors.push({ path: `contacts[${i}]`, message: `this interface already has a contact, got ${show(c.below)}/${show(c.above)} twice` });
    set.add(below);
    resistances[below] = c.resistance_m2K_W;
  });
  return resistances;
}

/** The scenario's numerical settings with the defaults filled in. */
function numericsOf(s: ScenarioFile): Numerics {
  const num = s.numerics ?? {};
  return {
    toleranceK: num.tolerance_K ?? scenarioDefaults.toleranceK,
    liquidFractionTolerance: num.liquid_fraction_tolerance ?? scenarioDefaults.liquidFractionTolerance,
    cellsPerMm: num.cells_per_mm ?? scenarioDefaults.cellsPerMm,
    minCellsPerLayer: num.min_cells_per_layer ?? scenarioDefaults.minCellsPerLayer,
    separatorCellsPerMm: num.separator_cells_per_mm ?? scenarioDefaults.separatorCellsPerMm,
    minSeparatorCells: num.min_separator_cells ?? scenarioDefaults.minSeparatorCells,
    maxCellsPerLayer: num.cells_per_mm === undefined ? scenarioDefaults.maxCellsPerLayer : undefined,
    maxSeparatorCells: num.separator_cells_per_mm === undefined ? scenarioDefaults.maxSeparatorCells : undefined,
    maxStepS: num.max_step_s ?? s.duration_s * scenarioDefaults.maxStepShare,
  };
}

function buildProblem(s: ScenarioFile, errors: FieldError[]): Problem | undefined {
  const planned = applyAccuracy(s, numericsOf(s), scenarioDefaults);
  if ('path' in planned) { errors.push(planned); return undefined; }
  const numerics = planned;
  // cells and forced steps beyond the limits are refused alone: the rest of the file may be fine
  const work = workErrors(s, numerics, scenarioDefaults);
  if (work.length > 0) { errors.push(...work); return undefined; }
  const materials = resolveMaterials(s, errors);
  const layers = buildLayers(s, materials, errors);
  const contacts = contactResistances(s, errors);
  const footprint = footprintOf(s.footprint);
  const edge = edgeTerms(s, materials, errors);
  const bottom = faceSchedule(s.bottom, 'bottom', s, footprint, materials, errors);
  const top = faceSchedule(s.top, 'top', s, footprint, materials, errors);
  const totalMm = s.layers.reduce((a, l) => a + l.thickness_mm, 0);
  const times = s.output?.times_s ?? [];
  times.forEach((t, i) => {
    if (t > s.duration_s) errors.push({ path: `output.times_s[${i}]`, message: `must be within [0, duration_s = ${s.duration_s}], got ${t}` });
  });
  const ownProbes = s.output?.probes_mm;
  ownProbes?.forEach((x, i) => {
    if (x > totalMm) errors.push({ path: `output.probes_mm[${i}]`, message: `must be within the stack [0, ${totalMm}] mm, got ${x}` });
  });
  // without depths of the user's own, the probes follow the layers (they can never fall outside the stack)
  const probes = ownProbes ? labelDepths(ownProbes, s.layers) : stackProbes(s.layers);
  if (errors.length > 0) return undefined;
  return {
    name: s.name ?? 'untitled scenario',
    ambientK: cToK(s.ambient_C),
    initialK: cToK(s.initial_C ?? s.ambient_C),
    durationS: s.duration_s,
    footprint,
    layers: edge.length > 0 ? layers.map((l) => ({ ...l, terms: edge })) : layers,
    contactResistances: contacts,
    bottom,
    top,
    outputTimesS: times,
    probesM: probes.map((p) => mmToM(p.xMm)),
    probeLabels: probes.map((p) => p.label),
    numerics,
  };
}

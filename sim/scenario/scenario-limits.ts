/**
 * What one run may ask of the machine, checked before any computation. A scenario over a limit is refused with the
 * field, the value and the limit named (`layers[0].cells: …; the limit is 10000 cells in all`): never a crash, an
 * out-of-memory stop or a run of hours. Sizes of lists are checked on the raw JSON value, before the schema walks
 * them, so two million output times cost one message and no more memory than the file itself.
 *
 * Every limit lives in `scenarioLimitDefaults`. Speeds quoted below were measured with `freezeline bench` on the
 * demo refined to 1800 cells: 4.5 M cell-updates/s, 1995 steps in 9.5 s (one core of the 2-core CI machine).
 */
import type { FieldError } from './field-errors.ts';
import { cellsOfLayer } from '../grid/mesh.ts';
import type { Numerics } from '../physics/problem.ts';
import type { ScenarioFile } from './scenario-schema.ts';
import { mmToM } from '../physics/units.ts';
import { accuracyDefaults } from './accuracy.ts';

export const scenarioLimitDefaults = {
  /** Characters of scenario text: a scenario within every other limit is well under 1 MB; this bounds the reader's memory. */
  maxTextChars: 16 * 2 ** 20,
  /** Nesting of objects and lists: a scenario nests 5 deep; deeper text is not a scenario and would exhaust the stack. */
  maxNestingDepth: 32,
  /** Layers in a stack: a stack of tens of cells fits; each layer adds series, verdicts and at least one cell. */
  maxLayers: 200,
  /**
   * Cells in all: eight 100 mm separators at the default 16 cells/mm (12 800), or 5 µm across 100 mm; a guard against
   * memory, not a promise of speed. Measured: the demo at 18 900 cells peaked at 174 MB and met the solver's old work
   * budget (5e7 cell-steps) after 2646 steps, t = 43 s of 3600 s, which stopped it with a message; the run-time ceiling
   * (2.5e8 cell-sweeps, step-guards.ts) now stops it after 2.5e8 / 18 900 ≈ 13 000 Newton sweeps (computed, not
   * measured).
   */
  maxCells: 20_000,
  /** Requested output times: each one keeps a full temperature profile and a column of every probe in the result. */
  maxOutputTimes: 10_000,
  /** Probe depths: each is a row of the result across every output time. */
  maxProbes: 200,
  /** Segments of one face's schedule: each is a breakpoint the steps must land on. */
  maxFaceSegments: 1_000,
  /** Intervals of one layer's heat source: each is a breakpoint the steps must land on. */
  maxSourceIntervals: 1_000,
  /** Rows of one property table: a handbook table has tens; the lookup is searched at every cell and step. */
  maxTableRows: 1_000,
  /** Materials defined in one scenario: each is built and checked even if no layer uses it. */
  maxMaterials: 200,
  /** Characters of a layer id or material name: they head table columns, chart legends and file columns. */
  maxIdChars: 64,
  /** Characters of the scenario's name: it titles the printout and the view. */
  maxNameChars: 200,
  /** Longest run, s (about three years): a stack of millimetres reaches steady state within hours. */
  maxDurationS: 1e8,
  /**
   * Steps forced by max_step_s (duration_s / max_step_s): at ~0.25 ms a step on the demo, half a minute of work; with
   * more than 200 cells maxForcedCellSteps (2e7) binds first.
   */
  maxForcedSteps: 100_000,
  /**
   * Cells × forced steps: at most the solver's run-time ceiling (stepGuardDefaults.maxCellSweeps, cells × Newton
   * sweeps, step-guards.ts) over the fewest sweeps a step can take (2, one per TR-BDF2 stage), so a run that
   * max_step_s alone would push past the ceiling is refused here instead of stopped mid-way. Set when the ceiling was
   * 4e7 and kept when it rose to 1e8 (2026-12-03) and to 2.5e8 (2026-12-04): 2e7 forced cell-steps are at least 4e7
   * sweeps, a few seconds, and a file asking for more has its remedy named before it runs. (scenario/ may not import
   * time/; a unit test holds the three numbers together.)
   */
  maxForcedCellSteps: 2e7,
  /**
   * Cells × the steps the tolerances need as accuracy.ts models them (1500 steps at the default tolerances, × 1.5 per
   * division of a tolerance by 3): the budget accuracy.ts plans against (accuracyDefaults.workBudgetCellSteps), so a
   * file's own tolerances are held to what a planned run may ask. The model is calibrated on examples/; a front that
   * crosses a thick melting layer cell by cell costs more than it says (DEVELOPERS.md "Robustness"), which the
   * run-time ceiling then stops.
   */
  maxModelledCellSteps: 5e7,
  /**
   * Smallest temperature tolerance, K. The Newton iterations stop at 1 % of it; below ~1e-6 K that meets the rounding
   * of the enthalpy (ε·ρc·T ≈ 2e-16 × 4e9 J/m³ ≈ 1e-6 J/m³, stiffly amplified), and the steps (∝ tol^−1/3) already
   * number ~60× the default's.
   */
  minToleranceK: 1e-6,
  /** Smallest liquid-fraction tolerance: the same rounding over ρL (≈ 4e8 J/m³), with the same margin. */
  minLiquidFractionTolerance: 1e-8,
  /** Hottest temperature a field may hold, °C: above every solid's melting point (tungsten 3422 °C, from memory). */
  maxTemperatureC: 10_000,
} as const;

const L = scenarioLimitDefaults;

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const field = (v: unknown, key: string): unknown => (isRecord(v) && Object.hasOwn(v, key) ? v[key] : undefined);

function tooMany(path: string, list: unknown, max: number, what: string, errors: FieldError[]): boolean {
  if (!Array.isArray(list) || list.length <= max) return false;
  errors.push({ path, message: `holds ${list.length} ${what}; the limit is ${max} (scenarioLimitDefaults, sim/scenario/scenario-limits.ts)` });
  return true;
}

/**
 * Lists longer than their limit, read off the raw JSON value (anything of the wrong shape is left to the schema).
 * Empty when every list is within its limit.
 */
export function sizeErrors(raw: unknown): FieldError[] {
  const errors: FieldError[] = [];
  const layers = field(raw, 'layers');
  if (!tooMany('layers', layers, L.maxLayers, 'layers', errors) && Array.isArray(layers)) {
    layers.forEach((layer, i) => {
      tooMany(`layers[${i}].source_W_m3`, field(layer, 'source_W_m3'), L.maxSourceIntervals, 'source intervals', errors);
    });
  }
  tooMany('contacts', field(raw, 'contacts'), L.maxLayers, 'contacts', errors);
  tooMany('bottom', field(raw, 'bottom'), L.maxFaceSegments, 'segments', errors);
  tooMany('top', field(raw, 'top'), L.maxFaceSegments, 'segments', errors);
  const output = field(raw, 'output');
  tooMany('output.times_s', field(output, 'times_s'), L.maxOutputTimes, 'output times', errors);
  tooMany('output.probes_mm', field(output, 'probes_mm'), L.maxProbes, 'probe depths', errors);
  const materials = field(raw, 'materials');
  if (isRecord(materials)) {
    const names = Object.keys(materials);
    if (names.length > L.maxMaterials) {
      errors.push({ path: 'materials', message: `holds ${names.length} materials; the limit is ${L.maxMaterials} (scenarioLimitDefaults, sim/scenario/scenario-limits.ts)` });
    } else {
      for (const name of names) {
        for (const key of ['k_W_mK', 'cp_J_kgK']) {
          // a name over maxIdChars is refused on its own (scenario.ts); here it is only cut short in the path
          const shown = name.length > L.maxIdChars ? `${name.slice(0, L.maxIdChars)}…` : name;
          tooMany(`materials.${shown}.${key}`, field(materials[name], key), L.maxTableRows, 'table rows', errors);
        }
      }
    }
  }
  return errors;
}

/** The knob that set a layer's cell count, as a path a person can change. */
function cellKnob(s: ScenarioFile, i: number, count: number): string {
  const layer = s.layers[i]!;
  if (layer.cells !== undefined) return `layers[${i}].cells`;
  const num = s.numerics ?? {};
  const [perMm, min] = layer.separator
    ? [num.separator_cells_per_mm, num.min_separator_cells] as const
    : [num.cells_per_mm, num.min_cells_per_layer] as const;
  const minKey = layer.separator ? 'min_separator_cells' : 'min_cells_per_layer';
  const perMmKey = layer.separator ? 'separator_cells_per_mm' : 'cells_per_mm';
  if (min !== undefined && count === min) return `numerics.${minKey}`;
  if (perMm !== undefined) return `numerics.${perMmKey}`;
  return `layers[${i}].thickness_mm`;
}

/** Cells of the stack as the run will build it: each layer's count, times the accuracy plan's grid factor. */
function cellCounts(s: ScenarioFile, numerics: Numerics): number[] {
  const refine = numerics.accuracy?.gridRefine ?? 1;
  return s.layers.map((l) => refine * cellsOfLayer(mmToM(l.thickness_mm), l.cells, l.separator === true, numerics));
}

/** The default tolerances (scenarioDefaults, scenario.ts, which imports this module). */
export interface DefaultTolerances { readonly toleranceK: number; readonly liquidFractionTolerance: number }

/**
 * The steps the tolerances need as accuracy.ts models them, and the tolerance that sets them: 1500 at the defaults,
 * × 1.5 per division by 3 of the tighter of the two (accuracyDefaults: trialsAtDefaults, trialsPerToleranceLevel,
 * tolerancePerLevel, read at call time; accuracy.ts imports this module's limits).
 */
function modelledSteps(numerics: Numerics, defaults: DefaultTolerances): { steps: number; path: string; value: number } {
  const a = accuracyDefaults;
  const levelOf = (value: number, atDefault: number) => Math.max(0, Math.log(atDefault / value) / Math.log(a.tolerancePerLevel));
  const kT = levelOf(numerics.toleranceK, defaults.toleranceK);
  const kF = levelOf(numerics.liquidFractionTolerance, defaults.liquidFractionTolerance);
  const [k, path, value] = kT >= kF
    ? [kT, 'numerics.tolerance_K', numerics.toleranceK] as const
    : [kF, 'numerics.liquid_fraction_tolerance', numerics.liquidFractionTolerance] as const;
  return { steps: a.trialsAtDefaults * a.trialsPerToleranceLevel ** k, path, value };
}

/**
 * Work a valid scenario would ask for beyond the limits: total cells, steps forced by `max_step_s`, and cells × the
 * steps its tolerances need as modelled (against `defaults`, the default tolerances). `numerics` are the scenario's own settings with the defaults filled in and
 * the accuracy plan applied (its grid factor multiplies the cells, its divisor is in the tolerances).
 */
export function workErrors(s: ScenarioFile, numerics: Numerics, defaults: DefaultTolerances): FieldError[] {
  const base = s.layers.map((l) => cellsOfLayer(mmToM(l.thickness_mm), l.cells, l.separator === true, numerics));
  const baseTotal = base.reduce((a, b) => a + b, 0);
  if (baseTotal > L.maxCells) {
    // the schema has passed, so the id is at most maxIdChars long and is echoed whole
    const worst = base.indexOf(Math.max(...base));
    const layer = s.layers[worst]!;
    return [{
      path: cellKnob(s, worst, base[worst]!),
      message: `the stack would hold ${baseTotal} cells, ${base[worst]} of them in layer ${JSON.stringify(layer.id)}; ` +
        `the limit is ${L.maxCells} cells in all (scenarioLimitDefaults.maxCells)`,
    }];
  }
  const total = cellCounts(s, numerics).reduce((a, b) => a + b, 0);
  const steps = s.duration_s / numerics.maxStepS;
  if (steps > L.maxForcedSteps) {
    return [{
      path: 'numerics.max_step_s',
      message: `duration_s / max_step_s forces at least ${steps.toPrecision(3)} steps; the limit is ${L.maxForcedSteps} ` +
        `(scenarioLimitDefaults.maxForcedSteps): raise max_step_s to ≥ ${(s.duration_s / L.maxForcedSteps).toPrecision(3)} s, got ${numerics.maxStepS}`,
    }];
  }
  if (steps * total > L.maxForcedCellSteps) {
    return [{
      path: 'numerics.max_step_s',
      message: `${total} cells × ${Math.ceil(steps)} forced steps = ${(steps * total).toPrecision(3)} cell-steps; the limit is ` +
        `${L.maxForcedCellSteps.toExponential(0)} (scenarioLimitDefaults.maxForcedCellSteps, within the run-time ceiling): ` +
        `raise max_step_s to ≥ ${((s.duration_s * total) / L.maxForcedCellSteps).toPrecision(3)} s or use fewer cells, got ${numerics.maxStepS}`,
    }];
  }
  const modelled = modelledSteps(numerics, defaults);
  if (modelled.steps * total > L.maxModelledCellSteps) {
    return [{
      path: modelled.path,
      message: `${total} cells × ${Math.round(modelled.steps)} steps (as modelled for this tolerance) = ${(modelled.steps * total).toPrecision(3)} ` +
        `cell-steps; the limit is ${L.maxModelledCellSteps.toExponential(0)} (scenarioLimitDefaults.maxModelledCellSteps): loosen it or use fewer cells, ` +
        `got ${modelled.value}`,
    }];
  }
  return [];
}

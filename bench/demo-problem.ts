/**
 * The demo (examples/bench-coupon.json) as the benchmarks refine it, shared by bench/solver.ts (its scaling rows) and
 * bench/kernels.ts (the state its kernels are timed on), so that both measure the same runs; and the scenario of the
 * accuracy table (bench/solver.ts), which bench/accuracy-calibration.ts calibrates on as well.
 */
import scenario from '../examples/bench-coupon.json' with { type: 'json' };
import type { Problem } from '../sim/physics/problem.ts';
import { parseScenario, scenarioDefaults } from '../sim/scenario/scenario.ts';
import type { ScenarioFile } from '../sim/scenario/scenario-schema.ts';

/** A scenario file parsed, or an Error naming each refusal. */
export function parseDemo(file: unknown): Problem {
  const parsed = parseScenario(file);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return parsed.problem;
}

/** Cells of the base grid the refined demos share: each refines it by an exact factor (the accuracy plan's grid factor). */
export const DEMO_BASE_CELLS = 50;

/**
 * The demo with `total` cells (DEMO_BASE_CELLS shared by thickness, times total / DEMO_BASE_CELLS), tolerances ×
 * `tolScale` (of the scenario defaults, scenarioDefaults.toleranceK and .liquidFractionTolerance); `rampK` > 0 smooths
 * the melt kinks. The refinement goes through the plan's grid factor, as an accuracy plan refines, so the liquid-fraction
 * error is measured per base cell at every size (the molten-thickness allowance stays the same length while the cells
 * shrink): the sizes hold the time accuracy fixed and vary only the grid.
 */
export function demoProblem(total: number, tolScale: number, rampK: number): Problem {
  const file = structuredClone(scenario) as unknown as ScenarioFile;
  const thickness = file.layers.reduce((a, l) => a + l.thickness_mm, 0);
  let left = DEMO_BASE_CELLS;
  file.layers.forEach((l, i) => {
    const share = i === file.layers.length - 1 ? left : Math.max(1, Math.round((DEMO_BASE_CELLS * l.thickness_mm) / thickness));
    (l as { cells?: number }).cells = share;
    left -= share;
  });
  (file as { numerics?: object }).numerics = {
    tolerance_K: scenarioDefaults.toleranceK * tolScale, liquid_fraction_tolerance: scenarioDefaults.liquidFractionTolerance * tolScale,
  };
  const p = parseDemo(file);
  // the file gives grid and tolerances, so its plan keeps the curve as written; grid factor and ramp are set here
  return { ...p, numerics: { ...p.numerics, accuracy: { ...p.numerics.accuracy!, gridRefine: total / DEMO_BASE_CELLS, meltRampK: rampK } } };
}

/**
 * A scenario of our own, invented: nickel / salt separator / magnesium on a 450 °C plate for 4 min, then free air, 10 min.
 * The accuracy table of bench/solver.ts asks it for 1, 0.1 and 0.01 s; bench/accuracy-calibration.ts measures on it.
 */
export const ACCURACY_SCENARIO = {
  freezeline: 1, name: 'bench: three layers, hot plate then free air', ambient_C: 20, duration_s: 600,
  footprint: { diameter_mm: 20 },
  layers: [
    { id: 'collector', material: 'nickel', thickness_mm: 0.5 },
    { id: 'separator', material: 'licl-kcl-eutectic', thickness_mm: 1.0, separator: true },
    { id: 'anode', material: 'magnesium', thickness_mm: 1.0 },
  ],
  bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 800 } }, { from_s: 240, convection_W_m2K: 'natural', emissivity: 0.4 }],
  top: [{ from_s: 0, convection_W_m2K: 'natural', emissivity: 0.3 }],
};

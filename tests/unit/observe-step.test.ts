// The 1D grid's steps as solver-neutral observations (sim/time/observe-step.ts, sim/physics/observation.ts). Checked
// against geometry (each layer's sample widths add up to its thickness) and the first law of thermodynamics (the
// stored enthalpy the observation shows changes by exactly the heat its named channels carry in, to round-off: the
// 1e-12 the energy ledger is held to elsewhere), and for reuse: one observation object, its arrays bound once.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { StepObservation } from '../../sim/physics/observation.ts';
import { buildGrid } from '../../sim/grid/mesh.ts';
import { solvedProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { evolve } from '../../sim/time/evolve.ts';
import { createStepObserver } from '../../sim/time/observe-step.ts';

const example = (file: string) => {
  const parsed = parseScenario(JSON.parse(readFileSync(new URL(`../../examples/${file}`, import.meta.url), 'utf8')));
  if (!parsed.ok) throw new Error(`${file} does not parse`);
  return solvedProblem(parsed.problem);
};

const storedOf = (obs: StepObservation): number =>
  obs.layers.reduce((s, l) => s + l.enthalpy.reduce((a, h, j) => a + h * l.widthM[j]!, 0), 0);

describe('createStepObserver()', () => {
  // a heater under the stack then lifted off (plate channels), side-wall losses (edge channel), a plain plate
  it.each(['heater-plate-lift-off.json', 'sleeved-square-cell.json', 'bench-coupon.json'])('on %s: the stored heat it shows changes by the heat of its channels (first law)', (file) => {
    const problem = example(file);
    const grid = buildGrid(problem, problem.numerics.accuracy?.gridRefine ?? 1);
    const observer = createStepObserver(problem, grid);
    problem.layers.forEach((l, li) => {
      const widths = observer.layout.layers[li]!.widthM;
      expect(widths.reduce((a, w) => a + w, 0)).toBeCloseTo(l.thicknessM, 15);
      expect(observer.layout.layers[li]!.id).toBe(l.id);
    });
    let first: StepObservation | undefined;
    let arrays: Float64Array[] = [];
    let stored0 = 0;
    let inJ = 0;
    let plateJ = 0;
    let scale = 0;
    let steps = 0;
    for (const step of evolve(problem, grid)) {
      const obs = observer.observe(step);
      const now = obs.layers.flatMap((l) => [l.temperatureK, l.enthalpy, l.stageEnthalpy]);
      if (!first) {
        first = obs;
        arrays = now;
        expect(obs.initial).toBe(true);
        stored0 = storedOf(obs);
        continue;
      }
      // the same observation, and the same arrays: nothing allocated per step
      expect(obs).toBe(first);
      now.forEach((a, k) => expect(a).toBe(arrays[k]));
      expect(obs.initial).toBe(false);
      expect(obs.t0).toBeLessThan(obs.t1);
      expect(obs.tStage).toBeGreaterThan(obs.t0);
      expect(obs.tStage).toBeLessThanOrEqual(obs.t1);
      const e = obs.energy;
      const channels = [e.bottomJ, e.topJ, e.generatedJ, e.edgesJ, e.plates[0].heaterJ, e.plates[1].heaterJ];
      inJ += channels.reduce((a, b) => a + b, 0);
      scale += channels.reduce((a, b) => a + Math.abs(b), 0);
      plateJ += e.plates[0].storedJ + e.plates[1].storedJ;
      steps++;
    }
    expect(steps).toBeGreaterThan(10);
    const storedChange = storedOf(first!) - stored0 + plateJ;
    expect(Math.abs(storedChange - inJ) / scale).toBeLessThan(1e-12);
  });
});

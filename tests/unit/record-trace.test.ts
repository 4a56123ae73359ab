// The separator's event indicators (sim/observe/record-trace.ts) on hand-made observations: a two-cell separator of an
// invented salt with an isothermal melt, whose last cell leaves its melt inside a step. The point the recorder adds
// must sit where the cell's enthalpy, moving at its rate from the earlier point, reaches the level: worked by hand
// below (H in units of the latent heat per volume ρL above the solidus enthalpy; the rates the observation carries
// are heat per footprint, dH/dt × the cell's width). Mutation testing (Stryker) of the recorder's locate() found these
// paths unjudged by the end-to-end Stefan tests, whose 0.15 s tolerance let a wrong start point or rate pass.

import { describe, expect, it } from 'vitest';
import type { Material } from '../../sim/physics/material.ts';
import { buildMaterial } from '../../sim/physics/material.ts';
import type { LayerSamples, ObservationLayout, StepObservation } from '../../sim/physics/observation.ts';
import { createTraceRecorder } from '../../sim/observe/record-trace.ts';
import { firstCrossing } from '../../sim/observe/verdict.ts';

const K0 = 273.15;
const salt: Material = buildMaterial({
  name: 'salt', title: 'invented salt', conductivity: { tK: Float64Array.of(K0), y: Float64Array.of(1) }, density: 2000,
  specificHeat: { tK: Float64Array.of(K0, K0 + 1000), y: Float64Array.of(1000, 1000) },
  melt: { solidusK: K0 + 300, liquidusK: K0 + 300, latentJPerKg: 2e5 }, limits: [], sources: {},
});
const melt = salt.melt!;
const RL = melt.hLiquidus - melt.hSolidus;
const WIDTH = 1e-3;
/** An enthalpy `f` latent heats above the solidus. */
const H = (f: number) => melt.hSolidus + f * RL;
/** The heat rate into a cell whose enthalpy moves by `f` latent heats per second. */
const rate = (f: number) => f * RL * WIDTH;

const layout: ObservationLayout = {
  layers: [{ index: 0, id: 'sep', separator: true, material: salt, widthM: Float64Array.of(WIDTH, WIDTH), positionM: Float64Array.of(0.5e-3, 1.5e-3) }],
  bottomM: 0, topM: 2e-3,
};

/** One observation: enthalpies at tStage and t1, rates at t0 and tStage (each [first cell, last cell]). */
function observation(t0: number, tStage: number, t1: number, stage: number[], end: number[], startRate: number[], stageRate: number[]): StepObservation {
  const layer = {
    ...layout.layers[0]!, temperatureK: new Float64Array(2),
    enthalpy: Float64Array.from(end, H), stageEnthalpy: Float64Array.from(stage, H),
    startHeatRate: Float64Array.from(startRate, rate), stageHeatRate: Float64Array.from(stageRate, rate),
  } satisfies LayerSamples;
  return { t0, tStage, t1, initial: t1 === 0, eventFired: false, layers: [layer] } as unknown as StepObservation;
}

/** Feeds the steps (each reported at its stage point, then its end) and returns the finished trace. */
function trace(start: number[], steps: StepObservation[]) {
  const recorder = createTraceRecorder(layout, 100, 10)!;
  recorder.add(observation(0, 0, 0, start, start, [0, 0], [0, 0]), 'end');
  for (const s of steps) { recorder.add(s, 'stage'); recorder.add(s, 'end'); }
  return recorder.finish().trace;
}

describe('the recorder\'s event points inside a step', () => {
  it('freezing between the step\'s start and its stage point: the last cell reaches its solidus at its rate at the start', () => {
    // the last cell 0.5 ρL above the solidus at t = 0, freezing at 0.1 ρL/s: at the solidus at t = 5 s; by the stage
    // point (6 s) it is 0.02 ρL below, by the end (10 s) 0.05 ρL below (it slows once solid: the line would say 8.3 s)
    const t = trace([-0.1, 0.5], [observation(0, 6, 10, [-0.12, -0.02], [-0.15, -0.05], [-0.01, -0.1], [-0.01, -0.01])]);
    const frozen = firstCrossing(t.tS, t.freezeMargin, 0, 0, 'fall-to');
    expect(frozen).toBeCloseTo(5, 12);
    // the other indicators at the added point: linear between the two points around it, the mean liquid fraction from
    // 0.25 at t = 0 to 0 at the stage point
    const j = Array.from(t.tS).indexOf(frozen!);
    expect(t.meanLiquid[j]).toBeCloseTo(0.25 * (1 - 5 / 6), 12);
  });

  it('freezing between the stage point and the step\'s end: from the stage point, at the rate there', () => {
    // 0.3 ρL above at the stage point (4 s), freezing there at 0.05 ρL/s: at the solidus at 10 s, within the step's end
    // 12 s (its rate at the start, 0.3 ρL/s, would put it at 5 s)
    const t = trace([-0.1, 0.5], [observation(0, 4, 12, [-0.12, 0.3], [-0.15, -0.01], [-0.01, -0.3], [-0.01, -0.05])]);
    expect(firstCrossing(t.tS, t.freezeMargin, 0, 0, 'fall-to')).toBeCloseTo(10, 12);
  });

  it('melting: the last cell reaches its liquidus at its rate, and a rate too slow to get there falls back to the line', () => {
    // 0.6 ρL at t = 0 melting at 0.2 ρL/s: liquid at 2 s (stage point 3 s, past it)
    const fast = trace([1.2, 0.6], [observation(0, 3, 5, [1.25, 1.02], [1.3, 1.05], [0.01, 0.2], [0.01, 0.02])]);
    expect(firstCrossing(fast.tS, fast.meltMargin, 0, 0, 'rise-to')).toBeCloseTo(2, 12);
    // at 0.01 ρL/s it would take 40 s: the line from 0.6 at 0 s to 1.4 at 3 s crosses 1 at 1.5 s
    const slow = trace([1.2, 0.6], [observation(0, 3, 5, [1.25, 1.4], [1.3, 1.5], [0.01, 0.01], [0.01, 0.01])]);
    expect(firstCrossing(slow.tS, slow.meltMargin, 0, 0, 'rise-to')).toBeCloseTo(1.5, 12);
  });

  it('takes the start of a step from the end of the step before it, not from its stage point', () => {
    // step 1 (0 → 10 s) leaves the last cell at 0.4 ρL (0.45 at its stage point); step 2 starts there and freezes it at
    // 0.2 ρL/s: at the solidus 2 s after 10 s
    const t = trace([-0.1, 0.6], [
      observation(0, 5, 10, [-0.12, 0.45], [-0.15, 0.4], [-0.01, -0.02], [-0.01, -0.01]),
      observation(10, 13, 15, [-0.2, -0.05], [-0.25, -0.1], [-0.01, -0.2], [-0.01, -0.01]),
    ]);
    const frozen = firstCrossing(t.tS, t.freezeMargin, 0, 0, 'fall-to');
    expect(frozen).toBeCloseTo(12, 12);
    // the mean liquid fraction at the added point: linear from 0.2 at 10 s to 0 at the stage point, 13 s
    expect(t.meanLiquid[Array.from(t.tS).indexOf(frozen!)]).toBeCloseTo(0.2 * (1 - 2 / 3), 12);
  });
});

// The grid solver against the independent lumped network (one node per layer, integrated by odex's extrapolation
// method), on the demo coupon. They share material and face models only; discretisation, time stepping and event
// location differ. Reference for the lumped error: a layer's internal gradient is neglected, an error of order Bi/3
// in the cooling rate (Incropera §5.1–5.2); here the salt layer has Bi ≈ h·L/k ≈ 40 W/m²K · 1.5 mm / 0.45 W/mK ≈ 0.13.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runLumped } from '../../sim/lumped/lumped.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';
import { firstCrossing, heatOffTime } from '../../sim/observe/verdict.ts';
import { assertClose } from '../support/assert-close.ts';

describe('runLumped() and runProblem() on the bench coupon', () => {
  const parsed = parseScenarioText(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8'));
  if (!parsed.ok) throw new Error('demo scenario invalid');
  const problem = parsed.problem;

  it('agree on the freezing time after heat-off within the lumped model\'s Biot error', () => {
    const lumped = runLumped(problem);
    expect(lumped.outcome).toBe('ok');
    const heatOff = heatOffTime(problem)!;
    const lumpedHalf = firstCrossing(Float64Array.from(lumped.tS), Float64Array.from(lumped.separatorLiquid), 0.5, heatOff, 'fall-below');
    const grid = runProblem(problem);
    if (grid.status !== 'ok') throw new Error(grid.status);
    const gridHalf = grid.summary.separator.half_frozen_at_s!;
    // freezing duration after heat-off: Bi ≈ 0.13 in the salt → allow 15 % (about Bi, a safe multiple of Bi/3)
    assertClose(lumpedHalf! - heatOff, gridHalf - heatOff, { rel: 0.15 }, 'time from heat-off to half-frozen, s');
  });

  it('agree on the plate-held steady temperature of the anode within 2 K', () => {
    const lumped = runLumped(problem);
    const grid = runProblem(problem);
    if (grid.status !== 'ok') throw new Error(grid.status);
    const heatOff = heatOffTime(problem)!;
    const j = lumped.tS.findIndex((t) => t >= heatOff) - 1;
    const anodeLumpedC = lumped.tK[j]![2]! - 273.15;
    const k = grid.record.tS.findIndex((t) => t >= heatOff);
    // near steady state under the plate the gradients inside the metal layers are below 1 K (k ≈ 150 W/mK, q ≈ 10 kW/m²)
    assertClose(anodeLumpedC, grid.record.layers[2]!.meanC[k]!, { abs: 2 }, 'anode mean temperature at heat-off, °C');
  });
});

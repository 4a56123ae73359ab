/**
 * The 1D grid's accepted steps as solver-neutral observations (physics/observation.ts): what the recorder reads,
 * filled from evolve()'s StepReport outside the time loop. Every step reuses one observation: its layer samples are
 * views (subarray) into the loop's own buffers, bound once (the loop's buffers live as long as the run), so a step
 * costs a few field writes and allocates nothing. Valid, like the StepReport, until the generator resumes.
 */
import type { Grid } from '../grid/mesh.ts';
import type { EnergyChannels, FaceSample, LayerSamples, ObservationLayout, PlateChannel, StepObservation } from '../physics/observation.ts';
import type { Problem } from '../physics/problem.ts';
import { conditionAt } from '../physics/problem.ts';
import type { StepReport } from './evolve.ts';

type Writable<T> = { -readonly [K in keyof T]: T[K] };

/** The layout of a grid's observations: one sample per cell, weighted by its width, at its centre. */
export function gridLayout(problem: Problem, grid: Grid): ObservationLayout {
  return {
    layers: problem.layers.map((l, li) => {
      const start = grid.layerStart[li]!;
      const end = grid.layerEnd[li]!;
      return {
        index: li, id: l.id, separator: l.separator,
        material: grid.materials[start]!, // the grid's own enthalpy origin, one material per layer (mesh.ts)
        widthM: grid.dx.subarray(start, end),
        positionM: grid.xc.subarray(start, end),
      };
    }),
    bottomM: 0,
    topM: grid.totalM,
  };
}

export interface StepObserver {
  readonly layout: ObservationLayout;
  /** The observation of an accepted step (the same object each time, refilled). */
  observe(step: StepReport): StepObservation;
}

export function createStepObserver(problem: Problem, grid: Grid): StepObserver {
  const layout = gridLayout(problem, grid);
  const n = grid.n;
  const empty = new Float64Array(0);
  const layers: Writable<LayerSamples>[] = layout.layers.map((l) => ({
    ...l, temperatureK: empty, enthalpy: empty, stageEnthalpy: empty, startHeatRate: empty, stageHeatRate: empty,
  }));
  const plates: [Writable<PlateChannel>, Writable<PlateChannel>] = [
    { heaterJ: 0, storedJ: 0, powerW: 0, plateK: NaN, held: false, heldWithinS: NaN },
    { heaterJ: 0, storedJ: 0, powerW: 0, plateK: NaN, held: false, heldWithinS: NaN },
  ];
  const energy: Writable<EnergyChannels> = { bottomJ: 0, topJ: 0, generatedJ: 0, edgesJ: 0, plates };
  const bottom: Writable<FaceSample> = { temperatureK: NaN, condition: conditionAt(problem.bottom, 0) };
  const top: Writable<FaceSample> = { temperatureK: NaN, condition: conditionAt(problem.top, 0) };
  const obs: Writable<StepObservation> = { t0: 0, tStage: 0, t1: 0, initial: true, eventFired: false, layers, bottom, top, energy };
  let boundT: Float64Array | undefined;
  let boundU: Float64Array | undefined;

  /**
   * Points the samples at the loop's buffers (once: they are the loop's own for the whole run). The step's start
   * rates are F0: the loop reports a step before it accepts it, so F0 still holds the rates at t0 (after a schedule
   * change at t0, under the new conditions).
   */
  const bind = (T: Float64Array, buf: StepReport['buf']): void => {
    layers.forEach((l, li) => {
      // node i + 1 of the loop's n+2 layout is cell i
      const from = grid.layerStart[li]! + 1;
      const to = grid.layerEnd[li]! + 1;
      l.temperatureK = T.subarray(from, to);
      l.enthalpy = buf.U1.subarray(from, to);
      l.stageEnthalpy = buf.Ug.subarray(from, to);
      l.startHeatRate = buf.F0.subarray(from, to);
      l.stageHeatRate = buf.Fg.subarray(from, to);
    });
    boundT = T; boundU = buf.U1;
  };

  function observe(step: StepReport): StepObservation {
    const { ws, buf, cond } = step;
    if (ws.T !== boundT || buf.U1 !== boundU) bind(ws.T, buf);
    obs.t0 = step.t0;
    obs.tStage = step.tg;
    obs.t1 = step.t1;
    obs.initial = step.t1 === 0;
    obs.eventFired = step.switched;
    bottom.temperatureK = ws.T[0]!;
    bottom.condition = cond.bottom;
    top.temperatureK = ws.T[n + 1]!;
    top.condition = cond.top;
    energy.bottomJ = step.bottomJ;
    energy.topJ = step.topJ;
    energy.generatedJ = step.sourceJ;
    energy.edgesJ = step.edgeJ;
    for (const side of [0, 1] as const) {
      const c = side === 0 ? cond.bottom : cond.top;
      const p = plates[side];
      if (obs.initial) {
        // the initial state: no heat yet; the plate as it starts, the power about to be applied
        const node = ws.plates[side];
        p.heaterJ = 0;
        p.storedJ = 0;
        p.powerW = c.kind === 'heater' ? node.powerWPerM2 * c.heater.areaM2 : 0;
        p.plateK = node.tK;
        p.held = false;
        p.heldWithinS = NaN;
      } else {
        const s = step.plates[side];
        p.heaterJ = s.heaterJ;
        p.storedJ = s.storedJ;
        p.powerW = s.powerW;
        p.plateK = s.plateK;
        p.held = s.held;
        p.heldWithinS = s.heldWithinS;
      }
    }
    return obs;
  }

  return { layout, observe };
}

/**
 * The lumped thermal network: one node per layer, integrated by odex (Hairer & Wanner's non-stiff extrapolation
 * method, GBS/ODEX; Solving ODEs I, §II.9). A quick estimate, and an independent cross-check of the grid solver: it
 * shares only the material and face models, not the discretisation, the time stepping or the event logic.
 *   C-free form, per unit area: dE_i/dt = Q_{i−1,i} − Q_{i,i+1} + s_i·t_i,  E_i = t_i·H_i(T_i),
 *   Q_{i,i+1} = (T_i − T_{i+1}) / (t_i/(2k_i) + R_contact + t_{i+1}/(2k_{i+1})),
 * and each outer layer exchanges heat with its face condition at its own node temperature (Biot ≪ 1 assumed).
 *
 * observeLumped() shows the same run as the grid's solver-neutral observations (physics/observation.ts: one sample per
 * layer, weighted by its thickness), so the grid's recorder and verdicts summarise it unchanged (run.ts
 * runLumpedProblem). For the ledger it integrates the heat through each face and the heat generated as three more
 * components of the system: odex's extrapolation is a linear combination of rate evaluations, so the stored heat
 * ΣE changes by exactly what those three carry in (a linear invariant of the method), to round-off.
 */
import { Outcome, Solver } from 'odex';
import { faceHeatIn, type FaceContext } from '../physics/faces.ts';
import { conductivityAt, enthalpyAt, liquidFractionOf, sensibleCapacity, temperatureOf } from '../physics/material.ts';
import type { FaceCondition, Problem } from '../physics/problem.ts';
import { facingOf } from '../physics/natural-convection.ts';
import { breakpoints, characteristicLengthM, conditionAt, sourceAt } from '../physics/problem.ts';
import type { EnergyChannels, FaceSample, LayerSamples, ObservationLayout, StepObservation } from '../physics/observation.ts';
import { NO_PLATE } from '../physics/observation.ts';

export const lumpedDefaults = {
  /** odex tolerances on E (J/m²): relative, and absolute as the energy of this many kelvin in each layer. */
  relativeTolerance: 1e-8,
  absoluteToleranceK: 1e-6,
  maxSteps: 200_000,
} as const;

export interface LumpedTrace {
  readonly tS: number[];
  /** Node temperatures, K, per output point. */
  readonly tK: number[][];
  /** Volume-mean liquid fraction of the separator layers at each point (0 when there are none). */
  readonly separatorLiquid: number[];
  readonly outcome: 'ok' | 'failed';
}

/** Integrates the lumped network over the whole run, reporting at every accepted odex step. Refuses, by throwing, cell terms, heater and bench faces. */
export function runLumped(problem: Problem): LumpedTrace {
  const layers = problem.layers;
  const trace: LumpedTrace = { tS: [], tK: [], separatorLiquid: [], outcome: 'ok' };
  const sepWidth = layers.reduce((a, l) => a + (l.separator ? l.thicknessM : 0), 0);
  const outcome = integrate(problem, false, (t, state, temps) => {
    trace.tS.push(t);
    trace.tK.push(Array.from(temps));
    let f = 0;
    layers.forEach((l, i) => {
      if (l.separator) f += liquidFractionOf(l.material, state[i]! / l.thicknessM, temps[i]!) * l.thicknessM;
    });
    trace.separatorLiquid.push(sepWidth > 0 ? f / sepWidth : 0);
  });
  return outcome === 'ok' ? trace : { ...trace, outcome: 'failed' };
}

type Writable<T> = { -readonly [K in keyof T]: T[K] };

/** The layout of the lumped network's observations: one sample per layer, its thickness, at its mid-plane. */
export function lumpedLayout(problem: Problem): ObservationLayout {
  let base = 0;
  const layers = problem.layers.map((l, li) => {
    const at = base + l.thicknessM / 2;
    base += l.thicknessM;
    return { index: li, id: l.id, separator: l.separator, material: l.material, widthM: Float64Array.of(l.thicknessM), positionM: Float64Array.of(at) };
  });
  return { layers, bottomM: 0, topM: base };
}

/**
 * Integrates the lumped network over the whole run and hands `onStep` an observation of the starting state (a step
 * of zero length) and of every accepted odex step (no point inside a step: tStage = t1). The observation is reused:
 * valid until the next call. A face is shown at the temperature the network gives it: a held face at its held
 * temperature, any other at its layer's node (Biot ≪ 1). Refuses, by throwing, what the network does not model.
 */
export function observeLumped(problem: Problem, onStep: (obs: StepObservation) => void): 'ok' | 'failed' {
  const layout = lumpedLayout(problem);
  const n = problem.layers.length;
  const samples: Writable<LayerSamples>[] = layout.layers.map((l) => {
    const enthalpy = new Float64Array(1);
    return { ...l, temperatureK: new Float64Array(1), enthalpy, stageEnthalpy: enthalpy };
  });
  const energy: Writable<EnergyChannels> = { bottomJ: 0, topJ: 0, generatedJ: 0, edgesJ: 0, plates: [NO_PLATE, NO_PLATE] };
  const bottom: Writable<FaceSample> = { temperatureK: NaN, condition: conditionAt(problem.bottom, 0) };
  const top: Writable<FaceSample> = { temperatureK: NaN, condition: conditionAt(problem.top, 0) };
  const obs: Writable<StepObservation> = { t0: 0, tStage: 0, t1: 0, initial: true, eventFired: false, layers: samples, bottom, top, energy };
  const last = { t: 0, bottomJ: 0, topJ: 0, generatedJ: 0 };
  const faceK = (c: FaceSample['condition'], nodeK: number): number => (c.kind === 'fixed' ? c.tK : nodeK);
  return integrate(problem, true, (t, state, temps, bottomCondition, topCondition) => {
    obs.initial = t === 0;
    obs.t0 = obs.initial ? 0 : last.t;
    obs.tStage = t;
    obs.t1 = t;
    for (let i = 0; i < n; i++) {
      const s = samples[i]!;
      s.temperatureK[0] = temps[i]!;
      s.enthalpy[0] = state[i]! / problem.layers[i]!.thicknessM;
    }
    bottom.condition = bottomCondition;
    top.condition = topCondition;
    bottom.temperatureK = faceK(bottomCondition, temps[0]!);
    top.temperatureK = faceK(topCondition, temps[n - 1]!);
    energy.bottomJ = state[n]! - last.bottomJ;
    energy.topJ = state[n + 1]! - last.topJ;
    energy.generatedJ = state[n + 2]! - last.generatedJ;
    last.t = t;
    last.bottomJ = state[n]!;
    last.topJ = state[n + 1]!;
    last.generatedJ = state[n + 2]!;
    onStep(obs);
  });
}

/**
 * The integration itself. With `channels`, three more components carry the heat in through the bottom face, the top
 * face and by generation, J/m² since t = 0. `report` sees t = 0 and every accepted step: the state, the node
 * temperatures (K) and the face conditions of the interval.
 */
function integrate(problem: Problem, channels: boolean,
  report: (t: number, state: readonly number[], temps: Float64Array, bottom: FaceCondition, top: FaceCondition) => void): 'ok' | 'failed' {
  if (problem.layers.some((l) => (l.terms?.length ?? 0) > 0)) {
    throw new Error('the lumped network (runLumped, observeLumped) has no cell terms (side-wall losses, temperature-dependent sources); run the grid solver (runProblem)');
  }
  const layers = problem.layers;
  const n = layers.length;
  const lengthM = characteristicLengthM(problem.footprint);
  const bottomCtx: FaceContext = { facing: facingOf('bottom'), lengthM };
  const topCtx: FaceContext = { facing: facingOf('top'), lengthM };
  const scratch = new Float64Array(2);
  const hints = new Int32Array(n);
  const temps = new Float64Array(n);
  const stateOf = (E: readonly number[]) => {
    for (let i = 0; i < n; i++) {
      hints[i] = temperatureOf(layers[i]!.material.enthalpy, E[i]! / layers[i]!.thicknessM, hints[i]!, scratch);
      temps[i] = scratch[0]!;
    }
  };
  const faceIn = (c: FaceCondition, ctx: FaceContext, i: number, E: number) => {
    const layer = layers[i]!;
    if (c.kind === 'heater') throw new Error('runLumped: the lumped network has no heater body; run the grid solver (runProblem) for a heater face');
    if (c.kind === 'bench') throw new Error('runLumped: the lumped network has no bench body; run the grid solver (runProblem) for a bench face');
    if (c.kind === 'fixed') {
      const k = conductivityAt(layer.material, E / layer.thicknessM, temps[i]!);
      return (c.tK - temps[i]!) / (layer.thicknessM / (2 * k));
    }
    return faceHeatIn(c, ctx, temps[i]!, scratch);
  };
  let E = layers.map((l) => l.thicknessM * enthalpyAt(l.material.enthalpy, problem.initialK));
  if (channels) E.push(0, 0, 0);
  const record = (t: number, state: number[], bottom: FaceCondition, top: FaceCondition) => {
    stateOf(state);
    report(t, state, temps, bottom, top);
  };
  record(0, E, conditionAt(problem.bottom, 0), conditionAt(problem.top, 0));
  let t = 0;
  for (const end of breakpoints(problem)) {
    const bottom = conditionAt(problem.bottom, t);
    const top = conditionAt(problem.top, t);
    const sources = layers.map((l) => sourceAt(l, t));
    const rate = (_x: number, y: number[]): number[] => {
      stateOf(y);
      const dE = new Array<number>(channels ? n + 3 : n).fill(0);
      for (let i = 0; i + 1 < n; i++) {
        const a = layers[i]!;
        const b = layers[i + 1]!;
        const r = a.thicknessM / (2 * conductivityAt(a.material, y[i]! / a.thicknessM, temps[i]!))
          + (problem.contactResistances[i] ?? 0)
          + b.thicknessM / (2 * conductivityAt(b.material, y[i + 1]! / b.thicknessM, temps[i + 1]!));
        const q = (temps[i]! - temps[i + 1]!) / r;
        dE[i]! -= q;
        dE[i + 1]! += q;
      }
      const qBottom = faceIn(bottom, bottomCtx, 0, y[0]!);
      const qTop = faceIn(top, topCtx, n - 1, y[n - 1]!);
      dE[0]! += qBottom;
      dE[n - 1]! += qTop;
      let generated = 0;
      for (let i = 0; i < n; i++) {
        const g = sources[i]! * layers[i]!.thicknessM;
        dE[i]! += g;
        generated += g;
      }
      if (channels) { dE[n] = qBottom; dE[n + 1] = qTop; dE[n + 2] = generated; }
      return dE;
    };
    const solver = new Solver(channels ? n + 3 : n);
    solver.relativeTolerance = lumpedDefaults.relativeTolerance;
    // absolute tolerance on E: the share of a kelvin, times the layer's sensible capacity per area at the start
    const absolute = layers.map((l) =>
      lumpedDefaults.absoluteToleranceK * l.thicknessM * sensibleCapacity(l.material, problem.initialK));
    // the channels' heat: the largest layer's, so they never ask for more accuracy than the heat they carry in
    if (channels) { const most = Math.max(...absolute); absolute.push(most, most, most); }
    solver.absoluteTolerance = absolute;
    solver.maxSteps = lumpedDefaults.maxSteps;
    const result = solver.solve(rate, t, E, end, (_nr, _xOld, x, y) => { if (x > t) record(x, y, bottom, top); });
    if (result.outcome !== Outcome.Converged) return 'failed';
    E = result.y;
    t = end;
  }
  return 'ok';
}

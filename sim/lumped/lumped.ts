/**
 * The lumped thermal network: one node per layer, integrated by odex (Hairer & Wanner's non-stiff extrapolation
 * method, GBS/ODEX; Solving ODEs I, §II.9). A quick estimate, and an independent cross-check of the grid solver: it
 * shares only the material and face models, not the discretisation, the time stepping or the event logic.
 *   C-free form, per unit area: dE_i/dt = Q_{i−1,i} − Q_{i,i+1} + s_i·t_i,  E_i = t_i·H_i(T_i),
 *   Q_{i,i+1} = (T_i − T_{i+1}) / (t_i/(2k_i) + R_contact + t_{i+1}/(2k_{i+1})),
 * and each outer layer exchanges heat with its face condition at its own node temperature (Biot ≪ 1 assumed).
 */
import { Outcome, Solver } from 'odex';
import { faceHeatIn, type FaceContext } from '../physics/faces.ts';
import { conductivityAt, enthalpyAt, liquidFractionOf, sensibleCapacity, temperatureOf } from '../physics/material.ts';
import type { FaceCondition, Problem } from '../physics/problem.ts';
import { facingOf } from '../physics/natural-convection.ts';
import { breakpoints, characteristicLengthM, conditionAt, sourceAt } from '../physics/problem.ts';

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

/** Integrates the lumped network over the whole run, reporting at every accepted odex step. */
export function runLumped(problem: Problem): LumpedTrace {
  const layers = problem.layers;
  const n = layers.length;
  const lengthM = characteristicLengthM(problem.footprint);
  const bottomCtx: FaceContext = { facing: facingOf('bottom'), lengthM };
  const topCtx: FaceContext = { facing: facingOf('top'), lengthM };
  const scratch = new Float64Array(2);
  const hints = new Int32Array(n);
  const temps = new Float64Array(n);
  const stateOf = (E: number[]) => {
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
  const trace: LumpedTrace = { tS: [], tK: [], separatorLiquid: [], outcome: 'ok' };
  const sepWidth = layers.reduce((a, l) => a + (l.separator ? l.thicknessM : 0), 0);
  const record = (t: number, state: number[]) => {
    stateOf(state);
    trace.tS.push(t);
    trace.tK.push(Array.from(temps));
    let f = 0;
    layers.forEach((l, i) => {
      if (l.separator) f += liquidFractionOf(l.material, state[i]! / l.thicknessM, temps[i]!) * l.thicknessM;
    });
    trace.separatorLiquid.push(sepWidth > 0 ? f / sepWidth : 0);
  };
  record(0, E);
  let t = 0;
  for (const end of breakpoints(problem)) {
    const bottom = conditionAt(problem.bottom, t);
    const top = conditionAt(problem.top, t);
    const sources = layers.map((l) => sourceAt(l, t));
    const rate = (_x: number, y: number[]): number[] => {
      stateOf(y);
      const dE = new Array<number>(n).fill(0);
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
      dE[0]! += faceIn(bottom, bottomCtx, 0, y[0]!);
      dE[n - 1]! += faceIn(top, topCtx, n - 1, y[n - 1]!);
      for (let i = 0; i < n; i++) dE[i]! += sources[i]! * layers[i]!.thicknessM;
      return dE;
    };
    const solver = new Solver(n);
    solver.relativeTolerance = lumpedDefaults.relativeTolerance;
    // absolute tolerance on E: the share of a kelvin, times the layer's sensible capacity per area at the start
    solver.absoluteTolerance = layers.map((l) =>
      lumpedDefaults.absoluteToleranceK * l.thicknessM * sensibleCapacity(l.material, problem.initialK));
    solver.maxSteps = lumpedDefaults.maxSteps;
    const result = solver.solve(rate, t, E, end, (_nr, _xOld, x, y) => { if (x > t) record(x, y); });
    if (result.outcome !== Outcome.Converged) return { ...trace, outcome: 'failed' };
    E = result.y;
    t = end;
  }
  return trace;
}

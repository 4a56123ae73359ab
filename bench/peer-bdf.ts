/**
 * The scripted peer of the benchmark: what a practitioner would write without freezeline — the method of lines on the
 * same semi-discrete equations (sim/grid/discretization.ts: the same cells, face nodes, enthalpy curves and face
 * terms), integrated by a plain variable-step BDF of orders 1–2 with a tridiagonal Newton, and the separator's
 * events read off the accepted steps by linear interpolation. There is no stiff integrator on npm we would trust for
 * this (odex, installed here, is Hairer's non-stiff extrapolation code: ~200 000 steps on a stiff network, see
 * ../shared/TOOLCHAIN.md), so the peer is written here, in the textbook form:
 *
 *   variable-step BDF2 (Hairer & Wanner, Solving ODEs II, §III.5; ω = h_n/h_{n−1}):
 *     y_{n+1} − (1+ω)²/(1+2ω)·y_n + ω²/(1+2ω)·y_{n−1} = (1+ω)/(1+2ω)·h·f(y_{n+1}),
 *   error measure: the distance between the corrector and the linear extrapolation of the last two states, ÷3 (÷2
 *   at order 1), in kelvin-equivalent enthalpy (ΔH/ρc_p) — the simplest estimate a script would use; it is O(h²),
 *   so conservative for BDF2, and the step ratio is clamp(0.9·err^(−1/2), 0.2, 2); BDF1 for the first step and
 *   after every schedule change (the history is not smooth across it).
 *
 * Newton solves Δx·(H − B) − h_eff·F(U) = 0 with freezeline's own residual and tridiagonal Jacobian (the same physics,
 * by construction), full steps, no kink handling: the peer is the plain script, not freezeline's integrator.
 */
import type { StepConditions } from '../sim/grid/discretization.ts';
import { createWorkspace, evaluate, stageJacobian, stageResidual, updateCapacity } from '../sim/grid/discretization.ts';
import type { Grid } from '../sim/grid/mesh.ts';
import { solveTridiagonal } from '../sim/grid/tridiagonal.ts';
import { liquidFractionOf } from '../sim/physics/material.ts';
import type { Problem } from '../sim/physics/problem.ts';
import { breakpoints, characteristicLengthM, conditionAt, sourceAt } from '../sim/physics/problem.ts';
import { settleFaces } from '../sim/grid/line-system.ts';
import { initialState } from '../sim/time/evolve.ts';

export interface PeerResult {
  readonly moltenS: number | null;
  readonly halfFrozenS: number | null;
  readonly frozenS: number | null;
  readonly steps: number;
  readonly rejected: number;
  readonly newton: number;
  readonly ok: boolean;
}

/** Runs the peer on `grid` with local error tolerance `tolK` (K). heatOffS: when the heat input ends (from freezeline's summary). */
export function runPeer(problem: Problem, grid: Grid, tolK: number, heatOffS: number): PeerResult {
  const n = grid.n;
  const m = n + 2;
  const lengthM = characteristicLengthM(problem.footprint);
  const ws = createWorkspace(grid, { facing: 'down', lengthM }, { facing: 'up', lengthM });
  const source = new Float64Array(n);
  const condAt = (t: number): StepConditions => {
    for (let i = 0; i < n; i++) source[i] = sourceAt(problem.layers[grid.layerOf[i]!]!, t);
    return { bottom: conditionAt(problem.bottom, t), top: conditionAt(problem.top, t), source };
  };
  let yPrev = new Float64Array(m);
  let y = new Float64Array(m);
  const yNew = new Float64Array(m);
  const pred = new Float64Array(m);
  const B = new Float64Array(n);
  const res = new Float64Array(m);
  const delta = new Float64Array(m);
  const work = new Float64Array(m);
  initialState(problem, grid, y);
  let cond = condAt(0);
  settleFaces(ws, y, cond, 1e-6);
  updateCapacity(ws);
  const sep = problem.layers.findIndex((l) => l.separator);
  const lo = grid.layerStart[sep]!;
  const hi = grid.layerEnd[sep]!;
  const thick = problem.layers[sep]!.thicknessM;
  // event indicators: min over cells of (H − H_liquidus) (molten when ≥ 0), mean liquid fraction − ½, max (H − H_solidus)
  const indicators = (u: Float64Array): [number, number, number] => {
    let least = Infinity; let most = -Infinity; let f = 0;
    for (let i = lo; i < hi; i++) {
      const mat = grid.materials[i]!;
      const melt = mat.melt!;
      const h = u[i + 1]!;
      least = Math.min(least, (h - melt.hLiquidus) / (melt.hLiquidus - melt.hSolidus));
      most = Math.max(most, (h - melt.hSolidus) / (melt.hLiquidus - melt.hSolidus));
      f += liquidFractionOf(mat, h, ws.T[i + 1]!) * grid.dx[i]!;
    }
    return [least, f / thick - 0.5, most];
  };
  let moltenS: number | null = null;
  let halfS: number | null = null;
  let frozenS: number | null = null;
  let before = indicators(y);
  const breaks = breakpoints(problem);
  let t = 0;
  let h = 1e-3;
  let hPrev = 0;
  let order = 1;
  let steps = 0; let rejected = 0; let newton = 0;
  while (t < problem.durationS) {
    const next = breaks.find((b) => b > t + 1e-9) ?? problem.durationS;
    let step = Math.min(h, next - t);
    const landing = t + step >= next - 1e-9 * next;
    if (landing) step = next - t;
    const w = hPrev > 0 ? step / hPrev : 1;
    const bdf2 = order === 2;
    const beta = bdf2 ? (1 + w) / (1 + 2 * w) : 1;
    for (let i = 0; i < n; i++) {
      B[i] = bdf2 ? ((1 + w) * (1 + w) * y[i + 1]! - w * w * yPrev[i + 1]!) / (1 + 2 * w) : y[i + 1]!;
    }
    // predictor: the last state (order 1) or the linear extrapolation of the last two; also the Newton guess
    for (let j = 0; j < m; j++) pred[j] = bdf2 ? y[j]! + w * (y[j]! - yPrev[j]!) : y[j]!;
    yNew.set(pred);
    let converged = false;
    for (let iter = 0; iter < 12; iter++) {
      evaluate(ws, yNew, cond);
      stageResidual(ws, yNew, B, beta * step, cond, res);
      stageJacobian(ws, beta * step, cond);
      if (!solveTridiagonal(m, ws.lower, ws.diag, ws.upper, res, delta, work)) break;
      newton++;
      let worst = 0;
      for (let j = 0; j < m; j++) {
        yNew[j] = yNew[j]! - delta[j]!;
        const s = j === 0 || j === m - 1 ? Math.abs(delta[j]!) : Math.abs(delta[j]!) / ws.capacity[j - 1]!;
        if (!(s <= worst)) worst = s;
      }
      if (worst <= 0.01 * tolK) { converged = true; break; }
      if (!Number.isFinite(worst)) break;
    }
    let err = 0;
    if (converged) {
      for (let i = 0; i < n; i++) {
        const e = Math.abs(yNew[i + 1]! - pred[i + 1]!) / ws.capacity[i]! / (bdf2 ? 3 : 2);
        if (e > err) err = e;
      }
      err /= tolK;
    }
    if (!converged || err > 1) {
      rejected++;
      h = step * (converged ? Math.max(0.2, 0.9 * err ** (-1 / 2)) : 0.25);
      if (h < 1e-9) return { moltenS, halfFrozenS: halfS, frozenS, steps, rejected, newton, ok: false };
      continue;
    }
    steps++;
    evaluate(ws, yNew, cond);
    const after = indicators(yNew);
    const t1 = landing ? next : t + step;
    const cross = (k: number, up: boolean) => {
      const a = before[k]!; const b = after[k]!;
      if (up ? a < 0 && b >= 0 : a > 0 && b <= 0) return t + ((t1 - t) * a) / (a - b);
      return null;
    };
    if (moltenS === null) moltenS = cross(0, true);
    if (t1 > heatOffS && halfS === null) halfS = cross(1, false);
    if (halfS !== null && frozenS === null) frozenS = cross(2, false);
    before = after;
    const tmp = yPrev; yPrev = y; y = tmp; y.set(yNew);
    hPrev = step;
    t = t1;
    updateCapacity(ws);
    h = step * Math.min(2, Math.max(0.2, err > 0 ? 0.9 * err ** (-1 / 2) : 2));
    order = 2;
    if (landing && t < problem.durationS) {
      cond = condAt(t);
      settleFaces(ws, y, cond, 1e-6);
      order = 1; // a schedule change: restart at order 1 (the history is not smooth across it)
      h = Math.min(h, 0.5);
    }
  }
  return { moltenS, halfFrozenS: halfS, frozenS, steps, rejected, newton, ok: true };
}

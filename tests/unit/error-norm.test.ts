// LineSystem.errorNorm() (grid/line-system.ts), worked by hand on a six-cell stack: the temperature part of the local
// error is each cell's |z|·(dT/dH)/tol_K, taken over a layer as its largest cell, except over a melting separator (a
// cell in or across its melt in the step, or a front inside it: part liquid, part solid), where it is the
// width-weighted RMS √(Σ Δx·e²/Σ Δx). The numbers are our own.

import { describe, it } from 'vitest';
import type { StepConditions } from '../../sim/grid/discretization.ts';
import { createWorkspace, evaluate } from '../../sim/grid/discretization.ts';
import type { ErrorScale } from '../../sim/grid/line-system.ts';
import { LineSystem } from '../../sim/grid/line-system.ts';
import type { Grid } from '../../sim/grid/mesh.ts';
import { buildMaterial, enthalpyAt } from '../../sim/physics/material.ts';
import { assertClose } from '../support/assert-close.ts';

// constant ρ = 2000 kg/m³ and c_p = 1000 J/(kg·K): dT/dH = 1/(2e6) K·m³/J in the solid, so z = 2e6·e·tol_K J/m³
// gives a cell the temperature error e (in tolerances)
const salt = buildMaterial({
  name: 'salt', title: 'salt', density: 2000, limits: [], sources: {},
  conductivity: { tK: Float64Array.of(300), y: Float64Array.of(1) },
  specificHeat: { tK: Float64Array.of(300), y: Float64Array.of(1000) },
  melt: { solidusK: 420, liquidusK: 430, latentJPerKg: 2e5 },
});
const TOL_K = 0.2;
const RHO_C = 2e6;

/**
 * Layer 0 (cells 0–1) and layer 1 (cells 2–5), all of the salt, Δx = 0.1 mm; U at 400 K but `mushCell` two-phase
 * (420–430 K) and `hotCell`, if given, liquid at 440 K (its layer's hottest; a list: each of them liquid).
 */
function norm(separator: boolean[] | undefined, mushCell: number, errorCell: number, e: number,
  hotCell?: number | readonly number[]): number {
  const n = 6;
  const dx = new Float64Array(n).fill(1e-4);
  const grid: Grid = {
    n, dx, xc: new Float64Array(n), totalM: 6e-4, layerOf: Int32Array.of(0, 0, 1, 1, 1, 1),
    materials: Array.from({ length: n }, () => salt), contactAbove: new Float64Array(n),
    layerStart: Int32Array.of(0, 2), layerEnd: Int32Array.of(2, 6),
  };
  const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
  const U = new Float64Array(n + 2);
  U.fill(400);
  for (let i = 0; i < n; i++) U[i + 1] = enthalpyAt(salt.enthalpy, 400);
  U[mushCell + 1] = (salt.melt!.hSolidus + salt.melt!.hLiquidus) / 2;
  for (const hot of hotCell === undefined ? [] : typeof hotCell === 'number' ? [hotCell] : hotCell) {
    U[hot + 1] = enthalpyAt(salt.enthalpy, 440);
  }
  const cond: StepConditions = { bottom: { kind: 'fixed', tK: 400 }, top: { kind: 'fixed', tK: 400 }, source: new Float64Array(n) };
  evaluate(ws, U, cond);
  const scale: ErrorScale = { toleranceK: TOL_K, liquidFraction: 4e-3, gridRefine: 1, separator };
  const line = new LineSystem(ws, scale, () => undefined, cond);
  line.markStart();
  const z = new Float64Array(n + 2);
  z[errorCell + 1] = RHO_C * e * TOL_K;
  // U1 = U0: the secant falls back to the cell's own dT/dH (1/ρc_p in the solid); the two-phase cell has z = 0, so it
  // adds nothing to the molten-thickness part, but it marks its layer as melting
  return line.errorNorm(U, U, z);
}

describe('LineSystem.errorNorm(): the temperature part, per layer', () => {
  it('a separator with a two-phase cell counts its cells by width-weighted RMS: one cell at 3 tolerances of four → 1.5', () => {
    // √(Δx·3²/(4·Δx)) = 3/2
    assertClose(norm([false, true], 2, 4, 3), 1.5, { rel: 1e-12 }, 'RMS over the separator');
  });

  it('the same error counts whole in a layer with no cell in its melt', () => {
    // the two-phase cell in the other layer: the separator is not melting, so its largest cell's 3 stands
    assertClose(norm([false, true], 0, 4, 3), 3, { rel: 1e-12 }, 'separator not melting');
    assertClose(norm([true, false], 0, 4, 3), 3, { rel: 1e-12 }, 'electrode not melting');
  });

  it('a melting layer not marked separator takes the larger of the RMS and its hottest cell\'s error', () => {
    // the error on a solid cell, not the hottest (the two-phase cell is): the RMS, 3/2
    assertClose(norm([true, false], 2, 4, 3), 1.5, { rel: 1e-12 }, 'melting electrode, error beside the front');
    assertClose(norm(undefined, 2, 4, 3), 1.5, { rel: 1e-12 }, 'no layer marked');
    // the error on its hottest cell (liquid, 440 K): that cell's own 3, as its margin reads it
    assertClose(norm([true, false], 2, 5, 3, 5), 3, { rel: 1e-12 }, 'melting electrode, error on its hottest cell');
    // a separator's hottest cell is not held on its own: the RMS
    assertClose(norm([false, true], 2, 5, 3, 5), 1.5, { rel: 1e-12 }, 'melting separator, error on its hottest cell');
  });

  it('a layer with a front inside it melts, though no cell be in its melt: part liquid, part solid', () => {
    // the two-phase cell in layer 0; layer 1 has its top cell liquid (440 K) and three solid: an isothermal front
    // between two cells. A separator: the RMS, 3/2 (by its largest cell it would be 3)
    assertClose(norm([false, true], 0, 4, 3, 5), 1.5, { rel: 1e-12 }, 'separator, front between cells');
    // an electrode: the larger of the RMS and its hottest cell's error (the liquid cell, no error): 3/2
    assertClose(norm([true, false], 0, 4, 3, 5), 1.5, { rel: 1e-12 }, 'electrode, front between cells');
    // all of layer 1 liquid: no front in it, its largest cell's 3 stands
    assertClose(norm([false, true], 0, 4, 3, [2, 3, 4, 5]), 3, { rel: 1e-12 }, 'separator all liquid');
  });

  it('the largest layer decides: an electrode cell at 2 beside a melting separator with no error gives 2', () => {
    // layer 0's largest is 2 (cell 1); layer 1, melting, has RMS 0
    assertClose(norm([false, true], 2, 1, 2), 2, { rel: 1e-12 }, 'electrode beside a melting separator');
  });
});

/**
 * A ten-cell separator of the salt, Δx = 0.1 mm (level-0 cells: the band is EVENT_BAND_CELLS × 0.1 mm = 0.2 mm): at the
 * start `liquidStart` cells liquid (440 K) from the bottom, then one cell half way through its melt, the rest solid
 * (400 K); at the end likewise with `liquidEnd`. The error z sits on the start's two-phase cell, sized so that its
 * molten-thickness part is e: Δx·z/(tol_f·ρL)/Δx₀ = e with tol_f·ρL = 4e-3 × 4e8 J/m³ (above tol_K·ρc_p = 4e5).
 */
function frontNorm(liquidStart: number, liquidEnd: number, e: number): number {
  const n = 10;
  const grid: Grid = {
    n, dx: new Float64Array(n).fill(1e-4), xc: new Float64Array(n), totalM: 1e-3, layerOf: new Int32Array(n),
    materials: Array.from({ length: n }, () => salt), contactAbove: new Float64Array(n),
    layerStart: Int32Array.of(0), layerEnd: Int32Array.of(n),
  };
  const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
  const state = (liquid: number): Float64Array => {
    const U = new Float64Array(n + 2).fill(400);
    for (let i = 0; i < n; i++) {
      U[i + 1] = i < liquid ? enthalpyAt(salt.enthalpy, 440)
        : i === liquid ? (salt.melt!.hSolidus + salt.melt!.hLiquidus) / 2 : enthalpyAt(salt.enthalpy, 400);
    }
    return U;
  };
  const cond: StepConditions = { bottom: { kind: 'fixed', tK: 400 }, top: { kind: 'fixed', tK: 400 }, source: new Float64Array(n) };
  const U0 = state(liquidStart);
  const U1 = state(liquidEnd);
  evaluate(ws, U0, cond);
  const line = new LineSystem(ws, { toleranceK: TOL_K, liquidFraction: 4e-3, gridRefine: 1, separator: [true] }, () => undefined, cond);
  line.markStart();
  evaluate(ws, U1, cond);
  const z = new Float64Array(n + 2);
  z[liquidStart + 1] = 4e-3 * 4e8 * e;
  return line.errorNorm(U0, U1, z);
}

describe('LineSystem.errorNorm(): the molten-thickness part is held near the separator\'s events', () => {
  // the two-phase cell's own temperature error: z·(dT/dH)/tol_K with dH/dT = ρc_p + ρL/(10 K) = 4.2e7 J/(m³·K) in the
  // melt, taken by RMS over the ten cells (grid/line-system.ts errorNorm)
  const temperatureOnly = (e: number) => (4e-3 * 4e8 * e) / 4.2e7 / TOL_K / Math.sqrt(10);

  it('counts it within two level-0 cells of frozen, half or molten: 0.15, 0.45 and 0.85 mm molten of 1 mm → e', () => {
    // one, four and eight liquid cells plus the half cell: 0.15 mm from none, 0.05 mm from half, 0.15 mm from all
    for (const liquid of [1, 4, 8]) assertClose(frontNorm(liquid, liquid, 2), 2, { rel: 1e-12 }, `${liquid} liquid cells`);
  });

  it('leaves it to the temperature part away from them: 0.25 mm molten of 1 mm (0.25 mm from none and from half)', () => {
    assertClose(frontNorm(2, 2, 2), temperatureOnly(2), { rel: 1e-12 }, 'between events');
    assertClose(temperatureOnly(2), 0.1205, { rel: 1e-3 }, 'the temperature part, by hand');
  });

  it('counts it when the molten thickness crosses half the layer within the step, however far from it either end lies', () => {
    // 0.25 mm → 0.75 mm: both ends 0.25 mm from half
    const crossing = frontNorm(2, 7, 2);
    assertClose(crossing, 2, { rel: 1e-12 }, 'crossing half');
  });
});

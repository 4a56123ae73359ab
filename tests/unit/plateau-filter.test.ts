// LineSystem.assembleFilter() (grid/line-system.ts), worked by hand on a three-cell slab: the operator a step's error
// estimate is filtered through is the stage operator at the step's end, Δx + h·(G_below + G_above)·τ on a cell's
// diagonal, except that a cell that warmed over the step takes the larger of its τ = dT/dH at the start and the end.
// A cell that warmed from its solid branch onto its melt plateau keeps the solid's 1/ρc_p; one that cooled onto it
// keeps the plateau's 0. The numbers are our own.

import { describe, it } from 'vitest';
import type { StepConditions } from '../../sim/grid/discretization.ts';
import { createWorkspace, evaluate } from '../../sim/grid/discretization.ts';
import { LineSystem } from '../../sim/grid/line-system.ts';
import type { Grid } from '../../sim/grid/mesh.ts';
import { buildMaterial, enthalpyAt } from '../../sim/physics/material.ts';
import { assertClose } from '../support/assert-close.ts';

// k = 1 W/(m·K), ρc_p = 2e6 J/(m³·K) in both phases, an isothermal melt at 420 K
const salt = buildMaterial({
  name: 'salt', title: 'salt', density: 2000, limits: [], sources: {},
  conductivity: { tK: Float64Array.of(300), y: Float64Array.of(1) },
  specificHeat: { tK: Float64Array.of(300), y: Float64Array.of(1000) },
  melt: { solidusK: 420, liquidusK: 420, latentJPerKg: 2e5 },
});
const RHO_C = 2e6;
const DX = 1e-4;
const H = 0.01;
/** Conductances, W/(m²·K): a held face to its cell's centre k/(Δx/2), cell centre to cell centre k/Δx. */
const G_FACE = 1 / (DX / 2);
const G_CELL = 1 / DX;

/**
 * Three cells, both faces held at 400 K. The step starts at 410, 430 and 415 K and ends with the first cell warmed
 * onto its plateau, the second cooled onto it, and the third still solid at 416 K. Returns the line after
 * assembleFilter(H) (or assembleStage(H) with `stage`).
 */
function assembled(stage: boolean) {
  const n = 3;
  const grid: Grid = {
    n, dx: new Float64Array(n).fill(DX), xc: new Float64Array(n), totalM: n * DX, layerOf: new Int32Array(n),
    materials: [salt, salt, salt], contactAbove: new Float64Array(n), layerStart: Int32Array.of(0), layerEnd: Int32Array.of(n),
  };
  const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
  const cond: StepConditions = { bottom: { kind: 'fixed', tK: 400 }, top: { kind: 'fixed', tK: 400 }, source: new Float64Array(n) };
  const plateau = (salt.melt!.hSolidus + salt.melt!.hLiquidus) / 2;
  const U0 = Float64Array.of(400, enthalpyAt(salt.enthalpy, 410), enthalpyAt(salt.enthalpy, 430), enthalpyAt(salt.enthalpy, 415), 400);
  const U1 = Float64Array.of(400, plateau, plateau, enthalpyAt(salt.enthalpy, 416), 400);
  evaluate(ws, U0, cond);
  const line = new LineSystem(ws, { toleranceK: 0.2, liquidFraction: 4e-3, gridRefine: 1 }, () => undefined, cond);
  line.markStart();
  evaluate(ws, U1, cond);
  if (stage) line.assembleStage(H); else line.assembleFilter(H);
  return ws;
}

describe('LineSystem.assembleFilter(): a cell that warmed onto its plateau is filtered as the stiff cell it was', () => {
  it('the warmed cell keeps 1/ρc_p, the cooled one the plateau\'s 0, the solid one its own 1/ρc_p', () => {
    const { diag, lower, upper } = assembled(false);
    // cell 1 (row 1): warmed from 410 K onto the plateau: its start's τ = 1/ρc_p
    assertClose(diag[1]!, DX + (H * (G_FACE + G_CELL)) / RHO_C, { rel: 1e-12 }, 'warmed cell, diagonal');
    // its column in the row below: −h·G·τ of cell 1
    assertClose(lower[2]!, (-H * G_CELL) / RHO_C, { rel: 1e-12 }, 'warmed cell, in the next row');
    // cell 2: cooled from 430 K onto the plateau: the end's τ = 0, so its diagonal is Δx alone
    assertClose(diag[2]!, DX, { rel: 1e-12 }, 'cooled cell, diagonal');
    assertClose(upper[1]!, 0, { abs: 1e-30 }, 'cooled cell, in the row above');
    // cell 3: warmed from 415 to 416 K, solid at both ends: 1/ρc_p either way
    assertClose(diag[3]!, DX + (H * (G_CELL + G_FACE)) / RHO_C, { rel: 1e-12 }, 'solid cell, diagonal');
  });

  it('the stage operator at the same end state gives the warmed cell the plateau\'s 0', () => {
    // the contrast: what the estimate was filtered through before (and what Newton still solves with)
    const { diag, lower } = assembled(true);
    assertClose(diag[1]!, DX, { rel: 1e-12 }, 'warmed cell, diagonal');
    assertClose(lower[2]!, 0, { abs: 1e-30 }, 'warmed cell, in the next row');
  });
});

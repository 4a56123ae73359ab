/**
 * The layer stack cut into cell-centred finite volumes (Patankar 1980, ch. 4, "practice B": faces placed first, the
 * node at the centre of each cell). Inside a layer the faces follow a blend of uniform and cosine spacing, so cells are
 * finer at the layer's two faces (interfaces and exposed faces, where the gradients are steepest) and the size varies
 * smoothly, which keeps the scheme second order. A contact resistance sits on the face between two layers.
 */
import type { Material } from '../physics/material.ts';
import { enthalpyAt, withEnthalpyOrigin, writtenCurve } from '../physics/material.ts';
import type { Problem } from '../physics/problem.ts';
import { METRES_PER_MM } from '../physics/units.ts';

export const meshDefaults = {
  /** Share of cosine spacing in the blend: 0 is uniform; 0.5 makes end cells ~3× thinner than the middle ones at 8 cells. */
  cosineShare: 0.5,
} as const;

export interface Grid {
  /** Number of cells. */
  readonly n: number;
  /** Cell widths, m. */
  readonly dx: Float64Array;
  /** Cell centres, m from the bottom face. */
  readonly xc: Float64Array;
  /** Total thickness, m. */
  readonly totalM: number;
  /** Layer index of each cell. */
  readonly layerOf: Int32Array;
  /** Material of each cell, its enthalpy measured from the initial temperature (withEnthalpyOrigin). */
  readonly materials: readonly Material[];
  /** Contact resistance on the face above cell i (between cells i and i+1), m²·K/W; 0 inside a layer. */
  readonly contactAbove: Float64Array;
  /** First cell of each layer, and one past its last. */
  readonly layerStart: Int32Array;
  readonly layerEnd: Int32Array;
}

/** Cells in a layer: its own count if given, else proportional to thickness, at most `cap`, with a floor. */
export function cellsInLayer(thicknessM: number, own: number | undefined, cellsPerMm: number, minCells: number,
  cap = Number.POSITIVE_INFINITY): number {
  if (own !== undefined) return own;
  return Math.max(minCells, Math.min(cap, Math.ceil((thicknessM / METRES_PER_MM) * cellsPerMm)));
}

/** The numerics that set a layer's cells (Numerics, physics/problem.ts). */
export type CellRule = Pick<Problem['numerics'], 'cellsPerMm' | 'minCellsPerLayer' | 'separatorCellsPerMm' | 'minSeparatorCells' |
  'maxCellsPerLayer' | 'maxSeparatorCells'>;

/** Cells in a layer of the stack at level 0: its own count, else the separator's or the other layers' rule. */
export function cellsOfLayer(thicknessM: number, own: number | undefined, separator: boolean, n: CellRule): number {
  return separator
    ? cellsInLayer(thicknessM, own, n.separatorCellsPerMm, n.minSeparatorCells, n.maxSeparatorCells)
    : cellsInLayer(thicknessM, own, n.cellsPerMm, n.minCellsPerLayer, n.maxCellsPerLayer);
}

/** Face positions of `n` cells across [0, 1], finer at both ends. */
export function gradedFaces(n: number, cosineShare: number = meshDefaults.cosineShare): Float64Array {
  const faces = new Float64Array(n + 1);
  for (let j = 0; j <= n; j++) {
    const u = j / n;
    faces[j] = (1 - cosineShare) * u + cosineShare * 0.5 * (1 - Math.cos(Math.PI * u));
  }
  return faces;
}

export function buildGrid(problem: Problem, refine = 1): Grid {
  const { layers, numerics } = problem;
  // refinement multiplies each layer's count exactly, so refined grids are comparable cell for cell
  const counts = layers.map((l) => refine * cellsOfLayer(l.thicknessM, l.cells, l.separator, numerics));
  const n = counts.reduce((a, b) => a + b, 0);
  const dx = new Float64Array(n);
  const xc = new Float64Array(n);
  const layerOf = new Int32Array(n);
  const contactAbove = new Float64Array(Math.max(n - 1, 0));
  const layerStart = new Int32Array(layers.length);
  const layerEnd = new Int32Array(layers.length);
  const materials: Material[] = [];
  let cell = 0;
  let base = 0;
  layers.forEach((layer, li) => {
    const m = counts[li]!;
    const faces = gradedFaces(m);
    // the origin is the initial state as the file gives it, read on the curve as written (material.ts writtenCurve)
    const material = withEnthalpyOrigin(layer.material, enthalpyAt(writtenCurve(layer.material), problem.initialK));
    layerStart[li] = cell;
    for (let j = 0; j < m; j++) {
      const lo = base + faces[j]! * layer.thicknessM;
      const hi = base + faces[j + 1]! * layer.thicknessM;
      dx[cell] = hi - lo;
      xc[cell] = 0.5 * (lo + hi);
      layerOf[cell] = li;
      materials.push(material);
      cell++;
    }
    layerEnd[li] = cell;
    if (li + 1 < layers.length) contactAbove[cell - 1] = problem.contactResistances[li] ?? 0;
    base += layer.thicknessM;
  });
  return { n, dx, xc, totalM: base, layerOf, materials, contactAbove, layerStart, layerEnd };
}

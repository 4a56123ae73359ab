/**
 * Dry air at 1 atm: conductivity, kinematic viscosity and thermal diffusivity against temperature, for the
 * natural-convection correlations. Rows 300–800 K: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer,
 * Table A.4 (from memory, cross-checked within ~3 % against published air-property tables for k, μ, ν and Pr).
 * Rows 250 K and 900–1000 K: the same table, from memory, unchecked. Linear between rows; held flat outside
 * 250–1000 K (the run reports a film temperature outside that range as a warning).
 */
import type { Table } from './material.ts';

const ROWS: ReadonlyArray<readonly [number, number, number, number]> = [
  // T (K), k (W/m·K), ν (m²/s), α (m²/s)
  [250, 22.3e-3, 11.44e-6, 15.9e-6],
  [300, 26.3e-3, 15.89e-6, 22.5e-6],
  [350, 30.0e-3, 20.92e-6, 29.9e-6],
  [400, 33.8e-3, 26.41e-6, 38.3e-6],
  [450, 37.3e-3, 32.39e-6, 47.2e-6],
  [500, 40.7e-3, 38.79e-6, 56.7e-6],
  [550, 43.9e-3, 45.57e-6, 66.7e-6],
  [600, 46.9e-3, 52.69e-6, 76.9e-6],
  [650, 49.7e-3, 60.21e-6, 87.3e-6],
  [700, 52.4e-3, 68.10e-6, 98.0e-6],
  [750, 54.9e-3, 76.37e-6, 109e-6],
  [800, 57.3e-3, 84.93e-6, 120e-6],
  [900, 62.0e-3, 102.9e-6, 143e-6],
  [1000, 66.7e-3, 121.9e-6, 168e-6],
];

const column = (j: 1 | 2 | 3): Table => ({
  tK: Float64Array.from(ROWS, (r) => r[0]),
  y: Float64Array.from(ROWS, (r) => r[j]),
});

export const AIR_TABLE_RANGE_K = { low: 250, high: 1000 } as const;
export const airConductivity: Table = column(1);
export const airKinematicViscosity: Table = column(2);
export const airDiffusivity: Table = column(3);

const AIR_T = airConductivity.tK;
const AIR_K = airConductivity.y;
const AIR_NU = airKinematicViscosity.y;
const AIR_ALPHA = airDiffusivity.y;

/**
 * The three air properties at the film temperature io[0] (K), with their slopes, in one row search: writes
 * io[0..5] = [k, dk/dT, ν, dν/dT, α, dα/dT]. The same arithmetic as evalTable()/evalTableWithSlope() in table.ts
 * (linear between rows, held flat with a zero slope outside), so the values are the same to the bit. The temperature
 * comes in and the values go out through io, since a double passed to or returned from a call the JIT does not
 * inline is allocated on the heap; allocates nothing.
 */
export function airPropertiesAt(io: Float64Array): void {
  const tK = io[0]!;
  const n = AIR_T.length;
  if (tK <= AIR_T[0]! || tK >= AIR_T[n - 1]!) {
    const r = tK <= AIR_T[0]! ? 0 : n - 1;
    io[0] = AIR_K[r]!;
    io[1] = 0;
    io[2] = AIR_NU[r]!;
    io[3] = 0;
    io[4] = AIR_ALPHA[r]!;
    io[5] = 0;
    return;
  }
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (AIR_T[mid]! <= tK) lo = mid;
    else hi = mid;
  }
  const x0 = AIR_T[lo]!;
  const dx = AIR_T[lo + 1]! - x0;
  const t = tK - x0;
  const k0 = AIR_K[lo]!;
  const nu0 = AIR_NU[lo]!;
  const a0 = AIR_ALPHA[lo]!;
  io[0] = k0 + ((AIR_K[lo + 1]! - k0) * t) / dx;
  io[1] = (AIR_K[lo + 1]! - k0) / dx;
  io[2] = nu0 + ((AIR_NU[lo + 1]! - nu0) * t) / dx;
  io[3] = (AIR_NU[lo + 1]! - nu0) / dx;
  io[4] = a0 + ((AIR_ALPHA[lo + 1]! - a0) * t) / dx;
  io[5] = (AIR_ALPHA[lo + 1]! - a0) / dx;
}

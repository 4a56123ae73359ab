// The allocation-free face-heat path reads the air tables through airPropertiesAt() (one row search for k, ν, α and
// their slopes) and the convection correlations through naturalConvectionAt() and verticalPlateAt() (numbers passed
// through a Float64Array). They must give the same bits as the table reader (table.ts) and the plain readers,
// so that results do not move: checked on every row, between rows, at and beyond the table's ends, and at random
// temperatures. An equivalence check of two code paths (no outside source is needed for it; the values themselves are
// checked against the handbook correlations in tests/validation/low-ra-convection and vertical-plate).
import { describe, expect, it } from 'vitest';
import { airConductivity, airDiffusivity, airKinematicViscosity, airPropertiesAt } from '../../sim/physics/air.ts';
import { airPrandtl, filmTemperature, naturalConvectionAt, nusselt, plumeRisesFromFace, rayleigh } from '../../sim/physics/natural-convection.ts';
import { evalTable, evalTableWithSlope } from '../../sim/physics/table.ts';
import { churchillChuNusselt, verticalPlateAt, verticalPlateRayleigh } from '../../sim/physics/vertical-plate.ts';

function temperatures(): number[] {
  const rows = Array.from(airConductivity.tK);
  const ts = [...rows, 100, 249.999, 1000.001, 2500, -Infinity, Infinity];
  for (let i = 0; i + 1 < rows.length; i++) ts.push(0.5 * (rows[i]! + rows[i + 1]!), rows[i]! + 1e-9, rows[i + 1]! - 1e-9);
  let seed = 12345;
  for (let i = 0; i < 500; i++) { seed = (seed * 1103515245 + 12345) % 2147483648; ts.push(200 + (900 * seed) / 2147483648); }
  return ts;
}

describe('airPropertiesAt()', () => {
  it('gives the same values and slopes as evalTable() and evalTableWithSlope() on k, ν and α, to the bit', () => {
    const io = new Float64Array(6);
    const slope = new Float64Array(1);
    for (const t of temperatures()) {
      io[0] = t;
      airPropertiesAt(io);
      const tables = [airConductivity, airKinematicViscosity, airDiffusivity];
      tables.forEach((table, j) => {
        expect(Object.is(io[2 * j], evalTable(table, t)), `value ${j} at ${t} K`).toBe(true);
        expect(Object.is(io[2 * j], evalTableWithSlope(table, t, slope)), `value ${j} at ${t} K`).toBe(true);
        expect(Object.is(io[2 * j + 1], slope[0]), `slope ${j} at ${t} K`).toBe(true);
      });
    }
  });

  it('gives NaN for a NaN temperature, as the table reader does (never a number made up)', () => {
    const io = new Float64Array(6);
    io[0] = NaN;
    airPropertiesAt(io);
    expect(Number.isNaN(io[0]) && Number.isNaN(evalTable(airConductivity, NaN))).toBe(true);
  });
});

describe('the Float64Array forms of the convection correlations', () => {
  it('give q = h·ΔT with h from the plain readers (rayleigh(), airPrandtl(), nusselt(), churchillChuNusselt() on evalTable()), to the bit', () => {
    const io = new Float64Array(6);
    const L = 0.0125;
    const H = 0.004;
    for (const t of temperatures().filter(Number.isFinite)) {
      for (const air of [253.15, 293.15, 330]) {
        if (t === air) continue;
        const film = filmTemperature(t, air);
        const k = evalTable(airConductivity, film);
        for (const facing of ['up', 'down'] as const) {
          const nu = nusselt(rayleigh(t, air, L), airPrandtl(film), plumeRisesFromFace(facing, t, air));
          io[0] = t; io[1] = air; io[2] = L;
          naturalConvectionAt(facing, io);
          expect(Object.is(io[0], ((nu * k) / L) * (air - t)), `${facing} face at ${t} K, air ${air} K`).toBe(true);
        }
        const h = (churchillChuNusselt(verticalPlateRayleigh(t, air, H), airPrandtl(film)) * k) / H;
        io[0] = t; io[1] = air; io[2] = H;
        verticalPlateAt(io);
        expect(Object.is(io[0], h * (t - air)), `side wall at ${t} K, air ${air} K`).toBe(true);
      }
    }
  });
});

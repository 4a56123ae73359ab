// The side-loss table the solver reads (sim/physics/edge-loss.ts sideLossTabled) against the exact form it tabulates,
// sideLoss() (itself checked by hand in tests/validation/vertical-plate.test.ts and against lumped cooling in
// tests/verification/edge-loss.test.ts): a bare side in still air and a sleeved one, with a fixed coefficient too.
// The geometry is invented (a 25 mm disc, 5 mm tall, a 3 mm ceramic-fibre sleeve).

import { describe, expect, it } from 'vitest';
import { edgeLossDefaults, sideLoss, sideLossTabled, type EdgeLoss } from '../../sim/physics/edge-loss.ts';
import { libraryMaterial } from '../../sim/scenario/library.ts';

const blanket = libraryMaterial('ceramic-fibre-blanket')!;
const r1 = 0.0125;
const r2 = r1 + 0.003;
const sides = (ambientK: number): [string, EdgeLoss][] => {
  const base = { perimeterPerArea: 2 / r1, heightM: 0.005, ambientK };
  const sleeve = { conductivity: blanket.conductivity, resistanceTimesK: r1 * Math.log(r2 / r1), areaRatio: r2 / r1 };
  return [
    ['bare, still air', { ...base, convection: { kind: 'natural' }, emissivity: 0.5, sleeve: undefined }],
    ['sleeved, still air', { ...base, convection: { kind: 'natural' }, emissivity: 0.7, sleeve }],
    ['bare, 10 W/(m²·K)', { ...base, convection: { kind: 'fixed', coefficient: 10 }, emissivity: 0.3, sleeve: undefined }],
    ['sleeved, 10 W/(m²·K)', { ...base, convection: { kind: 'fixed', coefficient: 10 }, emissivity: 0.9, sleeve }],
  ];
};

/** Temperatures from 300 K below to 2000 K above the ambient, 0.0137 K apart (never on a node). */
const temperatures = (ambientK: number): number[] =>
  Array.from({ length: 20_000 }, (_, i) => ambientK - 300 + (2300 * i) / 20_000 + 0.0137).filter((t) => t > 1);

describe('sideLossTabled()', () => {
  it.each(sides(295.15))('sideLossTabled() stays within 1e-5 of the exact side loss, and is the exact form near the ambient (%s)', (_, loss) => {
    // measured worst 5.9e-6 (sleeved, where the sleeve's k(T) table kinks q's slope; 2.2e-6 bare, where the air's does)
    const exact = new Float64Array(2);
    const tabled = new Float64Array(2);
    let worst = 0;
    for (const t of temperatures(loss.ambientK)) {
      exact[1] = Number.NaN;
      const q = sideLoss(loss, t, exact);
      const p = sideLossTabled(loss, t, tabled);
      // near the ambient the exact form itself (a sleeve's surface solved from another start: round-off apart)
      if (Math.abs(t - loss.ambientK) <= edgeLossDefaults.tableNearAmbientK) expect(Math.abs(p - q)).toBeLessThanOrEqual(1e-9 * Math.abs(q) + 1e-12);
      else worst = Math.max(worst, Math.abs(p - q) / Math.abs(q));
    }
    expect(worst).toBeLessThan(1e-5);
    expect(worst).toBeGreaterThanOrEqual(0);
  });

  it.each(sides(233.15))('sideLossTabled() gives the slope of its own interpolant, so Newton linearises what it solves (%s)', (_, loss) => {
    // central difference of the tabled q over ±1e-4 K inside one node interval: the cubic's slope to O(δ²) ≈ 1e-8 relative
    const out = new Float64Array(2);
    const scratch = new Float64Array(2);
    const step = edgeLossDefaults.tableStepK;
    for (const t of [240.05, 300.05, 511.35, 873.25, 1500.75]) {
      const q = sideLossTabled(loss, t, out);
      const slope = out[0]!;
      const dt = 1e-4;
      expect(Math.floor((t - dt) / step)).toBe(Math.floor((t + dt) / step));
      const numeric = (sideLossTabled(loss, t + dt, scratch) - sideLossTabled(loss, t - dt, scratch)) / (2 * dt);
      expect(Math.abs(numeric - slope) / Math.abs(slope)).toBeLessThan(1e-6);
      expect(q).toBeGreaterThan(0);
    }
  });

  it('sideLossTabled() gives the same value whatever order the table was filled in (each node is the exact form from a fixed start)', () => {
    const [, a] = sides(295.15)[1]!;
    const [, b] = sides(295.15)[1]!;
    const ts = [1200.33, 400.71, 800.12, 401.02];
    const out = new Float64Array(2);
    const forward = ts.map((t) => sideLossTabled(a, t, out));
    const backward = [...ts].reverse().map((t) => sideLossTabled(b, t, out)).reverse();
    expect(backward).toEqual(forward);
  });
});

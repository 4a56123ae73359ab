// Composite wall with contact resistances, steady state, against the thermal-resistance network of Incropera &
// DeWitt, Fundamentals of Heat and Mass Transfer (6th ed.), §3.1 (series resistances, contact resistance §3.1.4;
// tests/support/closed-forms.ts compositeWallSteady). The run is long enough for the transient to die out.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { compositeWallSteady } from '../support/closed-forms.ts';
import { flat, last, probeAt, runOk, scenario, toC, toK } from '../support/scenarios.ts';
import type { FaceSegmentFile } from '../../sim/scenario/scenario-schema.ts';

// Three invented layers (ρcp = 5e5 J/m³·K; the slowest mode decays with τ ≈ 15 s, measured as a factor 1000 per 100 s): 2 mm of k = 10, 3 mm of k = 0.5,
// 4 mm of k = 2 W/m·K, with contact resistances 1e-3 and 5e-4 m²·K/W between them.
const layers = [{ thickness: 0.002, k: 10 }, { thickness: 0.003, k: 0.5 }, { thickness: 0.004, k: 2 }];
const contacts = [1e-3, 5e-4];
const material = (k: number) => ({ k_W_mK: k, rho_kg_m3: 1000, cp_J_kgK: flat(500) });
/** A probe in the middle of each layer (the steady profile is linear inside a layer, so interpolation is exact there). */
const middles = [1, 3.5, 7];

function wall(bottom: FaceSegmentFile[], top: FaceSegmentFile[], duration: number) {
  return scenario({
    duration_s: duration, initial_C: 20, ambient_C: 20,
    materials: { a: material(10), b: material(0.5), c: material(2) },
    layers: [
      { id: 'a', material: 'a', thickness_mm: 2 },
      { id: 'b', material: 'b', thickness_mm: 3 },
      { id: 'c', material: 'c', thickness_mm: 4 },
    ],
    contacts: [{ below: 'a', above: 'b', resistance_m2K_W: contacts[0]! }, { below: 'b', above: 'c', resistance_m2K_W: contacts[1]! }],
    bottom, top,
    output: { times_s: [duration], probes_mm: [0, ...middles, 9] },
    // a tight step tolerance: Newton stops within newtonShare·tolerance_K ≤ 1e-6 K (evolveDefaults.newtonShare ≤ 1e-2)
    numerics: { tolerance_K: 1e-4 },
  });
}

// Tolerances: at steady state the finite-volume solution of a piecewise-linear profile is exact (the series
// conductance of each face is the exact resistance between two nodes), so only the transient left after
// 2000 s ≈ 130 decay times (nothing left in double precision), the Newton stop of the last steps (≤ 1e-6 K, far
// less once the state no longer changes) and round-off remain. Measured: 1e-12 K. Tolerance 1e-5 K on temperatures;
// on heat flows 1e-6 relative (1e-5 K across the 1/h = 0.02 m²K/W film is 5e-4 W/m², 5e-8 of the 9.4 kW/m²).
const T_TOL = { abs: 1e-5 };
const Q_TOL = { rel: 1e-6 };
const D1 = 2000;
const D2 = 3000;

describe('composite wall with contact resistance, steady (resistance network)', () => {
  it('runProblem() with fixed_C below and convection above reaches the network temperatures and flux', () => {
    const bottom = [{ from_s: 0, fixed_C: 300 }];
    const top = [{ from_s: 0, convection_W_m2K: 50, fluid_C: 20 }];
    const exact = compositeWallSteady({
      layers, contactResistances: contacts, hLeft: Infinity, TfluidLeft: toK(300), hRight: 50, TfluidRight: toK(20),
    });
    const first = runOk(wall(bottom, top, D1));
    const second = runOk(wall(bottom, top, D2));
    const { record } = second;
    assertClose(probeAt(record, 0, D2), 300, T_TOL, 'held face');
    exact.layerFaces.forEach((f, i) => {
      assertClose(probeAt(record, middles[i]!, D2), toC((f.left + f.right) / 2), T_TOL, `middle of layer ${i}`);
    });
    assertClose(last(record.topC), toC(exact.surfaceRight), T_TOL, 'top face');
    assertClose(probeAt(record, 9, D2), toC(exact.surfaceRight), T_TOL, 'probe at the top face');
    // heat flux through each face: the ledger's heat over [D1, D2] divided by the time, and the film law at the top
    const bottomQ = (second.record.energy.bottomInJ - first.record.energy.bottomInJ) / (D2 - D1);
    const topQ = (second.record.energy.topOutJ - first.record.energy.topOutJ) / (D2 - D1);
    assertClose(bottomQ, exact.q, Q_TOL, 'heat in through the held face, W/m²');
    assertClose(topQ, exact.q, Q_TOL, 'heat out through the convective face, W/m²');
    assertClose(50 * (last(record.topC) - 20), exact.q, Q_TOL, 'h·(T_face − T_fluid), W/m²');
  });

  it('runProblem() with a held plate below and convection above reaches the network with 1/G as the first film', () => {
    // A plate held at 300 °C through a conductance G = 200 W/m²·K is a film 1/G between the plate and the face.
    const bottom = [{ from_s: 0, plate: { temperature_C: 300, conductance_W_m2K: 200 } }];
    const top = [{ from_s: 0, convection_W_m2K: 50 }];
    const exact = compositeWallSteady({
      layers, contactResistances: contacts, hLeft: 200, TfluidLeft: toK(300), hRight: 50, TfluidRight: toK(20),
    });
    const first = runOk(wall(bottom, top, D1));
    const second = runOk(wall(bottom, top, D2));
    const { record } = second;
    assertClose(probeAt(record, 0, D2), toC(exact.surfaceLeft), T_TOL, 'bottom face');
    exact.layerFaces.forEach((f, i) => {
      assertClose(probeAt(record, middles[i]!, D2), toC((f.left + f.right) / 2), T_TOL, `middle of layer ${i}`);
    });
    assertClose(last(record.topC), toC(exact.surfaceRight), T_TOL, 'top face');
    const bottomQ = (second.record.energy.bottomInJ - first.record.energy.bottomInJ) / (D2 - D1);
    const topQ = (second.record.energy.topOutJ - first.record.energy.topOutJ) / (D2 - D1);
    assertClose(bottomQ, exact.q, Q_TOL, 'heat in from the plate, W/m²');
    assertClose(topQ, exact.q, Q_TOL, 'heat out through the convective face, W/m²');
    assertClose(200 * (300 - last(record.bottomC)), exact.q, Q_TOL, 'G·(T_plate − T_face), W/m²');
  });
});

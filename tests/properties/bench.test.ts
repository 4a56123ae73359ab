// Random stacks set on random benches (physics/bench.ts), two properties that hold for any linear solids:
// - maximum principle: the bench draws heat from or gives heat to the face only towards its own temperature, so no
//   temperature of the stack or the face leaves [min, max] of the initial and the bench's start temperature (Protter &
//   Weinberger, Maximum Principles in Differential Equations, 1967, ch. 3; for the implicit scheme the M-matrix argument
//   of Patankar 1980 §4.3, which the chain's tridiagonal stage matrix also meets);
// - energy: the heat the bench holds is the heat booked out through that face (the method's own quadrature).
// The scenarios are drawn with a fixed seed by fast-check, so a failure shrinks to a small case printed with its seed.

import fc from 'fast-check';
import { describe, it } from 'vitest';
import { buildGrid } from '../../sim/grid/mesh.ts';
import { benchStoredJPerM2 } from '../../sim/physics/bench.ts';
import { evolve } from '../../sim/time/evolve.ts';
import { evolveDefaults } from '../../sim/time/evolve.ts';
import { flat, parseOk, scenario, toC } from '../support/scenarios.ts';

const solid = fc.record({
  k: fc.double({ min: 0.1, max: 100, noNaN: true }),
  rho: fc.double({ min: 500, max: 9000, noNaN: true }),
  cp: fc.double({ min: 200, max: 2000, noNaN: true }),
});

const TOLERANCE_K = 1e-2;

describe('a face on a bench (random solids)', () => {
  it('evolve() keeps every temperature within [min, max] of the initial and the bench start, and books the bench heat as the face heat out', () => {
    fc.assert(fc.property(solid, solid, fc.integer({ min: 0, max: 400 }), fc.integer({ min: -20, max: 400 }),
      fc.option(fc.double({ min: 10, max: 1e5, noNaN: true }), { nil: undefined }), fc.double({ min: 0.5, max: 20, noNaN: true }),
      (stack, bench, t1, t2, contact, thicknessMm) => {
        const p = parseOk(scenario({
          duration_s: 60, ambient_C: t2, initial_C: t1,
          materials: {
            stackm: { k_W_mK: stack.k, rho_kg_m3: stack.rho, cp_J_kgK: flat(stack.cp) },
            benchm: { k_W_mK: bench.k, rho_kg_m3: bench.rho, cp_J_kgK: flat(bench.cp) },
          },
          layers: [{ id: 'stack', material: 'stackm', thickness_mm: thicknessMm }],
          bottom: [{ from_s: 10, bench: { material: 'benchm', ...(contact === undefined ? {} : { contact_W_m2K: contact }) } }],
          top: [{ from_s: 0, convection_W_m2K: 5, fluid_C: t1 }],
          numerics: { tolerance_K: TOLERANCE_K },
        }));
        const lo = Math.min(t1, t2);
        const hi = Math.max(t1, t2);
        // Newton stops within newtonShare·tolerance_K of the discrete solution, which obeys the bounds; twice that
        const slack = 2 * evolveDefaults.newtonShare * TOLERANCE_K;
        let booked = 0;
        let stored = 0;
        const loop = evolve(p, buildGrid(p));
        for (let r = loop.next(); !r.done; r = loop.next()) {
          if (r.value.t0 >= 10) booked += r.value.bottomJ;
          for (const tK of r.value.ws.T) {
            const c = toC(tK);
            if (!(c >= lo - slack && c <= hi + slack)) throw new Error(`temperature ${c} °C outside [${lo}, ${hi}] at ${r.value.t1} s`);
          }
          if (r.value.t1 > 10) stored = benchStoredJPerM2(r.value.ws.benches[0]);
        }
        if (!loop.next().done) throw new Error('run did not end');
        // round-off only (tests/verification/bench.test.ts: ≤ 4e−13 of the heat measured); 1e−11 of it, at least 1e−9 J/m²
        // (a bench a few kelvin from the stack holds a few J/m²)
        if (!(Math.abs(booked + stored) <= Math.max(1e-11 * Math.abs(stored), 1e-9))) {
          throw new Error(`bench holds ${stored} J/m², face booked ${booked} J/m²`);
        }
      }), { seed: 20261202, numRuns: 40 });
  });
});

// Two-phase solidification against Neumann's similarity solution (Carslaw & Jaeger, Conduction of Heat in Solids,
// 2nd ed., §11.2; Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, §2.2;
// tests/support/closed-forms.ts neumannSolidification): a 40 mm slab of liquid at 320 °C, melting point 300 °C, whose
// bottom face is held at 200 °C from t = 0. Over 100 s the front reaches 6 mm and the liquid's thermal layer
// ≈ 4√(αt) = 28 mm, so the far face stays out of it (erfc(40 mm/(2√(αt))) ≈ 7e-5).

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { neumannSolidification } from '../support/closed-forms.ts';
import { flat, probeAt, runOk, seriesAt, slab, toC, toK } from '../support/scenarios.ts';

const THICKNESS_MM = 40;
const times = [25, 50, 100];
const probes = [0.5, 1, 2, 3, 4, 5, 8, 12, 16];
/** St_S = cp(Tm − Tw)/L = 0.5, St_L = cp(Ti − Tm)/L = 0.1, equal properties in both phases. */
const exact = neumannSolidification({ Tm: toK(300), Tw: toK(200), Ti: toK(320), L: 2e5, rho: 2000, kS: 1, cS: 1000, kL: 1, cL: 1000 });

function freeze(solidus: number, liquidus: number) {
  return runOk(slab({
    material: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: flat(1000), melt: { solidus_C: solidus, liquidus_C: liquidus, latent_J_kg: 2e5 } },
    thickness_mm: THICKNESS_MM, initial_C: 320, duration_s: 100,
    bottom: [{ from_s: 0, fixed_C: 200 }],
    output: { times_s: times, probes_mm: probes },
    numerics: { cells_per_mm: 4, min_cells_per_layer: 8, tolerance_K: 0.05, liquid_fraction_tolerance: 1e-3 },
  }));
}

/** Frozen thickness (mm) from the layer's mean liquid fraction: X = (1 − f̄)·thickness. */
function frontMm(run: ReturnType<typeof freeze>, t: number): number {
  const f = run.record.layers[0]!.liquidFraction;
  if (!f) throw new Error('a melting layer records its liquid fraction');
  return (1 - seriesAt(run.record.tS, f, t)) * THICKNESS_MM;
}

/** Probes at least 1.5 mm from the front: the cell holding the front sits at Tm while it freezes (below). */
const awayFromFront = (x: number, t: number) => Math.abs(x - exact.frontPosition(t) * 1000) >= 1.5;

describe('Neumann two-phase solidification', () => {
  it('runProblem() with an isothermal melt moves the front as X = 2λ√(αt) (from the liquid fraction)', () => {
    const run = freeze(300, 300);
    for (const t of times) {
      // Tolerance 2e-3 relative: the mean liquid fraction is the latent heat released, i.e. the heat drawn through the
      // held face less the sensible change, both second order in Δx (cells 0.13 mm at the face to 0.32 mm). Measured:
      // 1.0e-3 (at 50 s).
      assertClose(frontMm(run, t), exact.frontPosition(t) * 1000, { rel: 2e-3 }, `front at ${t} s, mm`);
    }
  });

  it('runProblem() with an isothermal melt gives Neumann temperatures in the solid and the liquid', () => {
    const { record } = freeze(300, 300);
    for (const t of times) {
      for (const x of probes) {
        const expected = toC(exact.temperature(x / 1000, t));
        // Away from the front: tolerance 0.25 K (2e-3 of the 120 K span); the field there carries the
        // second-order error plus the echo of the front's cell-by-cell progress. Measured: 0.13 K (2 mm behind it).
        // Near the front: the enthalpy method holds the freezing cell at Tm for the time the front takes to cross it,
        // so a probe there can be off by up to |∂T/∂x|·Δx ≈ (100 K/6 mm)·0.3 mm ≈ 5 K. Measured: 1.5 K. Tolerance 3 K.
        const tolerance = awayFromFront(x, t) ? { abs: 0.25 } : { abs: 3 };
        assertClose(probeAt(record, x, t), expected, tolerance, `T(${x} mm, ${t} s)`);
      }
    }
  });

  it('runProblem() with a 1 K mushy range centred on Tm stays within the mushy width of the sharp-front solution', () => {
    const run = freeze(299.5, 300.5);
    for (const t of times) {
      // The mushy zone (299.5–300.5 °C) smears the front over ≈ 1 K/|∂T/∂x| ≈ 0.06 mm, 1 % of X, symmetric about the
      // Tm isotherm to first order. Tolerance 3e-3 relative. Measured: 1.1e-3.
      assertClose(frontMm(run, t), exact.frontPosition(t) * 1000, { rel: 3e-3 }, `front at ${t} s, mm`);
      for (const x of probes.filter((p) => awayFromFront(p, t))) {
        // Tolerance 0.25 K as for the isothermal melt (the mushy width changes the far field by ≪ 0.1 K). Measured: 0.07 K.
        assertClose(probeAt(run.record, x, t), toC(exact.temperature(x / 1000, t)), { abs: 0.25 }, `T(${x} mm, ${t} s)`);
      }
    }
  });
});

// Natural convection from a horizontal plate (sim/physics/natural-convection.ts) against a hand calculation of the
// correlations of Incropera & DeWitt, Fundamentals of Heat and Mass Transfer (6th ed.), §9.6.2, with L = A/P
// (Goldstein, Sparrow & Jones 1973; Lloyd & Moran 1974) and the air properties written down here.

import { describe, expect, it } from 'vitest';
import { naturalConvectionCoefficient, plumeRisesFromFace, rayleigh } from '../../sim/physics/natural-convection.ts';
import { assertClose } from '../support/assert-close.ts';
import { last, runOk, slab } from '../support/scenarios.ts';

// Air at 1 atm and 350 K, Incropera & DeWitt Table A.4 (from memory): ν = 20.92e-6 m²/s, k = 30.0e-3 W/m·K,
// α = 29.9e-6 m²/s. A plate at 400 K in air at 300 K has its film temperature exactly at that row.
const AIR_350K = { nu: 20.92e-6, k: 30.0e-3, alpha: 29.9e-6 };
const G = 9.80665; // standard gravity, m/s² (CGPM 1901)
const TS = 400;
const TINF = 300;
const FILM = (TS + TINF) / 2;

/** Ra = g·β·ΔT·L³/(ν·α) with β = 1/T_film (ideal gas), Incropera eq. 9.25. */
const rayleighByHand = (L: number) => (G * (1 / FILM) * (TS - TINF) * L ** 3) / (AIR_350K.nu * AIR_350K.alpha);

// Tolerance 1e-12 relative: the same arithmetic on the same table row (no interpolation at 350 K), so only the order
// of the floating-point operations differs.
const SAME = { rel: 1e-12 };

describe('natural convection from a horizontal plate (hand calculation)', () => {
  it('rayleigh() of a 100 mm square at 400 K in 300 K air is g·β·ΔT·L³/(να) ≈ 7.0e4 with L = A/P = 25 mm', () => {
    const ra = rayleighByHand(0.025);
    assertClose(ra, 7.0e4, { rel: 0.01 }, 'hand Ra'); // 9.80665/350 · 100 · 1.5625e-5 / (20.92e-6 · 29.9e-6)
    assertClose(rayleigh(TS, TINF, 0.025), ra, SAME, 'Ra');
  });

  it('naturalConvectionCoefficient("up") of a hot plate is 0.54·Ra^¼·k/L (Incropera eq. 9.30, 10⁴–10⁷)', () => {
    const L = 0.025;
    const h = (0.54 * rayleighByHand(L) ** 0.25 * AIR_350K.k) / L; // 0.54 · 16.27 · 0.030 / 0.025 ≈ 10.5 W/m²·K
    assertClose(h, 10.5, { rel: 0.01 }, 'hand h');
    assertClose(naturalConvectionCoefficient('up', TS, TINF, L), h, SAME, 'h, hot face up');
  });

  it('naturalConvectionCoefficient("up") of a large hot plate is 0.15·Ra^⅓·k/L (Incropera eq. 9.31, 10⁷–10¹¹)', () => {
    const L = 0.25; // a 1 m square: Ra ≈ 7.0e7
    const h = (0.15 * Math.cbrt(rayleighByHand(L)) * AIR_350K.k) / L;
    assertClose(naturalConvectionCoefficient('up', TS, TINF, L), h, SAME, 'h, large hot face up');
  });

  it('naturalConvectionCoefficient("down") of a hot plate is 0.52·Ra^⅕·k/L (Incropera 7th ed. eq. 9.32, from memory)', () => {
    const L = 0.025;
    const h = (0.52 * rayleighByHand(L) ** 0.2 * AIR_350K.k) / L;
    assertClose(naturalConvectionCoefficient('down', TS, TINF, L), h, SAME, 'h, hot face down');
  });

  it('plumeRisesFromFace(): a cold face looking down sheds its plume like a hot face looking up', () => {
    expect(plumeRisesFromFace('up', TS, TINF)).toBe(true);
    expect(plumeRisesFromFace('down', TINF, TS)).toBe(true);
    expect(plumeRisesFromFace('down', TS, TINF)).toBe(false);
    expect(plumeRisesFromFace('up', TINF, TS)).toBe(false);
  });

  it('runProblem() with convection_W_m2K: "natural" on a hot upward face loses h·ΔT with the hand-calculated h', () => {
    // A 1 mm slab of k = 1e4 W/m·K held at 400 K below, its top face in 300 K air, 100 mm × 100 mm footprint.
    const run = (duration: number) => runOk(slab({
      material: { k_W_mK: 1e4, rho_kg_m3: 2000, cp_J_kgK: [[0, 1000], [1000, 1000]] },
      thickness_mm: 1, initial_C: TS - 273.15, ambient_C: TINF - 273.15, duration_s: duration,
      footprint: { width_mm: 100, length_mm: 100 },
      bottom: [{ from_s: 0, fixed_C: TS - 273.15 }], top: [{ from_s: 0, convection_W_m2K: 'natural' }],
    }));
    const first = run(20);
    const second = run(30);
    const q = (second.record.energy.topOutJ - first.record.energy.topOutJ) / 10;
    const h = (0.54 * rayleighByHand(0.025) ** 0.25 * AIR_350K.k) / 0.025;
    // Tolerance 1e-4 relative: the face sits q·L/k ≈ 1e-4 K below 400 K (h moves by ≈ 1e-6), and the steady state is
    // reached within ~1 s (L²/α = 2e-4 s; the face's own capacity is nil).
    assertClose(last(second.record.topC), TS - 273.15, { abs: 1e-3 }, 'top face, °C');
    assertClose(q, h * (TS - TINF), { rel: 1e-4 }, 'heat lost through the top face, W/m²');
  });
});

// Natural convection from small horizontal plates at low Rayleigh numbers (sim/physics/natural-convection.ts) against hand
// calculations of the thick-layer correlations of Raithby & Hollands, "Natural convection", ch. 4 of Rohsenow, Hartnett
// & Cho, Handbook of Heat Transfer, 3rd ed. (1998), as transcribed by Nellis & Klein, Introduction to Engineering Heat
// Transfer (2021). No textbook worked example at Ra < 10⁴ fits (the horizontal-plate examples of Incropera and Çengel
// are at Ra ≳ 10⁶, from memory), so the worked example below is our own hand calculation with Incropera's Table A.4.

import { describe, expect, it } from 'vitest';
import {
  naturalConvectionCoefficient, naturalConvectionIn, nusselt, raithbyHollandsDown, raithbyHollandsUp, rayleighInRange,
} from '../../sim/physics/natural-convection.ts';
import { assertClose } from '../support/assert-close.ts';

const PR_AIR = 0.71;

// Nusselt numbers at Pr = 0.71 computed by hand (calculator, four digits kept, rounded to three) from the formulas:
//   up:   C̄l = 0.671/[1 + (0.492/0.71)^(9/16)]^(4/9) = 0.515, Nu_T = 0.835·C̄l·Ra^¼ = 0.430·Ra^¼,
//         Nu_l = 1.4/ln(1 + 1.4/Nu_T), Nu_t = 0.140·Ra^⅓, Nu = (Nu_l¹⁰ + Nu_t¹⁰)^(1/10)
//   down: Nu_T = 0.527·Ra^⅕/[1 + (1.9/0.71)^0.9]^(2/9) = 0.401·Ra^⅕, Nu = 2.5/ln(1 + 2.5/Nu_T)
// e.g. Ra = 1000: Nu_T = 0.430·5.623 = 2.418, Nu_l = 1.4/ln(1.579) = 3.066, Nu_t = 1.40 → Nu = 3.07;
//      down Nu_T = 0.401·3.981 = 1.596, Nu = 2.5/ln(2.566) = 2.65.
const HAND = [
  { ra: 10, up: 1.35, down: 1.57 },
  { ra: 100, up: 1.98, down: 2.0 },
  { ra: 1000, up: 3.07, down: 2.65 },
  { ra: 1e4, up: 4.97, down: 3.64 },
];
// Tolerance 0.006: the hand values are rounded to three significant digits (half a unit in the last place is ≤ 0.005),
// plus the rounding of the constants 0.430 and 0.401 (relative 1e-3).
const ROUNDED = { abs: 0.006 };

describe('Raithby–Hollands correlations at low Rayleigh numbers (hand calculation)', () => {
  it.each(HAND)('raithbyHollandsUp(Ra = $ra, Pr = 0.71) is the hand-computed $up', ({ ra, up }) => {
    assertClose(raithbyHollandsUp(ra, PR_AIR), up, ROUNDED, `Nu up at Ra ${ra}`);
  });

  it.each(HAND)('raithbyHollandsDown(Ra = $ra, Pr = 0.71) is the hand-computed $down, capped at the up-facing value', ({ ra, up, down }) => {
    // Below Ra ≈ 150 the down-facing form exceeds the up-facing one: the cap Nu_down ≤ Nu_up applies (common practice,
    // no source), so the expected value is the smaller of the two hand values.
    assertClose(raithbyHollandsDown(ra, PR_AIR), Math.min(up, down), ROUNDED, `Nu down at Ra ${ra}`);
  });

  it('raithbyHollandsUp() and raithbyHollandsDown() are the formulas as printed, within 1e-13, over Ra 10⁻²–10⁴ and Pr 0.68–0.74', () => {
    // The solver forms the powers from logarithms and exponentials (natural-convection.ts); here they are written as
    // the handbook prints them (header), with powers. Tolerance 1e-13 relative: a few roundings of each form.
    const up = (ra: number, pr: number) => {
      const cl = 0.671 / (1 + (0.492 / pr) ** (9 / 16)) ** (4 / 9);
      const nuL = 1.4 / Math.log(1 + 1.4 / (0.835 * cl * ra ** 0.25));
      const nuT = 0.14 * ((1 + 0.0107 * pr) / (1 + 0.01 * pr)) * ra ** (1 / 3);
      return Math.max((nuL ** 10 + nuT ** 10) ** 0.1, 2 / Math.PI);
    };
    const down = (ra: number, pr: number) => 2.5 / Math.log(1 + 2.5 / ((0.527 * ra ** 0.2) / (1 + (1.9 / pr) ** 0.9) ** (2 / 9)));
    for (let e = -2; e <= 4; e += 0.05) {
      for (const pr of [0.68, 0.7, 0.72, 0.74]) {
        const ra = 10 ** e;
        assertClose(raithbyHollandsUp(ra, pr), up(ra, pr), { rel: 1e-13 }, `up, Ra ${ra.toPrecision(3)}, Pr ${pr}`);
        assertClose(raithbyHollandsDown(ra, pr), Math.min(down(ra, pr), up(ra, pr)), { rel: 1e-13 }, `down, Ra ${ra.toPrecision(3)}, Pr ${pr}`);
      }
    }
  });

  it('raithbyHollandsUp() never drops below the conduction limit 2/π of a disc on an adiabatic plane (S = 2D, Incropera Table 4.1, from memory)', () => {
    for (const ra of [1e-6, 1e-3, 0.01, 0.1]) expect(raithbyHollandsUp(ra, PR_AIR)).toBeGreaterThanOrEqual(2 / Math.PI);
    // Tolerance 1e-12: at Ra = 1e-6 the floor is in force and the value is the constant itself.
    assertClose(raithbyHollandsUp(1e-6, PR_AIR), 2 / Math.PI, { rel: 1e-12 }, 'floor');
  });

  it('nusselt() uses Raithby–Hollands below Ra = 10³ and the textbook power laws from 10⁴ (Incropera eqs. 9.30, 9.32)', () => {
    // Tolerance 1e-12 relative: the same formula on both sides; only the order of operations could differ.
    assertClose(nusselt(500, PR_AIR, true), raithbyHollandsUp(500, PR_AIR), { rel: 1e-12 }, 'up, Ra 500');
    assertClose(nusselt(500, PR_AIR, false), raithbyHollandsDown(500, PR_AIR), { rel: 1e-12 }, 'down, Ra 500');
    assertClose(nusselt(2e4, PR_AIR, true), 0.54 * 2e4 ** 0.25, { rel: 1e-12 }, 'up, Ra 2e4');
    assertClose(nusselt(2e4, PR_AIR, false), 0.52 * 2e4 ** 0.2, { rel: 1e-12 }, 'down, Ra 2e4');
  });

  it('nusselt() is continuous and lies between the two families inside the blend band 10³–10⁴', () => {
    for (const plumeRises of [true, false]) {
      let previous = nusselt(1e3, PR_AIR, plumeRises);
      for (let k = 1; k <= 200; k++) {
        const ra = 10 ** (3 + k / 200);
        const nu = nusselt(ra, PR_AIR, plumeRises);
        const rh = plumeRises ? raithbyHollandsUp(ra, PR_AIR) : raithbyHollandsDown(ra, PR_AIR);
        const tb = plumeRises ? 0.54 * ra ** 0.25 : 0.52 * ra ** 0.2;
        expect(nu).toBeGreaterThanOrEqual(Math.min(rh, tb) - 1e-12);
        expect(nu).toBeLessThanOrEqual(Math.max(rh, tb) + 1e-12);
        // a step of 1/200 decade moves Nu ∝ Ra^¼ by 0.3 %; a jump would show as much more
        expect(Math.abs(nu / previous - 1)).toBeLessThan(0.01);
        previous = nu;
      }
    }
  });

  it('nusselt() of an up-facing plume is continuous across the textbook switch at Ra = 10⁷ and lies between 0.54·Ra^¼ and 0.15·Ra^⅓ (Incropera eqs. 9.30, 9.31)', () => {
    // Tolerance 1e-12 relative outside the band 10^6.75–10^7.25: each law alone, as written in the textbook.
    assertClose(nusselt(5e6, PR_AIR, true), 0.54 * 5e6 ** 0.25, { rel: 1e-12 }, 'Ra 5e6');
    assertClose(nusselt(2e7, PR_AIR, true), 0.15 * Math.cbrt(2e7), { rel: 1e-12 }, 'Ra 2e7');
    let previous = nusselt(10 ** 6.5, PR_AIR, true);
    for (let k = 1; k <= 400; k++) {
      const ra = 10 ** (6.5 + k / 400);
      const nu = nusselt(ra, PR_AIR, true);
      const laminar = 0.54 * ra ** 0.25;
      const turbulent = 0.15 * Math.cbrt(ra);
      expect(nu).toBeGreaterThanOrEqual(Math.min(laminar, turbulent) - 1e-12);
      expect(nu).toBeLessThanOrEqual(Math.max(laminar, turbulent) + 1e-12);
      // a step of 1/400 decade moves Nu ∝ Ra^⅓ by 0.2 %; the 6 % jump of the two laws at 10⁷ would show far above 1 %
      expect(Math.abs(nu / previous - 1)).toBeLessThan(0.01);
      previous = nu;
    }
  });

  it('naturalConvectionIn() of a cold face looking down under hot air has dq/dT within 1 % of a central difference across Ra = 10⁷', () => {
    // a face at 20–30 K under air at 986 K with L = 0.107 m crosses Ra = 10⁷ near 23.9 K (fuzz seed 13 case 9212)
    const out = new Float64Array(1);
    for (let tK = 20; tK <= 30; tK += 0.25) {
      naturalConvectionIn('down', tK, 986.15, 0.106815578465063, out);
      const slope = out[0]!;
      const d = 1e-3;
      const fd = (naturalConvectionIn('down', tK + d, 986.15, 0.106815578465063, out) - naturalConvectionIn('down', tK - d, 986.15, 0.106815578465063, out)) / (2 * d);
      // Tolerance 1 %: q(T) is smooth (C¹) through the band, so the two differences agree to O(d²)
      assertClose(slope, fd, { rel: 0.01 }, `dq/dT at ${tK} K`);
    }
  });

  it('rayleighInRange(): the up face is in range from Ra = 1, the down face only from 10³ (the stated ranges)', () => {
    expect(rayleighInRange(2, true)).toBe(true);
    expect(rayleighInRange(0.5, true)).toBe(false);
    expect(rayleighInRange(500, false)).toBe(false);
    expect(rayleighInRange(2e3, false)).toBe(true);
  });
});

describe('worked example: a 30 mm disc at 400 °C in 20 °C air (our own hand calculation)', () => {
  // Film 483.15 K; air from Incropera & DeWitt Table A.4 (from memory), interpolated by hand between 450 K and 500 K
  // (fraction 0.663): ν = 32.39 + 0.663·6.40 = 36.63e-6 m²/s, α = 47.2 + 0.663·9.5 = 53.50e-6 m²/s,
  // k = 37.3 + 0.663·3.4 = 39.55e-3 W/m·K; Pr = ν/α = 0.6847. L* = A/P = D/4 = 7.5 mm.
  const nu = 36.63e-6;
  const alpha = 53.5e-6;
  const k = 39.55e-3;
  const L = 0.0075;
  const ra = (9.80665 / 483.15) * 380 * L ** 3 / (nu * alpha); // = 1.66e3
  const pr = nu / alpha;

  it('the hot top face has h = 17.9 W/m²K (Raithby–Hollands up 3.39, nudged 0.2 % by the blend toward 0.54·Ra^¼ = 3.45)', () => {
    assertClose(ra, 1.66e3, { rel: 0.005 }, 'Ra*');
    // Hand: Nu_T = 0.835·0.512·Ra^¼ = 2.730 → Nu_l = 1.4/ln(1.5128) = 3.385, Nu_t = 1.65 → Nu = 3.385; at Ra = 1660 the
    // blend weight is s = log(1.66) = 0.220, w = 3s² − 2s³ = 0.124 → Nu = 0.876·3.385 + 0.124·3.447 = 3.393.
    const hHand = (3.393 * k) / L; // 17.9 W/m²K
    // Tolerance 0.5 %: the hand interpolation of the air table (four digits) and the rounded Nu carry ~0.3 %.
    assertClose(naturalConvectionCoefficient('up', 673.15, 293.15, L), hHand, { rel: 0.005 }, 'h top, W/m²K');
  });

  it('the hot bottom face has h ≈ 14.5 W/m²K (Raithby–Hollands down 2.83, blended toward 0.52·Ra^⅕ = 2.30)', () => {
    // Hand: Nu_T = 0.527·Ra^⅕/[1 + (1.9/0.6847)^0.9]^(2/9) = 0.3986·4.403 = 1.755 → Nu = 2.5/ln(2.4245) = 2.823;
    // textbook 0.52·Ra^⅕ = 2.290; blend 0.876·2.823 + 0.124·2.290 = 2.757 → h = 2.757·k/L = 14.5 W/m²K.
    const hHand = (2.757 * k) / L;
    assertClose(naturalConvectionCoefficient('down', 673.15, 293.15, L), hHand, { rel: 0.005 }, 'h bottom, W/m²K');
    expect(pr).toBeGreaterThan(0.68);
  });

  it('naturalConvectionIn() gives a slope dq/dT within 1 % of a central difference over ±0.01 K', () => {
    const out = new Float64Array(1);
    for (const facing of ['up', 'down'] as const) {
      for (const tK of [300, 350, 450, 673.15, 900]) {
        naturalConvectionIn(facing, tK, 293.15, L, out);
        const slope = out[0]!;
        const d = 1e-2;
        const fd = (naturalConvectionIn(facing, tK + d, 293.15, L, out) - naturalConvectionIn(facing, tK - d, 293.15, L, out)) / (2 * d);
        // Tolerance 1 %: q(T) is smooth here (no blend-band edge within 0.01 K), so the two differences agree to O(d²).
        assertClose(slope, fd, { rel: 0.01 }, `${facing} dq/dT at ${tK} K`);
      }
    }
  });
});

// The side-wall correlation (sim/physics/vertical-plate.ts: Churchill & Chu 1975, Incropera eq. 9.26) against a
// textbook worked example and hand-computed values, and the edge term built on it (sim/physics/edge-loss.ts).
import { describe, expect, it } from 'vitest';
import type { EdgeLoss } from '../../sim/physics/edge-loss.ts';
import { edgeHeatIn, sideLoss } from '../../sim/physics/edge-loss.ts';
import { churchillChuNusselt, verticalPlateCoefficient, verticalPlateLoss } from '../../sim/physics/vertical-plate.ts';
import { assertClose } from '../support/assert-close.ts';
import { toK } from '../support/scenarios.ts';

/** Stefan–Boltzmann constant, W/m²K⁴ (CODATA 2018, exact). */
const SIGMA = 5.670374419e-8;

describe('Churchill–Chu vertical plate (vertical-plate.ts)', () => {
  // Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Example 9.2: a glass firescreen 0.71 m high at
  // 232 °C in a 23 °C room; air at T_f = 400 K (Table A.4: ν = 26.41e-6 m²/s, k = 0.0338 W/mK, α = 38.3e-6 m²/s,
  // Pr = 0.690); Ra_L = 1.813e9, Nu_L = 147 by eq. 9.26, h = 7.0 W/m²K. (The printed figures are from memory; the
  // arithmetic was redone by hand: 9.8·209·0.71³/(400·26.41e-6·38.3e-6) = 1.812e9, Nu = 147.1, h = 7.00.)
  it('churchillChuNusselt() gives Nu_L = 147 at the Ra_L and Pr of Incropera Example 9.2', () => {
    // the example prints three figures: ±0.5 in 147
    assertClose(churchillChuNusselt(1.813e9, 0.690), 147, { abs: 0.5 }, 'Nu_L');
  });

  it('verticalPlateCoefficient() gives h = 7.0 W/m²K for the plate of Incropera Example 9.2', () => {
    // two printed figures (±0.05); our g = 9.80665 (the book's 9.8) and the air table read at T_f = 400.65 K move h by
    // < 0.1 %
    assertClose(verticalPlateCoefficient(toK(232), toK(23), 0.71), 7.0, { abs: 0.05 }, 'h, W/m²K');
  });

  it('churchillChuNusselt() matches hand-computed values at the low Rayleigh numbers of a small cell', () => {
    // by hand (calculator), Pr = 0.7: c = 0.387/[1 + (0.492/0.7)^(9/16)]^(8/27) = 0.387/1.19417 = 0.324074;
    // Ra = 1: (0.825 + 0.324074)² = 1.32037; Ra = 1e4: (0.825 + 0.324074·10^(2/3))² = (0.825 + 1.504218)² = 5.42525.
    // Six figures carried by hand: tolerance 1e-5 relative.
    assertClose(churchillChuNusselt(1, 0.7), 1.32037, { rel: 1e-5 }, 'Nu at Ra = 1');
    assertClose(churchillChuNusselt(1e4, 0.7), 5.42525, { rel: 1e-5 }, 'Nu at Ra = 1e4');
    // Ra → 0: the conduction-like floor 0.825² (the equation's own constant)
    assertClose(churchillChuNusselt(0, 0.7), 0.825 ** 2, { rel: 1e-15 }, 'Nu at Ra = 0');
  });

  it('verticalPlateLoss() returns h·(T − T∞) with a slope within 1 % of a central difference, and h at T = T∞', () => {
    const out = new Float64Array(1);
    for (const [tC, heightM] of [[400, 0.004], [60, 0.004], [232, 0.71], [20.5, 0.004]] as const) {
      const t = toK(tC);
      const air = toK(20);
      const q = verticalPlateLoss(t, air, heightM, out);
      assertClose(q, verticalPlateCoefficient(t, air, heightM) * (t - air), { rel: 1e-12 }, `q at ${tC} °C`);
      const e = 1e-3;
      const fd = (verticalPlateLoss(t + e, air, heightM, new Float64Array(1)) - verticalPlateLoss(t - e, air, heightM, new Float64Array(1))) / (2 * e);
      // Pr is held in the analytic slope (it moves by a few per cent over the air table): 1 % allowance
      assertClose(out[0]!, fd, { rel: 0.01 }, `dq/dT at ${tC} °C`);
    }
    // at T = T∞, Ra = 0 and the slope is h itself: 0.825²·k/L with the air table's k at 293.15 K (the 250–300 K rows)
    expect(verticalPlateLoss(toK(20), toK(20), 0.004, out)).toBe(0);
    const kAir = 22.3e-3 + ((26.3e-3 - 22.3e-3) * (toK(20) - 250)) / 50;
    assertClose(out[0]!, (0.825 ** 2 * kAir) / 0.004, { rel: 1e-12 }, 'dq/dT at T = T∞');
  });
});

describe('the edge term (edge-loss.ts)', () => {
  const bare: EdgeLoss = {
    perimeterPerArea: 160, heightM: 0.004, convection: { kind: 'natural' }, emissivity: 0.7, ambientK: toK(20), sleeve: undefined,
  };

  it('edgeHeatIn() of a bare side is −(P/A)·[h(T)·(T − T∞) + εσ(T⁴ − T∞⁴)] (Incropera eq. 1.7 for the radiation)', () => {
    const out = new Float64Array(2);
    const t = toK(450);
    const expected = -160 * (verticalPlateCoefficient(t, bare.ambientK, 0.004) * (t - bare.ambientK) + 0.7 * SIGMA * (t ** 4 - bare.ambientK ** 4));
    assertClose(edgeHeatIn(bare, t, out), expected, { rel: 1e-12 }, 'edge term, W/m³');
  });

  it('sideLoss() through a sleeve balances conduction through it against the loss of its outer surface', () => {
    const sleeved: EdgeLoss = {
      ...bare,
      sleeve: { conductivity: { tK: Float64Array.of(toK(0), toK(800)), y: Float64Array.of(0.05, 0.2) }, resistanceTimesK: 0.003, areaRatio: 1.25 },
    };
    const out = new Float64Array(2);
    out[1] = NaN;
    const t = toK(450);
    const q = sideLoss(sleeved, t, out);
    const ts = out[1]!;
    expect(ts).toBeGreaterThan(sleeved.ambientK);
    expect(ts).toBeLessThan(t);
    // k is linear in T here, so the mean conductivity over the sleeve is k((T + T_s)/2) exactly (Incropera §3.2). The
    // surface is taken after a Newton move below 1e-6 K, with k from the iterate before it: 1e-9 relative
    const kMean = 0.05 + (0.15 * (0.5 * (t + ts) - toK(0))) / 800;
    assertClose(q, ((t - ts) * kMean) / 0.003, { rel: 1e-9 }, 'conduction through the sleeve, W/m²');
    const surfaceLoss = 1.25 * (verticalPlateCoefficient(ts, sleeved.ambientK, 0.004) * (ts - sleeved.ambientK) + 0.7 * SIGMA * (ts ** 4 - sleeved.ambientK ** 4));
    assertClose(q, surfaceLoss, { rel: 1e-9 }, 'loss of the outer surface per inner area, W/m²');
    const e = 1e-3;
    const fd = (sideLoss(sleeved, t + e, Float64Array.of(0, NaN)) - sideLoss(sleeved, t - e, Float64Array.of(0, NaN))) / (2 * e);
    // the slope holds the air's Pr, as verticalPlateLoss() does: 1 % allowance
    assertClose(out[0]!, fd, { rel: 0.01 }, 'dq/dT through the sleeve');
  });
});

/**
 * Natural convection from a horizontal plate to quiescent air, Nu = h·L/k against Ra = g·β·|ΔT|·L³/(ν·α) with
 * L = A/P (Goldstein, Sparrow & Jones 1973), properties at the film temperature, β = 1/T_film, Pr = ν/α.
 *
 * In the textbook range, Ra ≥ 10⁴ (Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, §9.6.2):
 *   hot face up or cold face down:  Nu = 0.54 Ra^¼ (10⁴–10⁷), Nu = 0.15 Ra^⅓ (10⁷–10¹¹)  (eqs. 9.30, 9.31)
 *   hot face down or cold face up:  Nu = 0.52 Ra^⅕ (10⁴–10⁹)                           (7th ed. eq. 9.32, from memory)
 * Below it, where a centimetre-sized cell sits, the thick-layer forms of Raithby & Hollands, "Natural convection",
 * ch. 4 of Rohsenow, Hartnett & Cho, Handbook of Heat Transfer, 3rd ed. (1998), as transcribed by Nellis & Klein,
 * Introduction to Engineering Heat Transfer (2021):
 *   up:   Nu_T = 0.835·C̄l·Ra^¼, C̄l = 0.671/[1 + (0.492/Pr)^(9/16)]^(4/9); Nu_l = 1.4/ln(1 + 1.4/Nu_T);
 *         Nu_t = 0.14·[(1 + 0.0107·Pr)/(1 + 0.01·Pr)]·Ra^⅓; Nu = (Nu_l¹⁰ + Nu_t¹⁰)^(1/10)      stated range 1 < Ra < 10¹⁰
 *   down: Nu_T = 0.527·Ra^⅕/[1 + (1.9/Pr)^(9/10)]^(2/9); Nu = 2.5/ln(1 + 2.5/Nu_T)         stated range 10³ < Ra < 10¹⁰
 * Below Ra ≈ 150 the down-facing form exceeds the up-facing one, an artefact of using it below its range; it is capped
 * at the up-facing value (common practice, no source). The up-facing value never drops below the conduction limit of
 * a disc on an adiabatic plane, S = 2D (Incropera Table 4.1, from memory) → Nu_L* = 2/π; this bites only at Ra < 0.03.
 * Between Ra = 10³ and 10⁴ the two families are blended smoothly in log Ra (a cubic smoothstep; our own choice, no
 * source), so h(T) has no jump that Newton could cycle across: they differ by 3 % at 10³ and 9 % at 10⁴ (up face).
 * The two up-facing textbook laws are blended the same way across their switch at 10⁷, from 10^6.75 to 10^7.25.
 */
import { airDiffusivity, airKinematicViscosity, airPropertiesAt } from './air.ts';
import { evalTable } from './table.ts';
import type { Facing } from './problem.ts';
import { STANDARD_GRAVITY_M_S2 } from './units.ts';

/** Published Rayleigh ranges of the correlations in use (the union of the low-Ra and textbook families). */
export const naturalConvectionRanges = {
  upperFacing: { low: 1, switch: 1e7, high: 1e11 },
  lowerFacing: { low: 1e3, high: 1e9 },
} as const;

export const naturalConvectionDefaults = {
  /** Blend band, Ra: from pure Raithby–Hollands at its low end to the textbook power laws at its high end. */
  blendLowRa: 1e3,
  blendHighRa: 1e4,
  /**
   * Band, Ra, over which the up-facing laws 0.54·Ra^¼ and 0.15·Ra^⅓ (Incropera eqs. 9.30, 9.31) are blended around
   * their switch at 10⁷: a quarter decade either side (they differ by 1.5 % at its low end and 12 % at its high end).
   */
  switchLowRa: naturalConvectionRanges.upperFacing.switch / 10 ** 0.25,
  switchHighRa: naturalConvectionRanges.upperFacing.switch * 10 ** 0.25,
  /** Conduction floor of an up-facing disc on an adiabatic plane, Nu_L* = 2/π (S = 2D, Incropera Table 4.1). */
  conductionFloorNu: 2 / Math.PI,
} as const;

/** The film temperature at which air properties are taken, K: the mean of surface and free stream (Incropera §7.1). */
export const filmTemperature = (tK: number, fluidK: number): number => 0.5 * (tK + fluidK);

/** Rayleigh number for a face at tK next to air at fluidK; lengthM = A/P. */
export function rayleigh(tK: number, fluidK: number, lengthM: number): number {
  const film = filmTemperature(tK, fluidK);
  const nu = evalTable(airKinematicViscosity, film);
  const alpha = evalTable(airDiffusivity, film);
  return (STANDARD_GRAVITY_M_S2 * Math.abs(tK - fluidK) * lengthM * lengthM * lengthM) / (film * nu * alpha);
}

/** Prandtl number of air at the film temperature, ν/α from the same table. */
export const airPrandtl = (filmK: number): number => evalTable(airKinematicViscosity, filmK) / evalTable(airDiffusivity, filmK);

/** Which way each face of the stack looks: it lies flat, so its bottom face looks down and its top face up. */
export const facingOf = (side: 'bottom' | 'top'): Facing => (side === 'bottom' ? 'down' : 'up');

/** Whether the buoyant plume leaves the face (hot face up, cold face down): the "upper surface" correlations apply. */
export function plumeRisesFromFace(facing: Facing, tK: number, fluidK: number): boolean {
  return (facing === 'up') === (tK > fluidK);
}

/**
 * Where the correlations below leave a Nusselt number and its elasticity d ln Nu / d ln Ra: [Nu, e]. They write
 * here and return nothing, since an object or a double returned from a call the JIT does not inline is allocated on
 * the heap (this ran once per face and Newton sweep).
 */
const nuSlope = new Float64Array(2);

/*
 * The powers below are formed from logarithms and exponentials (x^y = e^(y·ln x)), whole powers by multiplication
 * and Ra^¼ by two square roots: on V8 a Math.pow with a fractional exponent costs about three times Math.log and
 * Math.exp together (49 ns against 10 + 7, measured here), and the up-facing form took eight, the down-facing twelve,
 * per face and Newton sweep: a tenth of a small grid's solve. The results differ from pow's in the last bits only
 * (tests/validation/low-ra-convection.test.ts holds them to the printed formulas within 1e-13).
 */
const LN_0492 = Math.log(0.492);
const LN_19 = Math.log(1.9);

/** Raithby & Hollands, hot face up (thick-layer laminar blended with turbulent), with its elasticity, to nuSlope. */
function raithbyHollandsUpWithSlope(ra: number, pr: number): void {
  // C̄l = 0.671/[1 + (0.492/Pr)^(9/16)]^(4/9)
  const cl = 0.671 * Math.exp(-(4 / 9) * Math.log1p(Math.exp((9 / 16) * (LN_0492 - Math.log(pr)))));
  const nuT = 0.835 * cl * Math.sqrt(Math.sqrt(ra));
  const nuL = 1.4 / Math.log1p(1.4 / nuT);
  const eL = (0.25 * nuL) / (nuT + 1.4); // d ln Nu_l/d ln Ra = m·Nu_l/(Nu_T + c) for Nu_l = c/ln(1 + c/Nu_T)
  const nuTurb = 0.14 * ((1 + 0.0107 * pr) / (1 + 0.01 * pr)) * Math.cbrt(ra);
  // Nu = (Nu_l¹⁰ + Nu_t¹⁰)^(1/10) = Nu_l·(1 + r¹⁰)^(1/10), r = Nu_t/Nu_l; elasticity (e_l + r¹⁰/3)/(1 + r¹⁰)
  const r = nuTurb / nuL;
  const r2 = r * r;
  const r4 = r2 * r2;
  const r10 = r4 * r4 * r2;
  const nu = nuL * Math.exp(0.1 * Math.log1p(r10));
  if (nu < naturalConvectionDefaults.conductionFloorNu) {
    nuSlope[0] = naturalConvectionDefaults.conductionFloorNu;
    nuSlope[1] = 0;
    return;
  }
  nuSlope[0] = nu;
  nuSlope[1] = (eL + r10 / 3) / (1 + r10);
}

/** Raithby & Hollands, hot face down (thick-layer form), capped at the up-facing value, with its elasticity. */
function raithbyHollandsDownWithSlope(ra: number, pr: number): void {
  // Nu_T = 0.527·Ra^⅕/[1 + (1.9/Pr)^(9/10)]^(2/9)
  const nuT = 0.527 * Math.exp(0.2 * Math.log(ra) - (2 / 9) * Math.log1p(Math.exp(0.9 * (LN_19 - Math.log(pr)))));
  const nu = 2.5 / Math.log1p(2.5 / nuT);
  raithbyHollandsUpWithSlope(ra, pr);
  if (nu > nuSlope[0]!) return; // the up-facing value and its elasticity stand
  nuSlope[0] = nu;
  nuSlope[1] = (0.2 * nu) / (nuT + 2.5);
}

/** Raithby & Hollands (1998), hot face up or cold face down. */
export const raithbyHollandsUp = (ra: number, pr: number): number => {
  raithbyHollandsUpWithSlope(ra, pr);
  return nuSlope[0]!;
};
/** Raithby & Hollands (1998), hot face down or cold face up, capped at the up-facing value. */
export const raithbyHollandsDown = (ra: number, pr: number): number => {
  raithbyHollandsDownWithSlope(ra, pr);
  return nuSlope[0]!;
};

/**
 * The textbook power laws (Incropera eqs. 9.30–9.32) with their exponents, to nuSlope. The two up-facing laws meet
 * at Ra = 10⁷ with a 6 % jump (0.54·Ra^¼ = 30.4, 0.15·Ra^⅓ = 32.3); within a quarter decade either side of it they are
 * blended like the low band (smoothstep in log Ra; our own choice, no source): a jump in h(T) there left a cold face
 * under hot air with no root of its balance between 23.83 and 24.65 K, and Newton cycled (fuzz seed 13 case 9212).
 */
function textbookWithSlope(ra: number, plumeRises: boolean): void {
  if (!plumeRises) {
    nuSlope[0] = 0.52 * Math.exp(0.2 * Math.log(ra));
    nuSlope[1] = 0.2;
    return;
  }
  const { switchLowRa, switchHighRa } = naturalConvectionDefaults;
  const laminar = 0.54 * Math.sqrt(Math.sqrt(ra));
  const turbulent = 0.15 * Math.cbrt(ra);
  if (ra <= switchLowRa) {
    nuSlope[0] = laminar;
    nuSlope[1] = 0.25;
  } else if (ra >= switchHighRa) {
    nuSlope[0] = turbulent;
    nuSlope[1] = 1 / 3;
  } else {
    blendWithSlope(ra, switchLowRa, switchHighRa, laminar, 0.25, turbulent, 1 / 3);
  }
}

/**
 * Nu and its elasticity, to nuSlope, blended from (lowNu, lowE) at lowRa to (highNu, highE) at highRa by a cubic
 * smoothstep in log Ra (our own choice, no source), so Nu(Ra) and its slope are continuous across the band. The one
 * rule for both bands (Raithby–Hollands to textbook, 10³–10⁴; the two up-facing textbook laws around 10⁷).
 */
function blendWithSlope(ra: number, lowRa: number, highRa: number, lowNu: number, lowE: number, highNu: number, highE: number): void {
  const s = Math.log(ra / lowRa) / Math.log(highRa / lowRa);
  const w = s * s * (3 - 2 * s);
  const dwdLnRa = (6 * s * (1 - s)) / (LN10 * Math.log10(highRa / lowRa));
  const nu = (1 - w) * lowNu + w * highNu;
  nuSlope[0] = nu;
  nuSlope[1] = ((1 - w) * lowNu * lowE + w * highNu * highE + (highNu - lowNu) * dwdLnRa) / nu;
}

const LN10 = Math.log(10);

/**
 * Nusselt number in force and its elasticity, to nuSlope: Raithby–Hollands below the blend band, textbook above,
 * smooth between.
 */
function nusseltWithSlope(ra: number, pr: number, plumeRises: boolean): void {
  const { blendLowRa, blendHighRa } = naturalConvectionDefaults;
  if (ra >= blendHighRa) {
    textbookWithSlope(ra, plumeRises);
    return;
  }
  if (plumeRises) raithbyHollandsUpWithSlope(ra, pr);
  else raithbyHollandsDownWithSlope(ra, pr);
  if (ra <= blendLowRa) return;
  const lowNu = nuSlope[0]!;
  const lowE = nuSlope[1]!;
  textbookWithSlope(ra, plumeRises);
  blendWithSlope(ra, blendLowRa, blendHighRa, lowNu, lowE, nuSlope[0]!, nuSlope[1]!);
}

/** Nusselt number of the correlation in force at Rayleigh number ra and Prandtl number pr. */
export const nusselt = (ra: number, pr: number, plumeRises: boolean): number => {
  nusseltWithSlope(ra, pr, plumeRises);
  return nuSlope[0]!;
};

const slopeScratch = new Float64Array(1);

/** Heat-transfer coefficient h, W·m⁻²·K⁻¹, of a horizontal face at tK in air at fluidK; lengthM = A/P. */
export function naturalConvectionCoefficient(facing: Facing, tK: number, fluidK: number, lengthM: number): number {
  if (tK === fluidK) return 0;
  return naturalConvectionIn(facing, tK, fluidK, lengthM, slopeScratch) / (fluidK - tK);
}

const io = new Float64Array(6);

/**
 * Heat into a horizontal face at tK from air at fluidK, W/m², with its slope dq/dT in out[0]. Overwrites out[0].
 * q = h·(T∞ − T) with h = Nu(Ra, Pr)·k(T_f)/L and Ra ∝ |T − T∞|/(T_f·ν(T_f)·α(T_f)), T_f = (T + T∞)/2, so
 *   d ln h/dT = (d ln Nu/d ln Ra)·[1/(T − T∞) − ½(1/T_f + ν'/ν + α'/α)] + ½·k'/k,   dq/dT = h·(d ln h/dT)·(T∞ − T) − h.
 * The film-temperature terms matter (without them the slope is up to 20 % off on a hot face down); Pr is held, since
 * it moves by a few per cent over the whole table and Nu by a fraction of that. The air tables are read once, with
 * their slopes: one correlation evaluation per face and Newton iteration.
 */
export function naturalConvectionIn(facing: Facing, tK: number, fluidK: number, lengthM: number, out: Float64Array): number {
  io[0] = tK;
  io[1] = fluidK;
  io[2] = lengthM;
  naturalConvectionAt(facing, io);
  out[0] = io[1]!;
  return io[0]!;
}

/**
 * naturalConvectionIn() for the solver's hot path, with its numbers passed through `io` (a double passed to or
 * returned from a call the JIT does not inline is allocated on the heap): reads T = io[0], T∞ = io[1] (K) and
 * L = io[2] (m), writes q = io[0] (W/m²) and dq/dT = io[1] (W·m⁻²·K⁻¹). io needs 6 entries (it holds the air
 * properties on the way). Allocates nothing.
 */
export function naturalConvectionAt(facing: Facing, io: Float64Array): void {
  const tK = io[0]!;
  const fluidK = io[1]!;
  const lengthM = io[2]!;
  if (tK === fluidK) {
    io[0] = 0;
    io[1] = 0;
    return;
  }
  const film = 0.5 * (tK + fluidK); // filmTemperature()
  io[0] = film;
  airPropertiesAt(io);
  const k = io[0]!;
  const dK = io[1]!;
  const nuAir = io[2]!;
  const dNuAir = io[3]!;
  const alpha = io[4]!;
  const dAlpha = io[5]!;
  const dT = tK - fluidK;
  // the same expression as rayleigh() and airPrandtl(), from the same table values
  const ra = (STANDARD_GRAVITY_M_S2 * Math.abs(dT) * lengthM * lengthM * lengthM) / (film * nuAir * alpha);
  nusseltWithSlope(ra, nuAir / alpha, (facing === 'up') === (tK > fluidK)); // plumeRisesFromFace()
  const nu = nuSlope[0]!;
  const e = nuSlope[1]!;
  const h = (nu * k) / lengthM;
  const dLnRa = 1 / dT - 0.5 * (1 / film + dNuAir / nuAir + dAlpha / alpha);
  const dLnH = e * dLnRa + (0.5 * dK) / k;
  io[1] = h * dLnH * (fluidK - tK) - h;
  io[0] = h * (fluidK - tK);
}

/** Whether a Rayleigh number lies inside the published range of a correlation in use for that face. */
export function rayleighInRange(ra: number, plumeRises: boolean): boolean {
  const r = plumeRises ? naturalConvectionRanges.upperFacing : naturalConvectionRanges.lowerFacing;
  return ra >= r.low && ra <= r.high;
}

// Closed-form reference solutions for the verification tests, written from the textbook formulas
// named beside each one. Independent of the solver: nothing here imports from sim/.
// SI throughout (m, s, K, W, J, kg). Equation numbers are those of Incropera & DeWitt, Fundamentals
// of Heat and Mass Transfer, 6th ed. (2007), unless another book is named; where marked
// "(from memory)" the number was recalled, not looked up — the formula itself is derived or checked
// in tests/verification/closed-forms.test.ts.

import { SQRT_PI, brent, erf, erfcx, ierfc } from './special.ts';

/** Stefan–Boltzmann constant σ, W/(m²·K⁴) (CODATA 2018 recommended value). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

function requirePositive(name: string, value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new Error(`${name} must be positive and finite, got ${value}`);
}

function requireNonNegative(name: string, value: number): void {
  if (!(value >= 0) || !Number.isFinite(value)) throw new Error(`${name} must be ≥ 0 and finite, got ${value}`);
}

function requireFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) throw new Error(`${name} must be finite, got ${value}`);
}

// ---------------------------------------------------------------------------------------------
// Lumped capacitance
// ---------------------------------------------------------------------------------------------

/**
 * Lumped-capacitance body cooled (or heated) by convection to a fluid at Tinf:
 *   T(t) = Tinf + (T0 − Tinf)·exp(−h·t / (ρ·c·V/A))
 * Incropera eq. 5.6. Valid when Bi = h(V/A)/k ≲ 0.1 (Incropera eq. 5.10, from memory).
 *
 * @param T0 initial temperature, K
 * @param Tinf fluid temperature, K
 * @param h convection coefficient, W/(m²·K)
 * @param rho density, kg/m³
 * @param cp specific heat, J/(kg·K)
 * @param V_over_A volume per exposed area, m
 * @param t time, s (≥ 0)
 * @returns T(t), K
 */
export function lumpedConvectiveCooling(p: {
  T0: number; Tinf: number; h: number; rho: number; cp: number; V_over_A: number; t: number;
}): number {
  requireFinite('T0', p.T0);
  requireFinite('Tinf', p.Tinf);
  requirePositive('h', p.h);
  requirePositive('rho', p.rho);
  requirePositive('cp', p.cp);
  requirePositive('V_over_A', p.V_over_A);
  requireNonNegative('t', p.t);
  const timeConstant = (p.rho * p.cp * p.V_over_A) / p.h;
  return p.Tinf + (p.T0 - p.Tinf) * Math.exp(-p.t / timeConstant);
}

/**
 * Time for a lumped body to cool by radiation alone from T0 to T in black surroundings at 0 K:
 *   t = ρ·c·(V/A) / (3·ε·σ) · (1/T³ − 1/T0³)
 * Incropera eq. 5.19, from integrating ρc(V/A) dT/dt = −εσT⁴.
 */
export function lumpedRadiativeCoolingTimeZeroSurroundings(p: {
  T0: number; T: number; eps: number; rho: number; cp: number; V_over_A: number;
}): number {
  requirePositive('T0', p.T0);
  requirePositive('T', p.T);
  requirePositive('eps', p.eps);
  requirePositive('rho', p.rho);
  requirePositive('cp', p.cp);
  requirePositive('V_over_A', p.V_over_A);
  if (p.T > p.T0) throw new Error(`with surroundings at 0 K the body only cools: T ${p.T} > T0 ${p.T0}`);
  const capacity = p.rho * p.cp * p.V_over_A;
  return (capacity / (3 * p.eps * STEFAN_BOLTZMANN)) * (1 / p.T ** 3 - 1 / p.T0 ** 3);
}

/**
 * Time for a lumped body to go from T0 to T by radiation alone to large surroundings at Tsur
 * (ρc(V/A) dT/dt = −εσ(T⁴ − Tsur⁴)), Incropera eq. 5.18:
 *   t = ρ·c·(V/A) / (4·ε·σ·Tsur³) · { ln|(Tsur + T)/(Tsur − T)| − ln|(Tsur + T0)/(Tsur − T0)|
 *                                     + 2·[tan⁻¹(T/Tsur) − tan⁻¹(T0/Tsur)] }
 * from the partial fractions 1/(T⁴ − s⁴) = [1/(T² − s²) − 1/(T² + s²)]/(2s²).
 * T must lie between T0 and Tsur (cooling if T0 > Tsur, heating if T0 < Tsur); Tsur = T is never
 * reached. For Tsur = 0 the bracket and the prefactor are both singular; that case is handed to
 * eq. 5.19 ({@link lumpedRadiativeCoolingTimeZeroSurroundings}). For Tsur ≪ T the general form
 * loses about (T/Tsur)² of its relative precision to cancellation.
 *
 * @returns time, s
 */
export function lumpedRadiativeCoolingTime(p: {
  T0: number; T: number; Tsur: number; eps: number; rho: number; cp: number; V_over_A: number;
}): number {
  requireNonNegative('Tsur', p.Tsur);
  if (p.Tsur === 0) return lumpedRadiativeCoolingTimeZeroSurroundings(p);
  requirePositive('T0', p.T0);
  requirePositive('T', p.T);
  requirePositive('eps', p.eps);
  requirePositive('rho', p.rho);
  requirePositive('cp', p.cp);
  requirePositive('V_over_A', p.V_over_A);
  const s = p.Tsur;
  const towardSurroundings = (p.T - s) * (p.T0 - s) > 0 && Math.abs(p.T - s) <= Math.abs(p.T0 - s);
  if (!towardSurroundings) {
    throw new Error(`T = ${p.T} is not between T0 = ${p.T0} and Tsur = ${s} (Tsur itself is never reached)`);
  }
  const capacity = p.rho * p.cp * p.V_over_A;
  const bracket =
    Math.log(Math.abs((s + p.T) / (s - p.T))) -
    Math.log(Math.abs((s + p.T0) / (s - p.T0))) +
    2 * (Math.atan(p.T / s) - Math.atan(p.T0 / s));
  return (capacity / (4 * p.eps * STEFAN_BOLTZMANN * s ** 3)) * bracket;
}

// ---------------------------------------------------------------------------------------------
// Plane wall with convection: exact eigenfunction series
// ---------------------------------------------------------------------------------------------

/** Absolute tolerance handed to Brent for the eigenvalues (Brent adds 2ε|ζ| of its own). */
const EIGENVALUE_TOLERANCE = 1e-15;

/**
 * First n positive roots ζ₁ < ζ₂ < ... of ζ·tan ζ = Bi (Incropera eq. 5.39c, from memory; 5.42c in
 * the 7th ed.). Root n lies in ((n−1)π, (n−1)π + π/2), where ζ tan ζ rises monotonically from 0 to
 * ∞; it is found there by Brent's method on the singularity-free form ζ·sin ζ − Bi·cos ζ = 0.
 * Bi = 0 gives ζₙ = (n−1)π; Bi = Infinity (fixed surface temperature) gives ζₙ = (n − ½)π.
 *
 * @param Bi Biot number hL/k (L = half-thickness), ≥ 0 or Infinity
 * @param n number of roots (≥ 1)
 */
export function planeWallEigenvalues(Bi: number, n: number): number[] {
  if (!(Bi >= 0)) throw new Error(`Bi must be ≥ 0, got ${Bi}`);
  if (!Number.isInteger(n) || n < 1) throw new Error(`number of eigenvalues must be a positive integer, got ${n}`);
  const roots: number[] = [];
  for (let i = 0; i < n; i++) {
    const left = i * Math.PI;
    const right = left + Math.PI / 2;
    if (Bi === 0) roots.push(left);
    else if (Bi === Infinity) roots.push(right);
    else roots.push(brent((z) => z * Math.sin(z) - Bi * Math.cos(z), left, right, EIGENVALUE_TOLERANCE));
  }
  return roots;
}

/** sin(z)/z, 1 at z = 0. */
function sinc(z: number): number {
  return z === 0 ? 1 : Math.sin(z) / z;
}

/**
 * Series coefficient Cₙ = 4 sin ζₙ / (2ζₙ + sin 2ζₙ) of the plane-wall solution (Incropera eq. 5.39b,
 * from memory), written as 2·sinc(ζ)/(1 + sinc(2ζ)) so that ζ = 0 (Bi = 0) gives its limit 1.
 */
export function planeWallCoefficient(zeta: number): number {
  return (2 * sinc(zeta)) / (1 + sinc(2 * zeta));
}

function requireSeriesInputs(Fo: number, terms: number): void {
  requireNonNegative('Fo', Fo);
  if (!Number.isInteger(terms) || terms < 1) throw new Error(`terms must be a positive integer, got ${terms}`);
}

/**
 * Dimensionless temperature θ* = (T − T∞)/(Ti − T∞) in a plane wall of half-thickness L, initially
 * uniform at Ti, suddenly exposed to a fluid at T∞ with coefficient h on both faces (equivalently:
 * convective face at x* = 1, adiabatic face at x* = 0):
 *   θ*(x*, Fo) = Σₙ Cₙ exp(−ζₙ² Fo) cos(ζₙ x*),  Cₙ = 4 sin ζₙ/(2ζₙ + sin 2ζₙ),  ζₙ tan ζₙ = Bi
 * Incropera eqs. 5.39a–c (from memory; 5.42a–c in the 7th ed.), x* = x/L, Fo = αt/L², Bi = hL/k.
 * At Fo = 0 the alternating tail makes interior points converge like ≈ 0.1·Bi/terms², the face
 * x* = 1 only like ≈ 0.2/terms; for Fo ≳ 0.2 the first term alone is within 2 %.
 *
 * @param xStar x/L in [−1, 1] (the solution is even in x*)
 * @param terms number of series terms
 */
export function planeWallSeries(p: { Bi: number; Fo: number; xStar: number; terms: number }): number {
  requireSeriesInputs(p.Fo, p.terms);
  if (!(Math.abs(p.xStar) <= 1)) throw new Error(`xStar must be in [−1, 1], got ${p.xStar}`);
  let sum = 0;
  for (const zeta of planeWallEigenvalues(p.Bi, p.terms)) {
    sum += planeWallCoefficient(zeta) * Math.exp(-zeta * zeta * p.Fo) * Math.cos(zeta * p.xStar);
  }
  return sum;
}

/**
 * Fraction of the initial excess energy that has left the plane wall of {@link planeWallSeries}:
 *   Q/Q₀ = 1 − ∫₀¹ θ* dx* = 1 − Σₙ Cₙ (sin ζₙ/ζₙ) exp(−ζₙ² Fo),  Q₀ = ρc·2L·(Ti − T∞) per unit area
 * The one-term form is Incropera eq. 5.46 (from memory; 5.49 in the 7th ed.); the full series is the
 * same integration done term by term.
 */
export function planeWallEnergyFraction(p: { Bi: number; Fo: number; terms: number }): number {
  requireSeriesInputs(p.Fo, p.terms);
  let remaining = 0;
  for (const zeta of planeWallEigenvalues(p.Bi, p.terms)) {
    remaining += planeWallCoefficient(zeta) * sinc(zeta) * Math.exp(-zeta * zeta * p.Fo);
  }
  return 1 - remaining;
}

// ---------------------------------------------------------------------------------------------
// Composite wall, steady state
// ---------------------------------------------------------------------------------------------

/** One slab of a composite wall. */
export interface WallLayer {
  /** m */
  thickness: number;
  /** W/(m·K) */
  k: number;
}

/** Temperatures on the two sides of one face or contact, K. */
export interface FacePair {
  left: number;
  right: number;
}

export interface CompositeWallResult {
  /** Heat flux through the wall, W/m², positive from left to right. */
  q: number;
  /** Total series resistance per unit area, m²·K/W. */
  totalResistance: number;
  /** Temperature of the left exposed surface, K. */
  surfaceLeft: number;
  /** Temperature of the right exposed surface, K. */
  surfaceRight: number;
  /** For contact j (between layer j and layer j+1): temperature of layer j's face (left) and of layer j+1's face (right), K. */
  interfaceTemperatures: FacePair[];
  /** For each layer: temperature of its left and right face, K. */
  layerFaces: FacePair[];
}

/**
 * Steady one-dimensional conduction through layers in series between two fluids, by the thermal
 * resistance network (Incropera §3.1, eqs. 3.12–3.19, with the contact resistance R″t,c of §3.1.4,
 * eq. 3.20 — equation numbers from memory):
 *   R″tot = 1/hLeft + Σᵢ Lᵢ/kᵢ + Σⱼ R″t,c,j + 1/hRight,    q″ = (TfluidLeft − TfluidRight)/R″tot
 * and each temperature follows by subtracting q″·R″ of every resistance passed from the left.
 * h = Infinity means the surface is held at the fluid temperature (zero film resistance).
 *
 * @param contactResistances one per neighbouring pair of layers (layers.length − 1 entries), m²·K/W, ≥ 0
 */
export function compositeWallSteady(p: {
  layers: WallLayer[];
  contactResistances: number[];
  hLeft: number;
  TfluidLeft: number;
  hRight: number;
  TfluidRight: number;
}): CompositeWallResult {
  if (p.layers.length === 0) throw new Error('a composite wall needs at least one layer');
  if (p.contactResistances.length !== p.layers.length - 1) {
    throw new Error(`expected ${p.layers.length - 1} contact resistances, got ${p.contactResistances.length}`);
  }
  if (!(p.hLeft > 0) || !(p.hRight > 0)) throw new Error(`h must be positive (or Infinity), got ${p.hLeft}, ${p.hRight}`);
  requireFinite('TfluidLeft', p.TfluidLeft);
  requireFinite('TfluidRight', p.TfluidRight);
  p.layers.forEach((layer, i) => {
    requirePositive(`layers[${i}].thickness`, layer.thickness);
    requirePositive(`layers[${i}].k`, layer.k);
  });
  p.contactResistances.forEach((r, j) => requireNonNegative(`contactResistances[${j}]`, r));

  const filmLeft = 1 / p.hLeft;
  const filmRight = 1 / p.hRight;
  const layerResistances = p.layers.map((layer) => layer.thickness / layer.k);
  const totalResistance =
    filmLeft + filmRight + layerResistances.reduce((a, b) => a + b, 0) + p.contactResistances.reduce((a, b) => a + b, 0);
  const q = (p.TfluidLeft - p.TfluidRight) / totalResistance;

  const surfaceLeft = p.TfluidLeft - q * filmLeft;
  const layerFaces: FacePair[] = [];
  const interfaceTemperatures: FacePair[] = [];
  let T = surfaceLeft;
  layerResistances.forEach((r, i) => {
    const left = T;
    T -= q * r;
    layerFaces.push({ left, right: T });
    const contact = p.contactResistances[i];
    if (contact !== undefined) {
      const before = T;
      T -= q * contact;
      interfaceTemperatures.push({ left: before, right: T });
    }
  });
  return { q, totalResistance, surfaceLeft, surfaceRight: T, interfaceTemperatures, layerFaces };
}

// ---------------------------------------------------------------------------------------------
// Semi-infinite solid
// ---------------------------------------------------------------------------------------------

function requireSemiInfiniteInputs(alpha: number, x: number, t: number): void {
  requirePositive('alpha', alpha);
  requireNonNegative('x', x);
  requirePositive('t', t);
}

/**
 * Semi-infinite solid initially at Ti whose surface x = 0 is held at Ts from t = 0:
 *   (T − Ts)/(Ti − Ts) = erf(x / (2√(αt)))
 * Incropera eq. 5.57 (from memory).
 */
export function semiInfiniteFixedSurface(p: { Ti: number; Ts: number; alpha: number; x: number; t: number }): number {
  requireSemiInfiniteInputs(p.alpha, p.x, p.t);
  return p.Ts + (p.Ti - p.Ts) * erf(p.x / (2 * Math.sqrt(p.alpha * p.t)));
}

/**
 * Surface heat flux of {@link semiInfiniteFixedSurface}, W/m², positive into the solid:
 *   q″s(t) = k (Ts − Ti) / √(π α t)
 * Incropera eq. 5.58 (from memory).
 */
export function semiInfiniteFixedSurfaceFlux(p: { Ti: number; Ts: number; k: number; alpha: number; t: number }): number {
  requirePositive('k', p.k);
  requireSemiInfiniteInputs(p.alpha, 0, p.t);
  return (p.k * (p.Ts - p.Ti)) / Math.sqrt(Math.PI * p.alpha * p.t);
}

/**
 * Semi-infinite solid initially at Ti receiving a constant flux q0 (W/m², positive into the solid) at
 * x = 0 from t = 0:
 *   T = Ti + (2 q0 √(αt/π)/k)·exp(−x²/(4αt)) − (q0 x/k)·erfc(x/(2√(αt)))     Incropera eq. 5.59
 *     = Ti + (2 q0 √(αt)/k)·ierfc(x/(2√(αt)))                               Carslaw & Jaeger §2.9
 * (equation and section numbers from memory). Evaluated in the ierfc form, which does not cancel at
 * depth; the two forms are compared in the tests.
 */
export function semiInfiniteConstantFlux(p: { Ti: number; q0: number; k: number; alpha: number; x: number; t: number }): number {
  requirePositive('k', p.k);
  requireSemiInfiniteInputs(p.alpha, p.x, p.t);
  const rootAlphaT = Math.sqrt(p.alpha * p.t);
  return p.Ti + ((2 * p.q0 * rootAlphaT) / p.k) * ierfc(p.x / (2 * rootAlphaT));
}

// ---------------------------------------------------------------------------------------------
// Stefan problem: Neumann's similarity solution
// ---------------------------------------------------------------------------------------------

/** Pure relative accuracy for the λ roots: an absolute tolerance far below any λ that occurs. */
const LAMBDA_TOLERANCE = 1e-300;
/** Bracket search doubles/halves λ from 1 at most this many times. */
const LAMBDA_BRACKET_STEPS = 1100;

/**
 * Bracket a root of a function that is positive below the root and negative above it, starting
 * from λ = 1 and doubling or halving, then solve it with Brent.
 */
function solveDecreasing(g: (lambda: number) => number, what: string): number {
  let lo = 1;
  let hi = 1;
  if (g(1) > 0) {
    for (let i = 0; g(hi) > 0; i++) {
      if (i >= LAMBDA_BRACKET_STEPS) throw new Error(`${what}: no upper bracket for λ`);
      lo = hi;
      hi *= 2;
    }
  } else {
    for (let i = 0; g(lo) <= 0; i++) {
      if (i >= LAMBDA_BRACKET_STEPS) throw new Error(`${what}: no lower bracket for λ`);
      hi = lo;
      lo /= 2;
    }
  }
  return brent(g, lo, hi, LAMBDA_TOLERANCE);
}

/**
 * One-phase Stefan problem (liquid at the melting point, wall held below it): the front is
 * X = 2λ√(αt) with λ the root of
 *   λ·exp(λ²)·erf(λ) = St/√π,   St = c (Tm − Tw)/L
 * (Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes (1993), §2.1 —
 * section from memory; Carslaw & Jaeger §11.2 with no superheat). Small St: λ ≈ √(St/2).
 *
 * @param St Stefan number of the solid, > 0
 */
export function stefanOnePhaseLambda(St: number): number {
  requirePositive('St', St);
  // λ e^{λ²} erf λ increases from 0 with λ; negate to get the decreasing form solveDecreasing wants.
  return solveDecreasing((lambda) => St / SQRT_PI - lambda * Math.exp(lambda * lambda) * erf(lambda), 'one-phase Stefan');
}

export interface NeumannSolution {
  /** Dimensionless front constant: X(t) = 2λ√(αS t). */
  lambda: number;
  /** ν = √(αS/αL). */
  nu: number;
  /** Stefan number of the solid, cS (Tm − Tw)/L. */
  stefanSolid: number;
  /** Stefan number of the liquid (superheat), cL (Ti − Tm)/L. */
  stefanLiquid: number;
  /** Solid–liquid front position X(t), m. */
  frontPosition(t: number): number;
  /** Temperature at depth x ≥ 0 and time t ≥ 0, K. */
  temperature(x: number, t: number): number;
}

/**
 * Neumann's solution of the two-phase Stefan problem: liquid on x > 0, initially at Ti > Tm; from
 * t = 0 the wall x = 0 is held at Tw < Tm and a solid layer 0 < x < X(t) grows from it.
 * Densities of the two phases are equal (no shrinkage flow). With αS = kS/(ρcS), αL = kL/(ρcL),
 * ν = √(αS/αL), StS = cS(Tm − Tw)/L, StL = cL(Ti − Tm)/L:
 *
 *   X(t) = 2λ√(αS t)
 *   solid:  T = Tw + (Tm − Tw)·erf(x/(2√(αS t)))/erf(λ)                       0 ≤ x ≤ X
 *   liquid: T = Ti − (Ti − Tm)·erfc(x/(2√(αL t)))/erfc(νλ)                    x ≥ X
 *   Stefan condition kS ∂T/∂x|S − kL ∂T/∂x|L = ρ L dX/dt gives the transcendental equation
 *     StS/(exp(λ²)·erf(λ)) − StL/(ν·exp(ν²λ²)·erfc(νλ)) = λ√π
 *
 * Carslaw & Jaeger, Conduction of Heat in Solids (2nd ed. 1959) §11.2; Alexiades & Solomon (1993)
 * §2.2 (section numbers from memory; the equation above is re-derived from the Stefan condition and
 * checked by finite differences in the tests). The left side falls monotonically from +∞ at λ = 0,
 * so the root is unique; it is bracketed by doubling/halving and solved with Brent. exp(ν²λ²)·erfc(νλ)
 * is evaluated as erfcx(νλ) so that large νλ neither overflows nor underflows. Ti = Tm reduces to
 * {@link stefanOnePhaseLambda}.
 *
 * @param L latent heat of fusion, J/kg
 * @param rho density of both phases, kg/m³
 */
export function neumannSolidification(p: {
  Tm: number; Tw: number; Ti: number; L: number; rho: number; kS: number; cS: number; kL: number; cL: number;
}): NeumannSolution {
  requireFinite('Tm', p.Tm);
  requireFinite('Tw', p.Tw);
  requireFinite('Ti', p.Ti);
  if (!(p.Tw < p.Tm)) throw new Error(`wall temperature ${p.Tw} must be below the melting point ${p.Tm}`);
  if (!(p.Ti >= p.Tm)) throw new Error(`initial liquid temperature ${p.Ti} must be at or above the melting point ${p.Tm}`);
  requirePositive('L', p.L);
  requirePositive('rho', p.rho);
  requirePositive('kS', p.kS);
  requirePositive('cS', p.cS);
  requirePositive('kL', p.kL);
  requirePositive('cL', p.cL);

  const alphaS = p.kS / (p.rho * p.cS);
  const alphaL = p.kL / (p.rho * p.cL);
  const nu = Math.sqrt(alphaS / alphaL);
  const stefanSolid = (p.cS * (p.Tm - p.Tw)) / p.L;
  const stefanLiquid = (p.cL * (p.Ti - p.Tm)) / p.L;
  const residual = (lambda: number): number =>
    (stefanSolid * Math.exp(-lambda * lambda)) / erf(lambda) - stefanLiquid / (nu * erfcx(nu * lambda)) - lambda * SQRT_PI;
  const lambda = solveDecreasing(residual, 'Neumann');

  const frontPosition = (t: number): number => {
    requireNonNegative('t', t);
    return 2 * lambda * Math.sqrt(alphaS * t);
  };
  const temperature = (x: number, t: number): number => {
    requireNonNegative('x', x);
    requireNonNegative('t', t);
    if (t === 0) return x === 0 ? p.Tw : p.Ti;
    if (x <= frontPosition(t)) {
      return p.Tw + ((p.Tm - p.Tw) * erf(x / (2 * Math.sqrt(alphaS * t)))) / erf(lambda);
    }
    // erfc(η)/erfc(νλ) = exp((νλ)² − η²)·erfcx(η)/erfcx(νλ), safe when both erfc underflow.
    const eta = x / (2 * Math.sqrt(alphaL * t));
    const front = nu * lambda;
    const ratio = Math.exp((front - eta) * (front + eta)) * (erfcx(eta) / erfcx(front));
    return p.Ti - (p.Ti - p.Tm) * ratio;
  };
  return { lambda, nu, stefanSolid, stefanLiquid, frontPosition, temperature };
}

// ---------------------------------------------------------------------------------------------
// Heat generation
// ---------------------------------------------------------------------------------------------

/**
 * Steady temperature in a slab −L ≤ x ≤ L with uniform generation q̇ and both faces held at Ts:
 *   T(x) = Ts + q̇L²/(2k)·(1 − x²/L²)
 * Incropera eq. 3.42 (from memory). Each face then passes q̇L (W/m²) out of the slab.
 *
 * @param qdot volumetric generation, W/m³
 * @param L half-thickness, m
 * @returns T(x) for |x| ≤ L, K
 */
export function uniformGenerationSlabSteady(p: { qdot: number; k: number; L: number; Ts: number }): (x: number) => number {
  requireFinite('qdot', p.qdot);
  requirePositive('k', p.k);
  requirePositive('L', p.L);
  requireFinite('Ts', p.Ts);
  const { qdot, k, L, Ts } = p;
  return (x: number): number => {
    if (!(Math.abs(x) <= L)) throw new Error(`x = ${x} is outside the slab [−${L}, ${L}]`);
    return Ts + ((qdot * L * L) / (2 * k)) * (1 - (x * x) / (L * L));
  };
}

/**
 * Temperature rise of an adiabatic body with uniform generation q̇ (W/m³) over time t:
 *   ΔT = q̇·t/(ρ·cp)
 * (conservation of energy for a closed system, Incropera §1.3.1 — section from memory).
 */
export function adiabaticGenerationRise(p: { qdot: number; rho: number; cp: number; t: number }): number {
  requireFinite('qdot', p.qdot);
  requirePositive('rho', p.rho);
  requirePositive('cp', p.cp);
  requireNonNegative('t', p.t);
  return (p.qdot * p.t) / (p.rho * p.cp);
}

// ---------------------------------------------------------------------------------------------
// Adiabatic stack through a phase change: energy balance on a piecewise-linear enthalpy
// ---------------------------------------------------------------------------------------------

/** How much of a piece there is per unit area of the stack: directly, or as ρ·thickness·volume fraction. */
export type PieceAmount =
  | { /** kg/m² */ massPerArea: number }
  | { /** kg/m³ */ rho: number; /** m */ thickness: number; /** 0..1, default 1 (e.g. the salt's share of a porous separator) */ volumeFraction?: number };

/** One piece of an adiabatic stack (a layer, or one constituent of a layer). */
export type PhaseChangePiece = PieceAmount & {
  /** Specific heat, J/(kg·K), the same in both phases. */
  cp: number;
  /** Initial temperature, K. */
  T0: number;
  /** Latent heat of fusion, J/kg (0 or omitted: no phase change). */
  latent?: number;
  /** Start of melting, K (required with latent > 0). */
  solidus?: number;
  /** End of melting, K (≥ solidus; equal means an isothermal jump). Required with latent > 0. */
  liquidus?: number;
  /** Only when T0 equals an isothermal melting point: the initial liquid fraction (default 0). */
  initialLiquidFraction?: number;
};

export interface AdiabaticPhaseChangeResult {
  /** Final uniform temperature, K. */
  T: number;
  /** Final liquid fraction of each piece, 0..1 (0 for pieces without solidus/liquidus). */
  liquidFractions: number[];
}

interface NormalisedPiece {
  mass: number;
  cp: number;
  T0: number;
  latent: number;
  solidus: number | undefined;
  liquidus: number | undefined;
  initialLiquidFraction: number | undefined;
}

function normalisePiece(piece: PhaseChangePiece, i: number): NormalisedPiece {
  let mass: number;
  if ('massPerArea' in piece) {
    mass = piece.massPerArea;
  } else {
    const fraction = piece.volumeFraction ?? 1;
    if (!(fraction > 0 && fraction <= 1)) throw new Error(`pieces[${i}].volumeFraction must be in (0, 1], got ${fraction}`);
    requirePositive(`pieces[${i}].rho`, piece.rho);
    requirePositive(`pieces[${i}].thickness`, piece.thickness);
    mass = piece.rho * piece.thickness * fraction;
  }
  requirePositive(`pieces[${i}] mass per area`, mass);
  requirePositive(`pieces[${i}].cp`, piece.cp);
  requireFinite(`pieces[${i}].T0`, piece.T0);
  const latent = piece.latent ?? 0;
  requireNonNegative(`pieces[${i}].latent`, latent);
  const { solidus, liquidus } = piece;
  if ((solidus === undefined) !== (liquidus === undefined)) throw new Error(`pieces[${i}]: give both solidus and liquidus, or neither`);
  if (latent > 0 && solidus === undefined) throw new Error(`pieces[${i}]: latent heat needs solidus and liquidus`);
  if (solidus !== undefined && liquidus !== undefined) {
    requireFinite(`pieces[${i}].solidus`, solidus);
    requireFinite(`pieces[${i}].liquidus`, liquidus);
    if (liquidus < solidus) throw new Error(`pieces[${i}]: liquidus ${liquidus} is below solidus ${solidus}`);
  }
  const f0 = piece.initialLiquidFraction;
  if (f0 !== undefined) {
    if (solidus === undefined || solidus !== liquidus || piece.T0 !== solidus) {
      throw new Error(`pieces[${i}].initialLiquidFraction applies only when T0 equals an isothermal melting point`);
    }
    if (!(f0 >= 0 && f0 <= 1)) throw new Error(`pieces[${i}].initialLiquidFraction must be in [0, 1], got ${f0}`);
  }
  return { mass, cp: piece.cp, T0: piece.T0, latent, solidus, liquidus, initialLiquidFraction: f0 };
}

/**
 * Liquid fraction φ(T) of the linear rule; at an isothermal melting point (solidus = liquidus = Tm)
 * `side` chooses the left limit (solid, 0) or the right limit (liquid, 1).
 */
function liquidFraction(piece: NormalisedPiece, T: number, side: 'below' | 'above'): number {
  const { solidus, liquidus } = piece;
  if (solidus === undefined || liquidus === undefined) return 0;
  if (T < solidus) return 0;
  if (T > liquidus) return 1;
  if (solidus === liquidus) return side === 'above' ? 1 : 0;
  return (T - solidus) / (liquidus - solidus);
}

/**
 * Final uniform temperature of an adiabatic stack after heat Q (J/m², negative to remove heat) is
 * added and the pieces have come to a common temperature. First-law energy balance with a
 * piecewise-linear specific enthalpy per piece (the enthalpy formulation of phase change; e.g.
 * Alexiades & Solomon (1993) ch. 4 — chapter from memory):
 *
 *   hᵢ(T) = cpᵢ·(T − Tref) + Lᵢ·φᵢ(T),   φᵢ = 0 below solidus, (T − Tsol)/(Tliq − Tsol) between, 1 above
 *   Σᵢ mᵢ·hᵢ(T_final) = Σᵢ mᵢ·hᵢ(T0ᵢ) + Q,   mᵢ = massPerArea or ρ·thickness·volumeFraction
 *
 * With solidus = liquidus = Tm the latent heat is a jump at Tm; a final state at Tm is then partly
 * melted, and when several pieces share that Tm they are given the same liquid fraction (the split
 * between them is not fixed by the balance). Σ mᵢhᵢ is strictly increasing and linear between the
 * solidus/liquidus breakpoints, so T_final is found exactly by locating the segment and interpolating.
 */
export function adiabaticPhaseChangeFinalTemperature(p: { pieces: PhaseChangePiece[]; Q: number }): AdiabaticPhaseChangeResult {
  if (p.pieces.length === 0) throw new Error('an adiabatic stack needs at least one piece');
  requireFinite('Q', p.Q);
  const pieces = p.pieces.map(normalisePiece);
  const Tref = Math.min(...pieces.map((piece) => piece.T0));

  const stackEnthalpy = (T: number, side: 'below' | 'above'): number =>
    pieces.reduce((sum, piece) => sum + piece.mass * (piece.cp * (T - Tref) + piece.latent * liquidFraction(piece, T, side)), 0);

  const initialEnthalpy = pieces.reduce((sum, piece) => {
    const f0 = piece.initialLiquidFraction ?? liquidFraction(piece, piece.T0, 'below');
    return sum + piece.mass * (piece.cp * (piece.T0 - Tref) + piece.latent * f0);
  }, 0);
  const target = initialEnthalpy + p.Q;
  const sensibleCapacity = pieces.reduce((sum, piece) => sum + piece.mass * piece.cp, 0);

  const breakpoints = [...new Set(pieces.flatMap((piece) =>
    piece.solidus !== undefined && piece.liquidus !== undefined ? [piece.solidus, piece.liquidus] : []))].sort((a, b) => a - b);

  const finalTemperature = ((): number => {
    const first = breakpoints[0];
    const last = breakpoints[breakpoints.length - 1];
    if (first === undefined || last === undefined) return Tref + target / sensibleCapacity;
    const belowFirst = stackEnthalpy(first, 'below');
    if (target <= belowFirst) return first - (belowFirst - target) / sensibleCapacity;
    for (let j = 0; j < breakpoints.length; j++) {
      const b = breakpoints[j] as number;
      const hBelow = stackEnthalpy(b, 'below');
      const hAbove = stackEnthalpy(b, 'above');
      if (target >= hBelow && target <= hAbove) return b;
      const next = breakpoints[j + 1];
      if (next === undefined) break;
      const hNext = stackEnthalpy(next, 'below');
      if (target > hAbove && target < hNext) return b + ((target - hAbove) * (next - b)) / (hNext - hAbove);
    }
    return last + (target - stackEnthalpy(last, 'above')) / sensibleCapacity;
  })();

  // Pieces with an isothermal melting point exactly at the final temperature share what is left.
  const atJump = (piece: NormalisedPiece): boolean =>
    piece.latent > 0 && piece.solidus === finalTemperature && piece.liquidus === finalTemperature;
  const jumpLatent = pieces.reduce((sum, piece) => sum + (atJump(piece) ? piece.mass * piece.latent : 0), 0);
  const sharedFraction =
    jumpLatent > 0 ? Math.min(1, Math.max(0, (target - stackEnthalpy(finalTemperature, 'below')) / jumpLatent)) : 0;
  const liquidFractions = pieces.map((piece) => (atJump(piece) ? sharedFraction : liquidFraction(piece, finalTemperature, 'below')));
  return { T: finalTemperature, liquidFractions };
}

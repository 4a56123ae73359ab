// Special functions and a root finder for the closed-form references. Written from the published
// methods named beside each function; nothing here is shared with the solver.

/** √π. */
export const SQRT_PI = Math.sqrt(Math.PI);

/** Unit roundoff of IEEE-754 double precision, 2⁻⁵². */
const DOUBLE_EPSILON = Number.EPSILON;

/**
 * Below this |x| erf comes from the power series (A&S 7.1.6), at and above it erfc comes from the
 * continued fraction (A&S 7.1.14). At 1, erfc = 1 − erf loses at most a factor 1/erfc(1) ≈ 6.4 of
 * relative precision, and the continued fraction needs about 200 terms there (60 at x = 2, 7 at 26).
 */
const SERIES_LIMIT = 1.0;

/** Grid of the exact split in exp(−x²), after W. J. Cody's CALERF: x = x₁₆ + r with x₁₆ = ⌊16x⌋/16. */
const SPLIT_GRID = 16;

/** Iteration cap for the series and the continued fraction (never reached for finite x). */
const MAX_EXPANSION_TERMS = 5000;

/**
 * exp(−x²) without the rounding error of forming x² (which is x²·ε in the exponent, ≈ 8e-14
 * relative at x = 27). Splits x = x₁₆ + r where x₁₆ = ⌊16x⌋/16 has few enough bits that x₁₆² is
 * exact, then exp(−x²) = exp(−x₁₆²)·exp(−(x − x₁₆)(x + x₁₆)). Method of W. J. Cody, "Rational
 * Chebyshev approximations for the error function", Math. Comp. 23 (1969) 631–637, as used in
 * his CALERF routine (SPECFUN).
 */
function expMinusSquare(x: number): number {
  const ax = Math.abs(x);
  const coarse = Math.trunc(ax * SPLIT_GRID) / SPLIT_GRID;
  const rest = (ax - coarse) * (ax + coarse);
  return Math.exp(-coarse * coarse) * Math.exp(-rest);
}

/** exp(+x²) with the same exact split as {@link expMinusSquare}. */
function expPlusSquare(x: number): number {
  const ax = Math.abs(x);
  const coarse = Math.trunc(ax * SPLIT_GRID) / SPLIT_GRID;
  const rest = (ax - coarse) * (ax + coarse);
  return Math.exp(coarse * coarse) * Math.exp(rest);
}

/**
 * erf(x) for |x| < SERIES_LIMIT by the everywhere-positive series
 *   erf x = (2/√π) e^{−x²} Σ_{n≥0} 2ⁿ x^{2n+1} / (1·3·5···(2n+1))
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, eq. 7.1.6 — equation number from memory).
 * All terms have the sign of x, so there is no cancellation.
 */
function erfSeries(x: number): number {
  const twoXSquared = 2 * x * x;
  let term = x;
  let sum = x;
  for (let n = 1; n < MAX_EXPANSION_TERMS; n++) {
    term *= twoXSquared / (2 * n + 1);
    sum += term;
    if (Math.abs(term) <= DOUBLE_EPSILON * Math.abs(sum)) break;
  }
  return ((2 / SQRT_PI) * expMinusSquare(x)) * sum;
}

/**
 * Tail R(x) of Laplace's continued fraction for x ≥ SERIES_LIMIT:
 *   √π e^{x²} erfc x = 1/(x + R),   R = (1/2)/(x + 1/(x + (3/2)/(x + 2/(x + ...))))
 * (Abramowitz & Stegun eq. 7.1.14 — equation number from memory; partial numerators k/2, k = 1, 2, ...).
 * Evaluated as R = (1/2)/K with K = x + 1/(x + (3/2)/(x + ...)) by the modified Lentz method
 * (W. J. Lentz, Appl. Opt. 15 (1976) 668; Numerical Recipes 3rd ed. §5.2). Keeping R apart from x
 * lets ierfc avoid the cancellation of its defining formula.
 */
function laplaceTail(x: number): number {
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let j = 1; j < MAX_EXPANSION_TERMS; j++) {
    const a = (j + 1) / 2;
    d = x + a * d;
    if (d === 0) d = tiny;
    c = x + a / c;
    if (c === 0) c = tiny;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) <= DOUBLE_EPSILON) break;
  }
  return 0.5 / f;
}

/**
 * Complementary error function erfc(x) = (2/√π)∫ₓ^∞ e^{−t²} dt.
 *
 * Method: |x| < 1, erfc = 1 − erf with erf from the positive series A&S 7.1.6; x ≥ 1, Laplace's
 * continued fraction A&S 7.1.14 by modified Lentz, with exp(−x²) formed by Cody's exact split;
 * x ≤ −1, erfc(x) = 2 − erfc(−x) (A&S 7.1.2/7.1.9, from memory).
 *
 * Accuracy: better than 2e-15 relative for x in [−6, 26.5] (worst case of an off-line scan against
 * 40-digit arbitrary-precision values; the tests check 1e-13 against quadrature and the asymptotic
 * series). Past x ≈ 26.55 the value (< 2.2e-308) is a subnormal double and keeps only its absolute
 * accuracy (≈ 5e-324); it is 0 past x ≈ 27.3.
 */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (Math.abs(x) < SERIES_LIMIT) return 1 - erfSeries(x);
  if (x < 0) return 2 - erfc(-x);
  if (x === Infinity) return 0;
  return expMinusSquare(x) / (SQRT_PI * (x + laplaceTail(x)));
}

/** Error function erf(x) = (2/√π)∫₀ˣ e^{−t²} dt; series A&S 7.1.6 for |x| < 1, 1 − erfc otherwise. */
export function erf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (Math.abs(x) < SERIES_LIMIT) return erfSeries(x);
  return x > 0 ? 1 - erfc(x) : erfc(-x) - 1;
}

/**
 * Scaled complementary error function erfcx(x) = e^{x²} erfc(x), which stays finite (≈ 1/(x√π))
 * where erfc underflows. For x ≥ 1 it is 1/(√π(x + R)) from the continued fraction A&S 7.1.14;
 * below, e^{x²}·erfc(x) (overflows for x < −26.6).
 */
export function erfcx(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x >= SERIES_LIMIT) {
    if (x === Infinity) return 0;
    return 1 / (SQRT_PI * (x + laplaceTail(x)));
  }
  return expPlusSquare(x) * erfc(x);
}

/**
 * First repeated integral of erfc: ierfc(x) = ∫ₓ^∞ erfc(s) ds = e^{−x²}/√π − x·erfc(x)
 * (Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed. 1959, Appendix II; A&S 7.2.1–7.2.3 —
 * numbers from memory). ierfc(0) = 1/√π.
 *
 * For x ≥ 1 the two terms nearly cancel (by a factor ≈ 2x²), so there it is evaluated as
 * e^{−x²}/√π · R/(x + R) with R the tail of Laplace's continued fraction (see {@link erfc}),
 * which is algebraically the same and free of cancellation.
 */
export function ierfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x >= SERIES_LIMIT) {
    if (x === Infinity) return 0;
    const tail = laplaceTail(x);
    return ((expMinusSquare(x) / SQRT_PI) * tail) / (x + tail);
  }
  if (x === -Infinity) return Infinity;
  return expMinusSquare(x) / SQRT_PI - x * erfc(x);
}

/** Default cap on Brent iterations; the method needs at most ≈ (log₂((b−a)/tol))² of them. */
const BRENT_MAX_ITERATIONS = 500;

/**
 * Root of f in [a, b] by Brent's method: inverse quadratic interpolation and secant steps,
 * safeguarded by bisection so that the bracket always shrinks.
 * Source: R. P. Brent, Algorithms for Minimization without Derivatives (Prentice-Hall, 1973),
 * ch. 4, procedure `zero`; also Numerical Recipes 3rd ed. §9.3 (`zbrent`).
 *
 * @param f   continuous function with f(a)·f(b) ≤ 0
 * @param a   one end of the bracket
 * @param b   other end of the bracket
 * @param tol absolute tolerance on the root, > 0; the result is within 4·ε·|root| + 2·tol of a zero
 *            (Brent's bound, with ε the unit roundoff)
 * @throws if f(a) and f(b) have the same strict sign, if tol ≤ 0, if f returns NaN,
 *         or if the iteration cap is reached
 */
export function brent(
  f: (x: number) => number,
  a: number,
  b: number,
  tol: number,
  maxIterations: number = BRENT_MAX_ITERATIONS,
): number {
  if (!(tol > 0)) throw new Error(`brent: tolerance must be positive, got ${tol}`);
  if (!Number.isFinite(a) || !Number.isFinite(b)) throw new Error(`brent: bracket [${a}, ${b}] is not finite`);
  let fa = f(a);
  let fb = f(b);
  if (Number.isNaN(fa) || Number.isNaN(fb)) throw new Error(`brent: f is NaN at a bracket end [${a}, ${b}]`);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if ((fa > 0 && fb > 0) || (fa < 0 && fb < 0)) {
    throw new Error(`brent: f(${a}) = ${fa} and f(${b}) = ${fb} do not bracket a root`);
  }
  // c is the previous iterate on the other side of the root from b; d the last step, e the one before.
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol1 = 2 * DOUBLE_EPSILON * Math.abs(b) + tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) return b;
    if (Math.abs(e) < tol1 || Math.abs(fa) <= Math.abs(fb)) {
      d = m; e = m; // bisection
    } else {
      let s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s; // secant
        q = 1 - s;
      } else {
        const qa = fa / fc; // inverse quadratic interpolation
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      s = e;
      e = d;
      if (2 * p < 3 * m * q - Math.abs(tol1 * q) && p < Math.abs(0.5 * s * q)) {
        d = p / q; // accept interpolation
      } else {
        d = m; e = m; // fall back to bisection
      }
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = f(b);
    if (Number.isNaN(fb)) throw new Error(`brent: f is NaN at ${b}`);
    if ((fb > 0 && fc > 0) || (fb <= 0 && fc <= 0)) {
      c = a; fc = fa;
      d = b - a; e = d;
    }
  }
  throw new Error(`brent: no convergence in ${maxIterations} iterations (bracket [${b}, ${c}])`);
}

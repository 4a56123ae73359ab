/**
 * Where Newton's linear model of a cell breaks: the enthalpies at which the stage Jacobian jumps (the solidus and
 * liquidus, where the capacity of T(H) jumps). Newton's method on a piecewise-smooth function converges from either
 * side of a kink but can cycle across it (Kelley, Iterative Methods for Linear and Nonlinear Equations, SIAM 1995,
 * §5.1: the convergence theory asks for a Lipschitz Jacobian), so an update that would cross one stops just past it
 * and the next iteration starts with the right slope (tr-bdf2.ts).
 *
 * Tried and left out: stopping at the rows of a tabulated k(T) as well. It cured 4 fuzz scenarios whose cell cycled
 * across a steep row, and broke 4 others of the first 500 of seed 9 (more stops, so more Newton iterations than the
 * limit); the steep-k(T) failures have a deeper cause (DEVELOPERS.md, robustness).
 */

/**
 * A Newton update from `old` to `next` that would cross a kink (`kinks` ascending, J/m³) stops just past the nearest
 * one crossed, `nudge` beyond it: the first going up, the last going down. Returns the (possibly shortened) new value.
 * Allocates nothing.
 */
export function stopAtKink(kinks: Float64Array, old: number, next: number, nudge: number): number {
  if (next > old) {
    for (let k = 0; k < kinks.length; k++) {
      const at = kinks[k]!;
      if (old < at && next > at + nudge) return at + nudge;
    }
  } else {
    for (let k = kinks.length - 1; k >= 0; k--) {
      const at = kinks[k]!;
      if (old > at && next < at - nudge) return at - nudge;
    }
  }
  return next;
}

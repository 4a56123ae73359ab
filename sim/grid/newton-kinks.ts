/**
 * Where Newton's linear model of a cell breaks: the enthalpies at which the stage Jacobian jumps (the solidus and
 * liquidus, where the capacity of T(H) jumps). Newton's method on a piecewise-smooth function converges from either
 * side of a kink but can cycle across it (Kelley, Iterative Methods for Linear and Nonlinear Equations, SIAM 1995,
 * §5.1: the convergence theory asks for a Lipschitz Jacobian), so an update that would cross one stops just past it
 * and the next iteration starts with the right slope (line-system.ts).
 *
 * Tried and left out: stopping at the rows of a tabulated k(T) as well. It cured 4 fuzz scenarios whose cell cycled
 * across a steep row, and broke 4 others of the first 500 of seed 9 (more stops, so more Newton iterations than the
 * limit). The steep-k(T) failures have a deeper cause, in the space discretisation: k is taken at the cell's own
 * temperature, so the conductance G toward a much hotter neighbour grows with the cell's temperature; where
 * (dG/dT)·ΔT > G (k ×95 over 4 K, 170 K across the face) the discrete flux falls as the cell warms, a cell locks onto
 * the row and the solver chatters there (one 13-cell run took 1.4 M steps of ~1e-9 s). A half-cell flux through the
 * Kirchhoff transform Φ(T) = ∫k dT is monotone in both temperatures and removes it (grid/kirchhoff.ts).
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

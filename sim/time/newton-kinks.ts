/**
 * Where Newton's linear model of a cell breaks: the enthalpies at which the stage Jacobian jumps. Newton's method on a
 * piecewise-smooth function converges from either side of a kink but can cycle across it (Kelley, Iterative Methods
 * for Linear and Nonlinear Equations, SIAM 1995, §5.1: the convergence theory asks for a Lipschitz Jacobian), so an
 * update that would cross one stops just past it and the next iteration starts with the right slope (tr-bdf2.ts).
 *
 * The kinks of a cell are the kinks of its T(H) (solidus and liquidus, where the capacity jumps) and the rows of a
 * tabulated k(T): the conductance's slope jumps there, and a steep row pair beside a flat one (k ×55 over 1.4 K)
 * made Newton cycle a cell across the row and its face node by 100 K, at every step size down to the smallest.
 */
import type { Material } from '../physics/material.ts';
import { enthalpyAt } from '../physics/material.ts';

const byMaterial = new WeakMap<Material, Float64Array>();

/** A material's kinks, J/m³, ascending and unique. Computed once per material. */
export function newtonKinks(material: Material): Float64Array {
  const known = byMaterial.get(material);
  if (known) return known;
  const { melt, conductivity, enthalpy } = material;
  const at = new Set<number>(enthalpy.kinks);
  if (conductivity.tK.length > 1) {
    for (const tK of conductivity.tK) {
      // a melting material reads its table only outside the melt (material.ts, conductivityAt)
      if (melt !== undefined && tK > melt.solidTableK && tK < melt.liquidTableK) continue;
      at.add(enthalpyAt(enthalpy, tK));
    }
  }
  const kinks = Float64Array.from([...at].sort((a, b) => a - b));
  byMaterial.set(material, kinks);
  return kinks;
}

const byGrid = new WeakMap<readonly Material[], readonly Float64Array[]>();

/** Each cell's kinks (newtonKinks of its material), for a grid's materials. Computed once per grid. */
export function cellKinks(materials: readonly Material[]): readonly Float64Array[] {
  const known = byGrid.get(materials);
  if (known) return known;
  const kinks = materials.map(newtonKinks);
  byGrid.set(materials, kinks);
  return kinks;
}

/**
 * A Newton update from `old` to `next` that would cross a kink stops just past the nearest one crossed (`nudge` beyond
 * it, in J/m³). Returns the (possibly shortened) new value. Allocates nothing.
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

/**
 * A smooth function of temperature q(T), with its slope, read from a table that fills itself: nodes every stepK
 * kelvin from 0 K to topK, each the exact q and dq/dT (computed the first time a temperature falls beside it, from a
 * fixed start, so a node's value does not depend on who fills it), and cubic Hermite interpolation between them, with
 * the interpolant's own slope (so Newton linearises what it solves). Within nearK of `centreK` and outside the table,
 * the exact form is used. Between kinks the error is Δ⁴/384·|q''''| (de Boor, A Practical Guide to Splines, 2001,
 * ch. IV); at a kink of q's slope (a piecewise-linear property table inside q) it is first order in Δ.
 *
 * For a heat-transfer correlation the solver calls at every cell and every Newton sweep (edge-loss.ts, the side
 * walls): each exact evaluation reads air properties and takes fractional powers. (The faces' still-air convection
 * was tried through it and not taken: DEVELOPERS.md, Side walls.)
 */

export interface LazyTableSpec {
  /** Node spacing, K. */
  readonly stepK: number;
  /** Highest node, K (above it, the exact form). */
  readonly topK: number;
  /** The exact form is used within nearK of centreK (where q is not smooth enough for a cubic), K. */
  readonly centreK: number;
  readonly nearK: number;
}

export interface LazyTable extends LazyTableSpec {
  /** q(T) with dq/dT written to out[0]; may use out[1] and beyond as its own scratch. */
  readonly exact: (tK: number, out: Float64Array) => number;
  /** q and dq/dT at node k (k·stepK kelvin); q is NaN until the node is filled. */
  readonly q: Float64Array;
  readonly dq: Float64Array;
}

export function createLazyTable(spec: LazyTableSpec, exact: LazyTable['exact']): LazyTable {
  const nodes = Math.ceil(spec.topK / spec.stepK) + 1;
  return { ...spec, exact, q: new Float64Array(nodes).fill(NaN), dq: new Float64Array(nodes) };
}

const nodeOut = new Float64Array(2);

function fill(t: LazyTable, k: number): void {
  nodeOut[1] = NaN;
  t.q[k] = t.exact(k * t.stepK, nodeOut);
  t.dq[k] = nodeOut[0]!;
}

/** q(tK) from the table (see the header), its slope in out[0]. Allocates nothing once the nodes it reads are filled. */
export function readLazyTable(t: LazyTable, tK: number, out: Float64Array): number {
  const x = tK / t.stepK;
  const k = Math.floor(x);
  if (!(Math.abs(tK - t.centreK) > t.nearK && k >= 0 && k + 1 < t.q.length)) return t.exact(tK, out);
  if (Number.isNaN(t.q[k]!)) fill(t, k);
  if (Number.isNaN(t.q[k + 1]!)) fill(t, k + 1);
  const s = x - k;
  const h = t.stepK;
  const q0 = t.q[k]!;
  const q1 = t.q[k + 1]!;
  const m0 = h * t.dq[k]!;
  const m1 = h * t.dq[k + 1]!;
  const s2 = s * s;
  const r = 1 - s;
  out[0] = ((6 * s2 - 6 * s) * (q0 - q1) + (3 * s2 - 4 * s + 1) * m0 + (3 * s2 - 2 * s) * m1) / h;
  return (1 + 2 * s) * r * r * q0 + s * r * r * m0 + s2 * (3 - 2 * s) * q1 + s2 * (s - 1) * m1;
}

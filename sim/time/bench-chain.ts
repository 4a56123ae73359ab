/**
 * The bench chains in the time loop (sim/physics/bench.ts has the model): a chain is placed when a bench segment
 * starts, its stage constants b and affine stage solution are set before each implicit stage, and its state is
 * recovered when a step is accepted.
 *
 * The chain's cells take the stages of a stack cell (tr-bdf2.ts): trapezoidal stage c·(T_g − T_0) = d·h·(f_0 + f_g),
 * BDF2 stage T_1 = A·T_g − B·T_0 + d·h·f_1/c, backward Euler c·(T_1 − T_0) = h·f_1. So Σ c·(T_1 − T_0) = h·Σ w_i·f_i
 * with the method's own weights, and with the face heat at the start f_0 taken from the heat the stack booked (q0)
 * and the heat at the stage and the end being exactly the affine q(T_face) the stack solved with, the heat the bench
 * stores equals minus the heat the ledger books into that face, to round-off.
 */
import type { StepConditions, Workspace } from '../grid/discretization.ts';
import type { BenchNode } from '../physics/bench.ts';
import { placeBench } from '../physics/bench.ts';
import type { Bench } from '../physics/bench.ts';
import { solveTridiagonal } from '../grid/tridiagonal.ts';

const SIDES = [0, 1] as const;

const benchOn = (cond: StepConditions, side: 0 | 1): Bench | undefined => {
  const c = side === 0 ? cond.bottom : cond.top;
  return c.kind === 'bench' ? c.bench : undefined;
};

/** The node index of a face: 0 (bottom) or n + 1 (top). */
const nodeOf = (ws: Workspace, side: 0 | 1): number => (side === 0 ? 0 : ws.n + 1);

/** Scratch for the chain's tridiagonal solves (grown to the longest chain; allocated at placement only). */
const scratch = { lower: new Float64Array(0), diag: new Float64Array(0), upper: new Float64Array(0), rhs: new Float64Array(0), work: new Float64Array(0) };
function ensureScratch(n: number): void {
  if (scratch.diag.length >= n) return;
  scratch.lower = new Float64Array(n); scratch.diag = new Float64Array(n); scratch.upper = new Float64Array(n);
  scratch.rhs = new Float64Array(n); scratch.work = new Float64Array(n);
}

/** New conditions, restS seconds before the end of the run: a bench that was not under the face before is placed, at its starting temperature. */
export function attachBenches(ws: Workspace, next: StepConditions, previous: StepConditions | undefined, restS: number): void {
  for (const side of SIDES) {
    const bench = benchOn(next, side);
    const node = ws.benches[side];
    if (!bench) continue;
    const was = previous ? benchOn(previous, side) : undefined;
    if (was !== bench || node.bench !== bench) { placeBench(node, bench, restS); ensureScratch(node.riseK.length); }
    holdChain(node);
  }
}

/** Net conduction into chain cell i at the rise t with face heat q into the stack (so −q into the chain), W/m². */
function chainRate(node: BenchNode, t: Float64Array, q: number, i: number): number {
  const n = t.length;
  const inFromAbove = i === 0 ? -q : node.g[i]! * (t[i - 1]! - t[i]!);
  const outBelow = i + 1 < n ? node.g[i + 1]! * (t[i]! - t[i + 1]!) : 0;
  return inFromAbove - outBelow;
}

/** Solves the stage for its affine solution x0 + T_face·x1 from node.b and node.hd. Allocates nothing. */
function solveChainStage(node: BenchNode): boolean {
  const n = node.riseK.length;
  const { lower, diag, upper, rhs, work } = scratch;
  const { g, cap, hd } = node;
  for (let i = 0; i < n; i++) {
    const below = i + 1 < n ? g[i + 1]! : 0;
    lower[i] = -hd * g[i]!;
    upper[i] = -hd * below;
    diag[i] = cap[i]! + hd * (g[i]! + below);
    rhs[i] = cap[i]! * node.b[i]!;
  }
  if (!solveTridiagonal(n, lower, diag, upper, rhs, node.x0, work)) return false;
  rhs.fill(0, 0, n);
  rhs[0] = hd * g[0]!;
  return solveTridiagonal(n, lower, diag, upper, rhs, node.x1, work);
}

/** The chain held at its state: the face sees it through g₀ alone (a stage of zero length). */
function holdChain(node: BenchNode): void {
  node.hd = 0;
  node.b.set(node.riseK);
  node.x0.set(node.riseK);
  node.x1.fill(0);
}

/**
 * Before a stage of effective step hd (as beginPlateStage, plates.ts): 'trapezoid' b = T_0 + hd·f_0/c with f_0 from the
 * booked face heat q0; 'euler' b = T_0; 'bdf2' b = a·T_g − bb·T_0, with T_g recovered from the first stage and the
 * face temperature Ug. Then solves the stage's affine solution.
 */
export function beginBenchStage(ws: Workspace, cond: StepConditions, hd: number, stage: 'trapezoid' | 'euler' | 'bdf2',
  q0: Float64Array, Ug: Float64Array, a: number, bb: number): void {
  for (const side of SIDES) {
    if (!benchOn(cond, side)) continue;
    const node = ws.benches[side];
    const n = node.riseK.length;
    if (stage === 'trapezoid') {
      for (let i = 0; i < n; i++) node.b[i] = node.riseK[i]! + (hd * chainRate(node, node.riseK, q0[side]!, i)) / node.cap[i]!;
    } else if (stage === 'euler') {
      node.b.set(node.riseK);
    } else {
      const face = Ug[nodeOf(ws, side)]! - node.bench!.startK;
      for (let i = 0; i < n; i++) node.b[i] = a * (node.x0[i]! + face * node.x1[i]!) - bb * node.riseK[i]!;
    }
    node.hd = hd;
    // the matrix is an M-matrix (positive diagonal dominating): a zero pivot cannot occur for cap > 0
    solveChainStage(node);
  }
}

/** Accepts a step whose end face temperatures are U1: the chain takes the state of its last stage at that face. */
export function commitBenches(ws: Workspace, cond: StepConditions | undefined, U1: Float64Array): void {
  if (!cond) return;
  for (const side of SIDES) {
    if (!benchOn(cond, side)) continue;
    const node = ws.benches[side];
    const face = U1[nodeOf(ws, side)]! - node.bench!.startK;
    for (let i = 0; i < node.riseK.length; i++) node.riseK[i] = node.x0[i]! + face * node.x1[i]!;
    holdChain(node);
  }
}

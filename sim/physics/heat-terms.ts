/**
 * Volumetric heat terms of a cell that may depend on its temperature, s(T) in W/m³, each with its slope ∂s/∂T in
 * W·m⁻³·K⁻¹ so the implicit solver can put it on the Jacobian's diagonal (through dT/dH). The finite-volume balance
 * of a cell (grid/discretization.ts) gains s(T_i)·Δx_i:
 *   Δx_i·dH_i/dt = Q_{i−½} − Q_{i+½} + (s_sched,i(t) + Σ_terms s(T_i))·Δx_i.
 * Kinds:
 *   - the scheduled source s_sched(t) of a layer (W/m³ intervals, pellets, Joule and W/kg heat): ∂s/∂T = 0; it stays
 *     the per-step array StepConditions.source, since it changes only on breakpoints;
 *   - `linear`: s = a + b·T (T in K), the textbook form of a temperature-dependent source (a closed-form check, and a
 *     building block for linearised reaction heat);
 *   - `edge`: the side-wall loss of edge-loss.ts, −(P/A)·q_side(T).
 * Each term books its energy in a ledger channel: heat generated inside, or heat exchanged through the edges.
 */
import type { EdgeLoss } from './edge-loss.ts';
import { edgeHeatIn } from './edge-loss.ts';

export type CellHeatTerm =
  | {
      readonly kind: 'linear';
      /** W/m³ */
      readonly aWPerM3: number;
      /** W·m⁻³·K⁻¹ (negative: the source weakens as the cell warms, which keeps the problem stable) */
      readonly bWPerM3K: number;
    }
  | { readonly kind: 'edge'; readonly loss: EdgeLoss };

/** Where a term's energy goes in the ledger: heat generated in the cells, or exchanged through their edges. */
export type TermChannel = 'generated' | 'edge';

export const termChannel = (term: CellHeatTerm): TermChannel => (term.kind === 'edge' ? 'edge' : 'generated');

/**
 * Heat into a cell at tK from one term, W/m³, with ∂s/∂T (W·m⁻³·K⁻¹) in out[0]. out[1] carries a term's own warm
 * start for this cell in and out (the edge term's sleeve surface temperature; NaN: none); the result does not depend on
 * it beyond round-off. Overwrites out[0] (and out[1] for an edge term); allocates nothing.
 */
export function cellTermRate(term: CellHeatTerm, tK: number, out: Float64Array): number {
  if (term.kind === 'linear') {
    out[0] = term.bWPerM3K;
    return term.aWPerM3 + term.bWPerM3K * tK;
  }
  return edgeHeatIn(term.loss, tK, out);
}

/** Whether any layer's terms include edge losses (the ledger then reports that channel). */
export const hasEdgeTerms = (termsByLayer: readonly (readonly CellHeatTerm[] | undefined)[]): boolean =>
  termsByLayer.some((terms) => terms?.some((t) => t.kind === 'edge') === true);

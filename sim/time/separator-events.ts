/**
 * The separator's melt and freeze as state events: the instant its last cell becomes fully liquid (every separator cell
 * at or above its liquidus enthalpy: molten) and the instant its last cell becomes fully solid (every one at or below its
 * solidus: frozen). The time loop lands a step on each (events.ts), so the molten and frozen verdicts are read at a step
 * end, within evolveDefaults.eventToleranceS, instead of being placed inside a step that may be far longer than the
 * event's own time scale.
 *
 * Why: read inside a step, the last cell's crossing rests on its heat rate at the step's earlier point
 * (observe/record-trace.ts eventCrossing). On a slow freeze the solid beside the last cell is within a few hundredths of
 * a kelvin of it, so that rate is mostly the stage's own error: on the 5 K Stefan problem (tests/support/stefan-problem.ts)
 * at cells ×1, tolerances ÷3 the frozen time came out 3.7 s early from a rate 1.7× the cell's true one, once the melt
 * front's error no longer kept every step short (grid/line-system.ts errorNorm).
 *
 * The indicators are the recorder's (observe/record-trace.ts SeparatorTrace): min over separator cells of
 * (H − H_liquidus)/span and max of (H − H_solidus)/span, span = physics/material.ts marginSpan.
 */
import type { Grid } from '../grid/mesh.ts';
import { marginSpan } from '../physics/material.ts';
import type { Problem } from '../physics/problem.ts';
import type { StateSwitch } from './events.ts';

/** The quiet switch for the separator layers' melt and freeze, or undefined when the stack has no melting separator. */
export function separatorSwitch(problem: Problem, grid: Grid): StateSwitch | undefined {
  const nodes: number[] = [];
  const liquidus: number[] = [];
  const solidus: number[] = [];
  const span: number[] = [];
  problem.layers.forEach((layer, li) => {
    if (!layer.separator) return;
    for (let i = grid.layerStart[li]!; i < grid.layerEnd[li]!; i++) {
      const material = grid.materials[i]!;
      if (!material.melt) continue;
      nodes.push(i + 1); // cell i is node i + 1 of the loop's state
      liquidus.push(material.melt.hLiquidus);
      solidus.push(material.melt.hSolidus);
      span.push(marginSpan(material));
    }
  });
  if (nodes.length === 0) return undefined;
  const node = Int32Array.from(nodes);
  const hL = Float64Array.from(liquidus);
  const hS = Float64Array.from(solidus);
  const unit = Float64Array.from(span);
  // whether the last accepted state is neither molten nor frozen (so a rise of `reached` is an event)
  let between = true;

  /** max(melt margin, −freeze margin): ≥ 0 exactly when the separator is molten or frozen. */
  const reached = (U: Float64Array): number => {
    let melt = Infinity;
    let freeze = -Infinity;
    for (let c = 0; c < node.length; c++) {
      const h = U[node[c]!]!;
      melt = Math.min(melt, (h - hL[c]!) / unit[c]!);
      freeze = Math.max(freeze, (h - hS[c]!) / unit[c]!);
    }
    return Math.max(melt, -freeze);
  };

  return {
    quiet: true,
    // while molten or frozen there is nothing to land on until an accepted state is between again
    g: (_ws, _tS, U) => (between ? reached(U) : -1),
    fire: () => { between = false; },
    accepted: (_ws, _tS, U) => { between = reached(U) < 0; },
  };
}

/**
 * The separator's event indicators at every step end and stage point, kept to a budget without moving an event time.
 *
 * The verdicts (verdict.ts) find each event where an indicator crosses its level between two recorded points and
 * interpolate linearly there. Any subset of the points that keeps the first point, the last point and both points of
 * every pair across which some indicator changes side of its level gives the same first crossings after any start
 * time: between two such pairs every indicator stays on one side, so no crossing is lost or added, and the pair that
 * brackets a crossing is the original pair. So the two points around each change of side are held exactly, and the
 * rest is decimated (row-store.ts).
 */
import { liquidFractionOf, sensibleCapacity, temperatureOf } from '../physics/material.ts';
import type { Material } from '../physics/material.ts';
import type { ObservationLayout, StepObservation } from '../physics/observation.ts';
import { RowStore } from './row-store.ts';

/** Separator indicators at step ends and stage points, for event times interpolated inside a step. */
export interface SeparatorTrace {
  readonly tS: Float64Array;
  /** min over separator cells of (H − H_liquidus)/span, span = H_liquidus − H_solidus (≥ 1 K of ρc_p): ≥ 0 when every cell is liquid. */
  readonly meltMargin: Float64Array;
  /** Volume-mean liquid fraction of the separator. */
  readonly meanLiquid: Float64Array;
  /** max over separator cells of (H − H_solidus)/span: ≤ 0 when every cell is solid. */
  readonly freezeMargin: Float64Array;
}

/** The levels the verdicts test (verdict.ts summarize): all liquid, half the mean liquid fraction, all solid. */
const MELT_LEVEL = 0;
const HALF_LEVEL = 0.5;
const FREEZE_LEVEL = 0;
/** Smallest unit of the melt and freeze margins, in kelvin of sensible heat: any positive width keeps them finite. */
const MARGIN_FLOOR_K = 1;

/** Which side of its level each indicator is on, as three bits. */
function sides(melt: number, mean: number, freeze: number): number {
  return (melt >= MELT_LEVEL ? 1 : 0) | (mean < HALF_LEVEL ? 2 : 0) | (freeze <= FREEZE_LEVEL ? 4 : 0);
}

/** Indicator points kept to a budget, with the two points around every change of side held exactly. */
export interface IndicatorStore {
  add(tS: number, meltMargin: number, meanLiquid: number, freezeMargin: number): void;
  /** The kept points, and whether every change of side could be held (false: later events are approximate). */
  finish(): { trace: SeparatorTrace; exact: boolean };
}

/** `budget` points kept by decimation besides the held ones; up to `heldPairs` changes of side held. */
export function createIndicatorStore(budget: number, heldPairs: number): IndicatorStore {
  const store = new RowStore(4, budget, 2 * heldPairs + 1);
  let lastSides = -1;
  let exact = true;

  function add(tS: number, meltMargin: number, mean: number, freezeMargin: number): void {
    const row = store.row;
    row[0] = tS;
    row[1] = meltMargin;
    row[2] = mean;
    row[3] = freezeMargin;
    store.commit();
    const now = sides(meltMargin, mean, freezeMargin);
    if (lastSides < 0) {
      store.hold('latest'); // the first point: an indicator may already be past its level at t = 0
    } else if (now !== lastSides && exact) {
      const a = store.hold('previous');
      const b = store.hold('latest');
      if (a < 0 || b < 0) exact = false;
    }
    lastSides = now;
  }

  function finish(): { trace: SeparatorTrace; exact: boolean } {
    const { rows, data } = store.finish();
    const column = (k: number) => Float64Array.from({ length: rows }, (_, r) => data[r * 4 + k]!);
    return { trace: { tS: column(0), meltMargin: column(1), meanLiquid: column(2), freezeMargin: column(3) }, exact };
  }

  return { add, finish };
}

export interface TraceRecorder {
  /** Records the separator's indicators of an observation: at its stage point ('stage') or at its end ('end'). */
  add(obs: StepObservation, at: 'stage' | 'end'): void;
  finish: IndicatorStore['finish'];
}

/** A recorder for the separator samples of the layout, or undefined when the stack has no separator. */
export function createTraceRecorder(layout: ObservationLayout, budget: number, heldPairs: number): TraceRecorder | undefined {
  const separators = layout.layers.filter((l) => l.separator && l.widthM.length > 0);
  if (separators.length === 0) return undefined;
  const store = createIndicatorStore(budget, heldPairs);
  const scratch = new Float64Array(2);
  // the margins' unit, per separator layer: the melt's enthalpy span, or a kelvin of sensible heat when the latent
  // heat vanishes (an isothermal melt with zero latent heat has no span, and a margin divided by it would be infinite)
  const span = separators.map(({ material }) => {
    const melt = material.melt!;
    return Math.max(melt.hLiquidus - melt.hSolidus, sensibleCapacity(material, melt.solidusK) * MARGIN_FLOOR_K);
  });
  // the liquid fraction reads the temperature only inside a melt range of finite width without a lever rule
  // (material.ts liquidFractionOf): elsewhere T(H) is not computed at all
  const needsT = separators.map(({ material }) => {
    const melt = material.melt!;
    return melt.liquidusK !== melt.solidusK && !melt.lever;
  });
  const hint = separators.map((l) => new Int32Array(l.widthM.length));

  /** The liquid fraction of a sample of enthalpy h (the layer's `c`-th separator, its sample j). */
  const liquidOf = (material: Material, c: number, j: number, h: number): number => {
    const melt = material.melt!;
    if (!needsT[c] || h <= melt.hSolidus || h >= melt.hLiquidus) return liquidFractionOf(material, h, NaN);
    const hints = hint[c]!;
    hints[j] = temperatureOf(material.enthalpy, h, hints[j]!, scratch);
    return liquidFractionOf(material, h, scratch[0]!);
  };

  function add(obs: StepObservation, at: 'stage' | 'end'): void {
    let meltMargin = Infinity;
    let freezeMargin = -Infinity;
    let liquid = 0;
    let width = 0;
    for (let c = 0; c < separators.length; c++) {
      const layer = obs.layers[separators[c]!.index]!;
      const { material, widthM } = layer;
      const melt = material.melt!;
      const H = at === 'stage' ? layer.stageEnthalpy : layer.enthalpy;
      const sp = span[c]!;
      for (let j = 0; j < H.length; j++) {
        const h = H[j]!;
        meltMargin = Math.min(meltMargin, (h - melt.hLiquidus) / sp);
        freezeMargin = Math.max(freezeMargin, (h - melt.hSolidus) / sp);
        liquid += liquidOf(material, c, j, h) * widthM[j]!;
        width += widthM[j]!;
      }
    }
    store.add(at === 'stage' ? obs.tStage : obs.t1, meltMargin, liquid / width, freezeMargin);
  }

  return { add, finish: store.finish };
}

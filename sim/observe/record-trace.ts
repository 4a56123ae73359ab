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
import { liquidFractionOf, marginSpan, temperatureOf } from '../physics/material.ts';
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
  /**
   * The highest meltMargin and meanLiquid of every point recorded, kept or not (a summary keeps few): how near the
   * separator came to fully molten, and how far past it (study/point.ts melt_reach reads them).
   */
  readonly peakMeltMargin: number;
  readonly peakMeanLiquid: number;
}

/** The levels the verdicts test (verdict.ts summarize): all liquid, half the mean liquid fraction, all solid. */
const MELT_LEVEL = 0;
const HALF_LEVEL = 0.5;
const FREEZE_LEVEL = 0;

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
  let peakMelt = -Infinity;
  let peakMean = -Infinity;

  function add(tS: number, meltMargin: number, mean: number, freezeMargin: number): void {
    if (meltMargin > peakMelt) peakMelt = meltMargin;
    if (mean > peakMean) peakMean = mean;
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
    return { trace: { tS: column(0), meltMargin: column(1), meanLiquid: column(2), freezeMargin: column(3), peakMeltMargin: peakMelt, peakMeanLiquid: peakMean }, exact };
  }

  return { add, finish };
}

/**
 * When a cell's enthalpy, Ha at ta and Hb at tb, reaches its melt's liquidus enthalpy (rising) or solidus (not) within
 * [ta, tb], s: ta if it is there already. A cell inside its melt at ta, moving towards the level at dH/dt = rate
 * (J·m⁻³·s⁻¹; NaN: unknown), gets there at ta + (level − Ha)/rate when that is within the interval: its enthalpy moves
 * smoothly while it melts or freezes, and the step's end point lies beyond the kink where it leaves its melt, so a line
 * through the two points puts the crossing late (the last cell of a one-phase Stefan problem froze 0.50 s late by it,
 * 0.07 s early by its rate; bench/stefan.ts). Otherwise (its rate unknown or too slow to get there, or it entered its
 * melt within the interval) the crossing of that line. A cell that does not reach the level by tb: ta (it cannot be
 * the one that decides, since the indicator crossed).
 */
export function eventCrossing(melt: { readonly hSolidus: number; readonly hLiquidus: number }, rising: boolean,
  Ha: number, Hb: number, rate: number, ta: number, tb: number): number {
  const level = rising ? melt.hLiquidus : melt.hSolidus;
  if (rising ? Ha >= level || Hb < level : Ha <= level || Hb > level) return ta;
  if (Ha > melt.hSolidus && Ha < melt.hLiquidus && (rising ? rate > 0 : rate < 0)) {
    const t = ta + (level - Ha) / rate;
    if (t > ta && t <= tb) return t;
  }
  return ta + ((tb - ta) * (level - Ha)) / (Hb - Ha);
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
  // the margins' unit, per separator layer
  const span = separators.map(({ material }) => marginSpan(material));
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

  // the enthalpies at the last step end (the next step's start), and the last point recorded
  const startH = separators.map((l) => new Float64Array(l.widthM.length));
  const last = { tS: NaN, meltMargin: NaN, meanLiquid: NaN, freezeMargin: NaN };

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
    const tS = at === 'stage' ? obs.tStage : obs.t1;
    const meanLiquid = liquid / width;
    if (!obs.initial && tS > last.tS) {
      const melted = last.meltMargin < MELT_LEVEL && meltMargin >= MELT_LEVEL;
      const froze = last.freezeMargin > FREEZE_LEVEL && freezeMargin <= FREEZE_LEVEL;
      if (melted || froze) locate(obs, at, tS, melted, froze, meltMargin, meanLiquid, freezeMargin);
    }
    store.add(tS, meltMargin, meanLiquid, freezeMargin);
    last.tS = tS;
    last.meltMargin = meltMargin;
    last.meanLiquid = meanLiquid;
    last.freezeMargin = freezeMargin;
    if (at === 'end') for (let c = 0; c < separators.length; c++) startH[c]!.set(obs.layers[separators[c]!.index]!.enthalpy);
  }

  /**
   * The last separator cell became fully liquid (melted) or solid (froze) between the last point recorded, ta, and
   * tb: records a point at the time it did, with that indicator exactly at its level (the others linear between the
   * two points), so the verdicts' linear interpolation finds the event there. Each cell's crossing of its liquidus
   * (solidus) is found from its enthalpy and heat rate at ta when it was inside its melt then (eventCrossing), and the
   * event is the latest crossing of the layer's cells. With adaptive steps the loop lands a step on the instant
   * (time/separator-events.ts, obs.eventFired), and the line is read instead: the rate is for fixed steps and for a
   * step the event search could not land.
   */
  function locate(obs: StepObservation, at: 'stage' | 'end', tb: number, melted: boolean, froze: boolean,
    meltB: number, meanB: number, freezeB: number): void {
    const ta = last.tS;
    let meltAt = ta;
    let freezeAt = ta;
    for (let c = 0; c < separators.length; c++) {
      const layer = obs.layers[separators[c]!.index]!;
      const melt = layer.material.melt!;
      const Ha = at === 'stage' ? startH[c]! : layer.stageEnthalpy;
      const Hb = at === 'stage' ? layer.stageEnthalpy : layer.enthalpy;
      // a melt ramp leaves no kink where a cell leaves its melt (physics/melt-ramp.ts): its enthalpy then moves on
      // smoothly through the level, and the line through the two points serves; so it does when the step was landed on
      // a state event (time/separator-events.ts lands one on the separator's melt and freeze): the cell is then just
      // past its level at tb, where its rate at ta could put the crossing seconds early
      const rate = obs.eventFired || layer.material.enthalpy.kinks.length === 0 ? undefined
        : at === 'stage' ? layer.startHeatRate : layer.stageHeatRate;
      for (let j = 0; j < Ha.length; j++) {
        const dHdt = rate === undefined ? NaN : rate[j]! / layer.widthM[j]!;
        if (melted) meltAt = Math.max(meltAt, eventCrossing(melt, true, Ha[j]!, Hb[j]!, dHdt, ta, tb));
        if (froze) freezeAt = Math.max(freezeAt, eventCrossing(melt, false, Ha[j]!, Hb[j]!, dHdt, ta, tb));
      }
    }
    const between = (tS: number, a: number, b: number) => a + ((b - a) * (tS - ta)) / (tb - ta);
    const rows: [number, number, number, number][] = [];
    if (melted) rows.push([meltAt, MELT_LEVEL, between(meltAt, last.meanLiquid, meanB), between(meltAt, last.freezeMargin, freezeB)]);
    if (froze) rows.push([freezeAt, between(freezeAt, last.meltMargin, meltB), between(freezeAt, last.meanLiquid, meanB), FREEZE_LEVEL]);
    rows.sort((a, b) => a[0] - b[0]);
    for (const [tS, m, f, z] of rows) if (tS > ta && tS < tb) store.add(tS, m, f, z);
  }

  return { add, finish: store.finish };
}

/**
 * What a run records, step by step: per-layer min/mean/max temperature, the separator's liquid fraction, the face
 * temperatures, the whole node profile (the position–time map, an ndarray), probe values at the requested times, the
 * separator's event indicators (record-trace.ts) and the energy ledger.
 * Memory does not grow with the step count: the series are kept to a budget of rows (row-store.ts), with each layer's
 * peak row and the first and last rows held exactly. With detail 'summary' only what the verdicts read is kept: the
 * peak, first and last rows (no map), the event points and the ledger.
 * The recorder reads only solver-neutral observations (physics/observation.ts: the 1D grid's through
 * time/observe-step.ts, the lumped network's through lumped/lumped.ts); it owns no physics beyond reading them.
 */
import ndarray from 'ndarray';
import type { NdArray } from 'ndarray';
import { AIR_TABLE_RANGE_K } from '../physics/air.ts';
import { liquidFractionOf } from '../physics/material.ts';
import type { ObservationLayout, StepObservation } from '../physics/observation.ts';
import { facingOf, filmTemperature, naturalConvectionRanges, plumeRisesFromFace, rayleigh, rayleighInRange } from '../physics/natural-convection.ts';
import { characteristicLengthM, type FaceCondition, type Problem } from '../physics/problem.ts';
import { hasEdgeTerms } from '../physics/heat-terms.ts';
import type { SeparatorTrace } from './record-trace.ts';
import { createTraceRecorder } from './record-trace.ts';
import { RowStore } from './row-store.ts';
import type { HeaterRecord } from './record-heater.ts';
import { createHeaterRecorder, hasHeater, heldWarning } from './record-heater.ts';
import { kToC, mToMm } from '../physics/units.ts';

export type { SeparatorTrace } from './record-trace.ts';

/** 'full': series and map for drawing; 'summary': only what summarize() reads (for window searches and sweeps). */
export type RecordDetail = 'full' | 'summary';

export const recordDefaults = {
  /** Time points kept in the series: a few thousand draw any curve smoothly on a screen a few thousand pixels wide. */
  seriesPoints: 4000,
  /** Numbers kept in the position–time map (rows × nodes): 64 MB of doubles, whatever the grid. */
  mapValues: 8e6,
  /** Event-indicator points kept besides the held crossings: two per step (stage point and step end). */
  tracePoints: 8000,
  /** Crossings of an event level held exactly; a run that chatters across a level more often keeps the first ones. */
  heldCrossings: 2000,
  /** Requested output times honoured; more are refused at validation (scenario.ts): each adds a probe column. */
  maxOutputTimes: 10000,
  /**
   * A layer's peak time is the first time its hottest point came within this of its peak, K: half the 0.1 °C a peak is
   * printed to. A layer held steady at its peak still creeps by µK along the plateau, and the time of the exact maximum
   * fell wherever the solver's last digits were highest: 852 s or 876 s in a sweep of the demo whose heat went off at
   * 900 s, its hottest point the same to nine figures from 636 s on.
   */
  peakReachedWithinK: 0.05,
} as const;

export interface LayerSeries {
  readonly id: string;
  readonly minC: Float64Array;
  readonly meanC: Float64Array;
  readonly maxC: Float64Array;
  /** Volume-mean liquid fraction (separator layers and any layer whose material melts). */
  readonly liquidFraction: Float64Array | undefined;
  /**
   * The first time, s, that the layer's hottest point came within recordDefaults.peakReachedWithinK of its peak
   * (max of maxC), interpolated between steps (PeakReach), from every step whatever the record kept.
   */
  readonly peakReachedS: number;
}

export interface EnergyLedger {
  /** J/m², split by sign of each step's exchange. */
  readonly bottomInJ: number;
  readonly bottomOutJ: number;
  readonly topInJ: number;
  readonly topOutJ: number;
  readonly sourceJ: number;
  /** Heat in and out through the side walls, J/m², split by sign of each step's exchange; absent without edge losses. */
  readonly edgeInJ?: number;
  readonly edgeOutJ?: number;
  /** Change of stored enthalpy (sensible + latent; with a heater, its plate's too), J/m². */
  readonly storedJ: number;
  /** Electric heat into the heater plates, and the plates' share of storedJ, J/m² (present only with a heater). */
  readonly heaterJ?: number;
  readonly plateStoredJ?: number;
}

export interface RunRecord {
  /** What was kept: 'summary' has no map and only the first, last and peak rows in the series (absent: 'full'). */
  readonly detail?: RecordDetail;
  /** Recorded times, s: every step while within the budget, then thinned (row-store.ts); peaks and the end kept. */
  readonly tS: Float64Array;
  readonly layers: readonly LayerSeries[];
  readonly bottomC: Float64Array;
  readonly topC: Float64Array;
  /** Node positions, mm: bottom face, the samples' positions (cell centres), top face. */
  readonly nodeXMm: Float64Array;
  /** Node temperatures, °C, shape [rows of tS, nodes]; [0, nodes] with detail 'summary'. */
  readonly map: NdArray<Float64Array>;
  readonly separator: SeparatorTrace | undefined;
  readonly probes: { readonly xMm: readonly number[]; readonly tS: readonly number[]; readonly tC: number[][] };
  readonly energy: EnergyLedger;
  readonly warnings: readonly string[];
  /** The heaters' power and plate temperature per row, and their totals (present only with a heater face). */
  readonly heater?: HeaterRecord;
}

interface RangeTracker { low: number; high: number; outside: boolean; filmLowK: number; filmHighK: number }

/** Smallest face-to-air temperature difference, K, at which the natural-convection range is watched. */
const RAYLEIGH_WATCH_MIN_K = 1;

export interface RecorderOptions {
  readonly detail?: RecordDetail;
}

/** `layout`: the fixed part of the observations the recorder will be given (e.g. time/observe-step.ts gridLayout). */
export function createRecorder(problem: Problem, layout: ObservationLayout, options: RecorderOptions = {}) {
  const n = layout.layers.reduce((a, l) => a + l.widthM.length, 0);
  const nodes = n + 2;
  const detail: RecordDetail = options.detail ?? 'full';
  const full = detail === 'full';
  const nodeX = new Float64Array(nodes);
  nodeX[0] = mToMm(layout.bottomM);
  let node = 1;
  for (const l of layout.layers) for (let j = 0; j < l.positionM.length; j++) nodeX[node++] = mToMm(l.positionM[j]!);
  nodeX[n + 1] = mToMm(layout.topM);
  const layerCount = problem.layers.length;
  if (layout.layers.length !== layerCount) throw new Error(`createRecorder: the observation has ${layout.layers.length} layers, the problem ${layerCount}`);

  // one row per recorded time: t, bottom face, top face, per layer min/mean/max (and liquid fraction), then the nodes
  const layerAt = new Int32Array(layerCount);
  let width = 3;
  problem.layers.forEach((l, li) => { layerAt[li] = width; width += l.material.melt ? 4 : 3; });
  const heater = hasHeater(problem) ? createHeaterRecorder() : undefined;
  const heaterAt = width;
  if (heater) width += 2;
  const mapAt = width;
  if (full) width += nodes;
  const budget = full ? Math.max(2, Math.min(recordDefaults.seriesPoints, Math.floor(recordDefaults.mapValues / nodes))) : 0;
  // held rows: each layer's peak row and the first row
  const rows = new RowStore(width, budget, layerCount + 1);
  const peakC = new Float64Array(layerCount).fill(-Infinity);
  const peakSlot = new Int32Array(layerCount).fill(-1);
  const maxK = new Float64Array(layerCount);

  const trace = createTraceRecorder(layout, full ? recordDefaults.tracePoints : 0, recordDefaults.heldCrossings);
  // probes in both details: a handful of interpolations at the requested times only (a summary keeps them too)
  const probeTimes = [...new Set(problem.outputTimesS)].sort((a, b) => a - b);
  let nextProbe = 0;
  const probeX = problem.probesM.map(mToMm);
  const probeT: number[][] = probeX.map(() => []);
  const probeTimesSeen: number[] = [];
  /** The node temperatures (K: bottom face, samples, top face), gathered only at a probe time. */
  const nodeT = new Float64Array(probeTimes.length > 0 ? nodes : 0);
  const energy = { bottomInJ: 0, bottomOutJ: 0, topInJ: 0, topOutJ: 0, sourceJ: 0 };
  const edges = hasEdgeTerms(problem.layers.map((l) => l.terms));
  const edgeEnergy = { edgeInJ: 0, edgeOutJ: 0 };
  let storedStart = 0;
  let storedEnd = 0;
  const rayleighSeen: Record<'bottom' | 'top', RangeTracker> = {
    bottom: { low: Infinity, high: 0, outside: false, filmLowK: Infinity, filmHighK: -Infinity },
    top: { low: Infinity, high: 0, outside: false, filmLowK: Infinity, filmHighK: -Infinity },
  };
  const lengthM = characteristicLengthM(problem.footprint);

  /** Stored enthalpy, J/m²: Σ H·width over every sample, bottom to top. */
  const storedOf = (obs: StepObservation): number => {
    let s = 0;
    for (const l of obs.layers) {
      const { enthalpy, widthM } = l;
      for (let j = 0; j < enthalpy.length; j++) s += enthalpy[j]! * widthM[j]!;
    }
    return s;
  };

  /**
   * storedOf() and each layer's highest sample temperature (K, into maxK; a layer's faces count as its samples) in one
   * pass over the samples, for a summary, which needs both on every step. The stored sum adds the same terms in the
   * same order as storedOf(), so it is the same number.
   */
  const storedAndMaxima = (obs: StepObservation): number => {
    let s = 0;
    for (let li = 0; li < layerCount; li++) {
      const { temperatureK: T, enthalpy, widthM } = obs.layers[li]!;
      let hi = -Infinity;
      for (let j = 0; j < T.length; j++) {
        s += enthalpy[j]! * widthM[j]!;
        if (T[j]! > hi) hi = T[j]!;
      }
      maxK[li] = hi;
    }
    maxK[0] = Math.max(maxK[0]!, obs.bottom.temperatureK);
    maxK[layerCount - 1] = Math.max(maxK[layerCount - 1]!, obs.top.temperatureK);
    return s;
  };

  /** Writes the row for the observed state at its end time. */
  const fillRow = (row: Float64Array, obs: StepObservation): void => {
    const bottomK = obs.bottom.temperatureK;
    const topK = obs.top.temperatureK;
    row[0] = obs.t1;
    row[1] = kToC(bottomK);
    row[2] = kToC(topK);
    let cell = mapAt + 1;
    for (let li = 0; li < layerCount; li++) {
      const { material, temperatureK: T, enthalpy: U, widthM: dx } = obs.layers[li]!;
      let lo = Infinity;
      let hi = -Infinity;
      let sum = 0;
      let thickness = 0;
      let liquid = 0;
      for (let j = 0; j < T.length; j++) {
        const tk = T[j]!;
        if (tk < lo) lo = tk;
        if (tk > hi) hi = tk;
        sum += tk * dx[j]!;
        thickness += dx[j]!;
        if (material.melt) liquid += liquidFractionOf(material, U[j]!, tk) * dx[j]!;
        if (full) row[cell++] = kToC(tk);
      }
      if (li === 0) { lo = Math.min(lo, bottomK); hi = Math.max(hi, bottomK); }
      if (li === layerCount - 1) { lo = Math.min(lo, topK); hi = Math.max(hi, topK); }
      const at = layerAt[li]!;
      row[at] = kToC(lo);
      row[at + 1] = kToC(sum / thickness);
      row[at + 2] = kToC(hi);
      if (material.melt) row[at + 3] = liquid / thickness;
    }
    if (full) { row[mapAt] = kToC(bottomK); row[mapAt + nodes - 1] = kToC(topK); }
  };

  // each layer's peak time, found from every high as it comes (PeakReach)
  const reach = Array.from({ length: layerCount }, () => new PeakReach(recordDefaults.peakReachedWithinK));
  /**
   * Holds the latest row for every layer whose peak it raises (strictly: the first time of a peak is kept), and tells
   * that layer's PeakReach of the new high.
   */
  const holdPeaks = (committed: Float64Array): void => {
    for (let li = 0; li < layerCount; li++) {
      const v = committed[layerAt[li]! + 2]!;
      if (!(v > peakC[li]!)) continue;
      peakC[li] = v;
      rows.release(peakSlot[li]!);
      peakSlot[li] = rows.hold('latest');
      reach[li]!.rise(committed[0]!, v);
    }
  };

  const watchRayleigh = (side: 'bottom' | 'top', c: FaceCondition, faceK: number): void => {
    // a face within a kelvin of the air exchanges next to nothing by convection: its Rayleigh number says nothing
    if (c.kind !== 'terms' || c.convection.kind !== 'natural' || Math.abs(faceK - c.fluidK) < RAYLEIGH_WATCH_MIN_K) return;
    const ra = rayleigh(faceK, c.fluidK, lengthM);
    const r = rayleighSeen[side];
    r.low = Math.min(r.low, ra);
    r.high = Math.max(r.high, ra);
    if (!rayleighInRange(ra, plumeRisesFromFace(facingOf(side), faceK, c.fluidK))) r.outside = true;
    const film = filmTemperature(faceK, c.fluidK);
    r.filmLowK = Math.min(r.filmLowK, film);
    r.filmHighK = Math.max(r.filmHighK, film);
  };

  /** The node temperatures of an observation into nodeT (bottom face, every sample bottom to top, top face). */
  const gatherNodes = (obs: StepObservation): void => {
    let j = 0;
    nodeT[j++] = obs.bottom.temperatureK;
    for (const l of obs.layers) { nodeT.set(l.temperatureK, j); j += l.temperatureK.length; }
    nodeT[j] = obs.top.temperatureK;
  };

  function onStep(obs: StepObservation): void {
    const first = obs.initial;
    if (first) {
      storedStart = storedOf(obs);
      trace?.add(obs, 'end');
    } else {
      const e = obs.energy;
      energy.bottomInJ += Math.max(e.bottomJ, 0);
      energy.bottomOutJ += Math.max(-e.bottomJ, 0);
      energy.topInJ += Math.max(e.topJ, 0);
      energy.topOutJ += Math.max(-e.topJ, 0);
      energy.sourceJ += e.generatedJ;
      edgeEnergy.edgeInJ += Math.max(e.edgesJ, 0);
      edgeEnergy.edgeOutJ += Math.max(-e.edgesJ, 0);
      trace?.add(obs, 'stage');
      trace?.add(obs, 'end');
    }
    heater?.onStep(obs);
    // a summary keeps only the first, the last and each layer's peak row: find out cheaply whether this is one
    let wanted = full || first || obs.t1 >= problem.durationS;
    if (wanted) storedEnd = storedOf(obs);
    else {
      storedEnd = storedAndMaxima(obs);
      for (let li = 0; li < layerCount && !wanted; li++) if (kToC(maxK[li]!) > peakC[li]!) wanted = true;
    }
    if (wanted) {
      const row = rows.row;
      fillRow(row, obs);
      if (heater) { row[heaterAt] = heater.latest.powerW; row[heaterAt + 1] = kToC(heater.latest.plateK); }
      rows.commit();
      if (first) rows.hold('latest');
      holdPeaks(row);
    }
    watchRayleigh('bottom', obs.bottom.condition, obs.bottom.temperatureK);
    watchRayleigh('top', obs.top.condition, obs.top.temperatureK);
    while (nextProbe < probeTimes.length && probeTimes[nextProbe]! < obs.t1) nextProbe++;
    if (nextProbe < probeTimes.length && probeTimes[nextProbe] === obs.t1) {
      probeTimesSeen.push(obs.t1);
      gatherNodes(obs);
      probeX.forEach((x, p) => probeT[p]!.push(interpolateProfile(nodeX, nodeT, x)));
      nextProbe++;
    }
  }

  function finish(): RunRecord {
    const warnings: string[] = [];
    for (const side of ['bottom', 'top'] as const) {
      const r = rayleighSeen[side];
      if (r.filmLowK < AIR_TABLE_RANGE_K.low || r.filmHighK > AIR_TABLE_RANGE_K.high) {
        warnings.push(`${side} face: air film temperatures ${kToC(r.filmLowK).toFixed(0)}–${kToC(r.filmHighK).toFixed(0)} °C reach beyond the air-property table (${kToC(AIR_TABLE_RANGE_K.low).toFixed(0)}–${kToC(AIR_TABLE_RANGE_K.high).toFixed(0)} °C); its end values were held`);
      }
      if (r.outside) {
        warnings.push(`${side} face: natural convection at Rayleigh numbers ${twoFigures(r.low)}–${twoFigures(r.high)}; for at least part of the run this is outside the published range of the correlation in use (hot face up from Ra ${naturalConvectionRanges.upperFacing.low}, hot face down from Ra ${naturalConvectionRanges.lowerFacing.low}), so it was extrapolated there`);
      }
    }
    const kept = rows.finish();
    const column = (k: number) => Float64Array.from({ length: kept.rows }, (_, r) => kept.data[r * width + k]!);
    const map = new Float64Array(full ? kept.rows * nodes : 0);
    if (full) for (let r = 0; r < kept.rows; r++) map.set(kept.data.subarray(r * width + mapAt, (r + 1) * width), r * nodes);
    const separator = trace?.finish();
    if (separator && !separator.exact) {
      warnings.push(`the separator crossed its melt and freeze levels more than ${recordDefaults.heldCrossings} times; event times after that are interpolated between kept points`);
    }
    const heaterRecord = heater?.finish(column(heaterAt), column(heaterAt + 1));
    const held = heaterRecord ? heldWarning(heaterRecord) : undefined;
    if (held) warnings.push(held);
    return {
      detail,
      tS: column(0),
      layers: problem.layers.map((l, li) => {
        const at = layerAt[li]!;
        return { id: l.id, minC: column(at), meanC: column(at + 1), maxC: column(at + 2), liquidFraction: l.material.melt ? column(at + 3) : undefined,
          peakReachedS: reach[li]!.firstS() };
      }),
      bottomC: column(1),
      topC: column(2),
      nodeXMm: nodeX,
      map: ndarray(map, [full ? kept.rows : 0, nodes]),
      separator: separator?.trace,
      probes: { xMm: probeX, tS: probeTimesSeen, tC: probeT },
      energy: { ...energy, ...(edges ? edgeEnergy : {}), ...heater?.ledger, storedJ: storedEnd - storedStart + (heater?.ledger.plateStoredJ ?? 0) },
      warnings,
      ...(heaterRecord ? { heater: heaterRecord } : {}),
    };
  }

  return { onStep, finish };
}

/** Two significant figures in plain decimals (1300, not toPrecision's "1.3e+3"). */
const twoFigures = (v: number): string => String(Number(v.toPrecision(2)));

/** Temperature (°C) at x (mm) by linear interpolation between nodes. T in K. */
export function interpolateProfile(nodeXMm: Float64Array, T: Float64Array, xMm: number): number {
  const last = nodeXMm.length - 1;
  if (xMm <= nodeXMm[0]!) return kToC(T[0]!);
  if (xMm >= nodeXMm[last]!) return kToC(T[last]!);
  let j = 0;
  while (nodeXMm[j + 1]! < xMm) j++;
  const x0 = nodeXMm[j]!;
  const x1 = nodeXMm[j + 1]!;
  const w = (xMm - x0) / (x1 - x0);
  return kToC(T[j]! * (1 - w) + T[j + 1]! * w);
}

/**
 * The first time a rising series came within `withinK` of its highest value, without knowing that value before the end:
 * each new high is queued with its time, and the queue keeps only the highs within `withinK` of the latest, so its
 * head is the first point within it at every moment. The time is interpolated linearly between that point and the
 * high before it, as event times are between recorded points: the first point alone would put it up to a step late
 * (12 s on the demo, where the adaptive steps of two JavaScript engines differ). The queue holds one entry per step
 * only while a plateau creeps up by less than `withinK` in all; a rise of more than that empties it to one entry.
 */
export class PeakReach {
  private t = new Float64Array(16);
  private v = new Float64Array(16);
  private head = 0;
  private tail = 0;
  /** The last high let go from the queue's head: the one before its head (NaN: none yet). */
  private beforeT = Number.NaN;
  private beforeV = Number.NaN;

  constructor(private readonly withinK: number) {}

  /** A new high v (°C) at time tS; highs come in rising order. */
  rise(tS: number, v: number): void {
    while (this.head < this.tail && this.v[this.head]! < v - this.withinK) {
      this.beforeT = this.t[this.head]!;
      this.beforeV = this.v[this.head]!;
      this.head++;
    }
    if (this.tail === this.t.length) {
      // move the live entries to the front, and grow if they fill more than half
      const live = this.tail - this.head;
      const size = live * 2 > this.t.length ? this.t.length * 2 : this.t.length;
      const t = new Float64Array(size);
      const w = new Float64Array(size);
      t.set(this.t.subarray(this.head, this.tail));
      w.set(this.v.subarray(this.head, this.tail));
      this.t = t;
      this.v = w;
      this.head = 0;
      this.tail = live;
    }
    this.t[this.tail] = tS;
    this.v[this.tail] = v;
    this.tail++;
  }

  /**
   * When the rise crossed withinK below the last high: between the high before the queue's head (below that level) and
   * the head (at or above it), linearly; the head's own time when it is the first high of all. 0 before any high.
   */
  firstS(): number {
    if (this.head >= this.tail) return 0;
    const t1 = this.t[this.head]!;
    if (Number.isNaN(this.beforeT)) return t1;
    const level = this.v[this.tail - 1]! - this.withinK;
    const v1 = this.v[this.head]!;
    return this.beforeT + ((t1 - this.beforeT) * (level - this.beforeV)) / (v1 - this.beforeV);
  }
}

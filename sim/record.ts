/**
 * What a run records, step by step: per-layer min/mean/max temperature, the separator's liquid fraction, the face
 * temperatures, the whole node profile (the position–time map, an ndarray), probe values at the requested times, the
 * separator's event indicators at every step point and stage point, and the energy ledger.
 * The recorder consumes the StepReports of evolve(); it owns no physics beyond reading the state.
 */
import ndarray from 'ndarray';
import type { NdArray } from 'ndarray';
import { AIR_TABLE_RANGE_K } from './air.ts';
import type { StepReport } from './evolve.ts';
import { liquidFractionOf, temperatureOf } from './material.ts';
import type { Grid } from './mesh.ts';
import { filmTemperature, plumeRisesFromFace, rayleigh, rayleighInRange } from './natural-convection.ts';
import { characteristicLengthM, type FaceCondition, type Problem } from './problem.ts';
import { kToC, mToMm } from './units.ts';

export interface LayerSeries {
  readonly id: string;
  readonly minC: Float64Array;
  readonly meanC: Float64Array;
  readonly maxC: Float64Array;
  /** Volume-mean liquid fraction (separator layers and any layer whose material melts). */
  readonly liquidFraction: Float64Array | undefined;
}

/** Separator indicators at every step end and stage point, for event times interpolated inside a step. */
export interface SeparatorTrace {
  readonly tS: Float64Array;
  /** min over separator cells of (H − H_liquidus)/(H_liquidus − H_solidus): ≥ 0 when every cell is liquid. */
  readonly meltMargin: Float64Array;
  /** Volume-mean liquid fraction of the separator. */
  readonly meanLiquid: Float64Array;
  /** max over separator cells of (H − H_solidus)/(H_liquidus − H_solidus): ≤ 0 when every cell is solid. */
  readonly freezeMargin: Float64Array;
}

export interface EnergyLedger {
  /** J/m², split by sign of each step's exchange. */
  readonly bottomInJ: number;
  readonly bottomOutJ: number;
  readonly topInJ: number;
  readonly topOutJ: number;
  readonly sourceJ: number;
  /** Change of stored enthalpy (sensible + latent), J/m². */
  readonly storedJ: number;
}

export interface RunRecord {
  readonly tS: Float64Array;
  readonly layers: readonly LayerSeries[];
  readonly bottomC: Float64Array;
  readonly topC: Float64Array;
  /** Node positions, mm: bottom face, cell centres, top face. */
  readonly nodeXMm: Float64Array;
  /** Node temperatures, °C, shape [steps, nodes]. */
  readonly map: NdArray<Float64Array>;
  readonly separator: SeparatorTrace | undefined;
  readonly probes: { readonly xMm: readonly number[]; readonly tS: readonly number[]; readonly tC: number[][] };
  readonly energy: EnergyLedger;
  readonly warnings: readonly string[];
}

class Column {
  private data = new Float64Array(256);
  length = 0;
  push(v: number): void {
    if (this.length === this.data.length) {
      const grown = new Float64Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    this.data[this.length++] = v;
  }
  done(): Float64Array { return this.data.slice(0, this.length); }
}

interface RangeTracker { low: number; high: number; outside: boolean; filmLowK: number; filmHighK: number }

/** Smallest face-to-air temperature difference, K, at which the natural-convection range is watched. */
const RAYLEIGH_WATCH_MIN_K = 1;

export function createRecorder(problem: Problem, grid: Grid) {
  const { n } = grid;
  const nodes = n + 2;
  const nodeX = new Float64Array(nodes);
  nodeX[0] = 0;
  for (let i = 0; i < n; i++) nodeX[i + 1] = mToMm(grid.xc[i]!);
  nodeX[n + 1] = mToMm(grid.totalM);
  const t = new Column();
  const bottom = new Column();
  const top = new Column();
  const mapColumn = new Column();
  const layerCols = problem.layers.map((l) => ({
    min: new Column(), mean: new Column(), max: new Column(),
    liquid: l.material.melt ? new Column() : undefined,
  }));
  const sepCells: number[] = [];
  for (let i = 0; i < n; i++) if (problem.layers[grid.layerOf[i]!]!.separator) sepCells.push(i);
  const trace = sepCells.length > 0
    ? { t: new Column(), melt: new Column(), mean: new Column(), freeze: new Column() } : undefined;
  const probeTimes = [...new Set(problem.outputTimesS)].sort((a, b) => a - b);
  const probeX = problem.probesM.map(mToMm);
  const probeT: number[][] = probeX.map(() => []);
  const probeTimesSeen: number[] = [];
  const energy = { bottomInJ: 0, bottomOutJ: 0, topInJ: 0, topOutJ: 0, sourceJ: 0 };
  let storedStart = 0;
  let storedEnd = 0;
  const hint = new Int32Array(n);
  const scratch = new Float64Array(2);
  const rayleighSeen: Record<'bottom' | 'top', RangeTracker> = {
    bottom: { low: Infinity, high: 0, outside: false, filmLowK: Infinity, filmHighK: -Infinity },
    top: { low: Infinity, high: 0, outside: false, filmLowK: Infinity, filmHighK: -Infinity },
  };
  const lengthM = characteristicLengthM(problem.footprint);

  const storedOf = (U: Float64Array): number => {
    let s = 0;
    for (let i = 0; i < n; i++) s += U[i + 1]! * grid.dx[i]!;
    return s;
  };

  /** Pushes the separator indicators for state U at time tS. */
  const traceState = (U: Float64Array, tS: number): void => {
    if (!trace) return;
    let meltMargin = Infinity;
    let freezeMargin = -Infinity;
    let liquid = 0;
    let width = 0;
    for (const i of sepCells) {
      const mat = grid.materials[i]!;
      const melt = mat.melt!;
      const h = U[i + 1]!;
      hint[i] = temperatureOf(mat.enthalpy, h, hint[i]!, scratch);
      const span = Math.max(melt.hLiquidus - melt.hSolidus, Number.MIN_VALUE);
      meltMargin = Math.min(meltMargin, (h - melt.hLiquidus) / span);
      freezeMargin = Math.max(freezeMargin, (h - melt.hSolidus) / span);
      liquid += liquidFractionOf(mat, h, scratch[0]!) * grid.dx[i]!;
      width += grid.dx[i]!;
    }
    trace.t.push(tS);
    trace.melt.push(meltMargin);
    trace.mean.push(liquid / width);
    trace.freeze.push(freezeMargin);
  };

  const watchRayleigh = (side: 'bottom' | 'top', c: FaceCondition, faceK: number): void => {
    // a face within a kelvin of the air exchanges next to nothing by convection: its Rayleigh number says nothing
    if (c.kind !== 'terms' || c.convection.kind !== 'natural' || Math.abs(faceK - c.fluidK) < RAYLEIGH_WATCH_MIN_K) return;
    const ra = rayleigh(faceK, c.fluidK, lengthM);
    const r = rayleighSeen[side];
    r.low = Math.min(r.low, ra);
    r.high = Math.max(r.high, ra);
    if (!rayleighInRange(ra, plumeRisesFromFace(side === 'bottom' ? 'down' : 'up', faceK, c.fluidK))) r.outside = true;
    const film = filmTemperature(faceK, c.fluidK);
    r.filmLowK = Math.min(r.filmLowK, film);
    r.filmHighK = Math.max(r.filmHighK, film);
  };

  function onStep(step: StepReport): void {
    const { ws, buf } = step;
    const T = ws.T;
    if (step.t1 === 0) {
      storedStart = storedOf(buf.U0);
      traceState(buf.U0, 0);
    } else {
      energy.bottomInJ += Math.max(step.bottomJ, 0);
      energy.bottomOutJ += Math.max(-step.bottomJ, 0);
      energy.topInJ += Math.max(step.topJ, 0);
      energy.topOutJ += Math.max(-step.topJ, 0);
      energy.sourceJ += step.sourceJ;
      traceState(buf.Ug, step.tg);
      traceState(buf.U1, step.t1);
    }
    storedEnd = storedOf(buf.U1);
    t.push(step.t1);
    bottom.push(kToC(T[0]!));
    top.push(kToC(T[n + 1]!));
    for (let j = 0; j < nodes; j++) mapColumn.push(kToC(T[j]!));
    problem.layers.forEach((layer, li) => {
      const start = grid.layerStart[li]!;
      const end = grid.layerEnd[li]!;
      let lo = Infinity;
      let hi = -Infinity;
      let sum = 0;
      let width = 0;
      let liquid = 0;
      for (let i = start; i < end; i++) {
        const tk = T[i + 1]!;
        lo = Math.min(lo, tk);
        hi = Math.max(hi, tk);
        sum += tk * grid.dx[i]!;
        width += grid.dx[i]!;
        if (layer.material.melt) liquid += liquidFractionOf(layer.material, buf.U1[i + 1]!, tk) * grid.dx[i]!;
      }
      if (li === 0) { lo = Math.min(lo, T[0]!); hi = Math.max(hi, T[0]!); }
      if (li === problem.layers.length - 1) { lo = Math.min(lo, T[n + 1]!); hi = Math.max(hi, T[n + 1]!); }
      const cols = layerCols[li]!;
      cols.min.push(kToC(lo));
      cols.mean.push(kToC(sum / width));
      cols.max.push(kToC(hi));
      cols.liquid?.push(liquid / width);
    });
    watchRayleigh('bottom', step.cond.bottom, T[0]!);
    watchRayleigh('top', step.cond.top, T[n + 1]!);
    if (probeTimes.includes(step.t1) && !probeTimesSeen.includes(step.t1)) {
      probeTimesSeen.push(step.t1);
      probeX.forEach((x, p) => probeT[p]!.push(interpolateProfile(nodeX, T, x)));
    }
  }

  function finish(): RunRecord {
    const steps = t.length;
    const warnings: string[] = [];
    for (const side of ['bottom', 'top'] as const) {
      const r = rayleighSeen[side];
      if (r.filmLowK < AIR_TABLE_RANGE_K.low || r.filmHighK > AIR_TABLE_RANGE_K.high) {
        warnings.push(`${side} face: air film temperatures ${kToC(r.filmLowK).toFixed(0)}–${kToC(r.filmHighK).toFixed(0)} °C reach beyond the air-property table (${kToC(AIR_TABLE_RANGE_K.low).toFixed(0)}–${kToC(AIR_TABLE_RANGE_K.high).toFixed(0)} °C); its end values were held`);
      }
      if (r.outside) {
        warnings.push(`${side} face: natural convection at Rayleigh numbers ${r.low.toPrecision(2)}–${r.high.toPrecision(2)}; for at least part of the run this is outside the correlation's published range (from 10⁴), so its power law was extrapolated`);
      }
    }
    return {
      tS: t.done(),
      layers: problem.layers.map((l, li) => {
        const c = layerCols[li]!;
        return { id: l.id, minC: c.min.done(), meanC: c.mean.done(), maxC: c.max.done(), liquidFraction: c.liquid?.done() };
      }),
      bottomC: bottom.done(),
      topC: top.done(),
      nodeXMm: nodeX,
      map: ndarray(mapColumn.done(), [steps, nodes]),
      separator: trace
        ? { tS: trace.t.done(), meltMargin: trace.melt.done(), meanLiquid: trace.mean.done(), freezeMargin: trace.freeze.done() }
        : undefined,
      probes: { xMm: probeX, tS: probeTimesSeen, tC: probeT },
      energy: { ...energy, storedJ: storedEnd - storedStart },
      warnings,
    };
  }

  return { onStep, finish };
}

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

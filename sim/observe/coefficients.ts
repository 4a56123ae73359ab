/**
 * Where every coefficient the solver used comes from (issue 10, "the result traces every coefficient the solver used
 * to a formula or a source"): one line per number or rule, in the order a reader checks a rig — layers bottom to top
 * (material properties, melt, limits, heat sources, side-wall loss), the contacts between them, each face's
 * conditions in time order (with the correlation and its published range), then the numerics. A number typed into
 * the scenario file says so; a library number carries the library file's own source text; a formula is named with
 * its published source. Nothing here changes a run: it reads the Problem as the solver received it.
 */
import { AIR_TABLE_RANGE_K } from '../physics/air.ts';
import type { Bench } from '../physics/bench.ts';
import { benchChainWidths, benchDefaults, benchDiffusivity } from '../physics/bench.ts';
import type { EdgeLoss } from '../physics/edge-loss.ts';
import type { Heater } from '../physics/heater.ts';
import type { Material } from '../physics/material.ts';
import { naturalConvectionRanges } from '../physics/natural-convection.ts';
import type { Table } from '../physics/table.ts';
import { characteristicLengthM, type FaceCondition, type Layer, type Problem } from '../physics/problem.ts';
import { kToC, mToMm } from '../physics/units.ts';
import { formatSignificant } from './format.ts';

export interface Coefficient {
  /** What the number is, and where it acts: "separator: density", "bottom face from 900 s: radiation". */
  readonly what: string;
  /** The value with its unit, as used (SI converted back to the file's units where that reads better). */
  readonly value: string;
  /** A published source, a formula with its source, "the scenario file", or the library file's own source text. */
  readonly source: string;
}

/** The words for a number the user typed: the file is its source. */
export const FROM_FILE = 'given in the scenario file';
const NO_SOURCE = 'no source stated (an inline material of the scenario file)';

const num = (v: number): string => formatSignificant(v);
const degC = (k: number): string => `${num(kToC(k))} °C`;

/** A table in words: one value, or its range over its temperature range. */
function tableWords(t: Table, unit: string): string {
  if (t.y.length === 1) return `${num(t.y[0]!)} ${unit}`;
  const lo = Math.min(...t.y);
  const hi = Math.max(...t.y);
  return `${num(lo)}–${num(hi)} ${unit}, a table of ${t.y.length} rows over ${degC(t.tK[0]!)} to ${degC(t.tK[t.tK.length - 1]!)}`;
}

function materialLines(where: string, m: Material): Coefficient[] {
  const src = (key: string): string => m.sources[key] ?? composedSource(m, key) ?? NO_SOURCE;
  const out: Coefficient[] = [
    { what: `${where}: material`, value: `${m.title} (${m.name})`, source: m.from ?? 'built by the caller (no file)' },
    { what: `${where}: density ρ`, value: `${num(m.density)} kg/m³`, source: src('rho_kg_m3') },
    { what: `${where}: conductivity k(T)`, value: tableWords(m.conductivity, 'W/(m·K)'), source: src('k_W_mK') },
    { what: `${where}: specific heat c_p(T)`, value: tableWords(m.specificHeat, 'J/(kg·K)'), source: src('cp_J_kgK') },
  ];
  if (m.melt) {
    const mm = m.melt;
    out.push({
      what: `${where}: melt (solidus, liquidus, latent heat)`,
      value: `${degC(mm.solidusK)}, ${degC(mm.liquidusK)}, ${num(mm.latentJPerKg)} J/kg`,
      source: src('melt'),
    });
    if (mm.kSolid !== mm.kLiquid) out.push({
      what: `${where}: conductivity while melting`,
      value: `solid ${num(mm.kSolid)} and liquid ${num(mm.kLiquid)} W/(m·K) in series, weighted by the liquid fraction`,
      source: 'the two phases in series (the lower, Wiener bound), weighted by the liquid fraction: our choice, DEVELOPERS.md "The numerical method"',
    });
    if ((mm.rampK ?? 0) > 0) {
      out.push({
        what: `${where}: melt ramp`,
        value: `latent heat spread over ±${num(mm.rampK!)} K at the solidus and liquidus`,
        source: 'numerics.event_accuracy_s (scenario/accuracy.ts): a smoothing of our own, its event-time shift bounded there',
      });
    }
  }
  for (const l of m.limits) {
    out.push({ what: `${where}: ${l.kind} limit`, value: degC(l.atK), source: l.source ?? NO_SOURCE });
  }
  return out;
}

/** A composite's or a mixture's own sources are keyed "matrix k_W_mK", "salt melt": gather them for a file key. */
function composedSource(m: Material, key: string): string | undefined {
  const parts = Object.entries(m.sources).filter(([k]) => k.endsWith(` ${key}`)).map(([k, s]) => `${k}: ${s}`);
  return parts.length > 0 ? parts.join('; ') : undefined;
}

const ORIGIN_WORDS: Readonly<Record<string, string>> = {
  pellet: 'a heat pellet: ρ·q/t_burn, q from the pellet\'s heat per gram or its Fe/KClO₄ composition (formation enthalpies, scenario/heat-sources.ts)',
  joule: 'Joule heat I²R spread over footprint × thickness (the current and resistance given in the scenario file)',
  heat_W_kg: 'a heat per kilogram × the layer\'s density (given in the scenario file)',
};

function sourceLines(where: string, layer: Layer): Coefficient[] {
  return layer.sources.map((s, k) => {
    const origin = s.origin ?? `source_W_m3[${k}]`;
    const base = origin.replace(/\[\d+\]$/, '');
    return {
      what: `${where}: heat source ${origin}`,
      value: `${num(s.value)} W/m³ from ${num(s.fromS)} s to ${num(s.toS)} s`,
      source: ORIGIN_WORDS[base] ?? FROM_FILE,
    };
  });
}

function edgeLines(where: string, loss: EdgeLoss): Coefficient[] {
  const convection = loss.convection.kind === 'fixed'
    ? { value: `${num(loss.convection.coefficient)} W/(m²·K)`, source: FROM_FILE }
    : {
      value: `natural convection from a vertical plate ${num(mToMm(loss.heightM))} mm high`,
      source: 'Churchill & Chu (1975), Nu = {0.825 + 0.387 Ra^(1/6)/[1 + (0.492/Pr)^(9/16)]^(8/27)}², all Ra (Incropera eq. 9.26); air as below',
    };
  const out: Coefficient[] = [
    { what: `${where}: side-wall loss, perimeter/area`, value: `${num(loss.perimeterPerArea)} 1/m`, source: 'the footprint in the scenario file (P/A)' },
    { what: `${where}: side-wall convection`, ...convection },
    { what: `${where}: side-wall radiation`, value: `ε = ${num(loss.emissivity)} to ${degC(loss.ambientK)}`, source: `Stefan–Boltzmann law; ε ${FROM_FILE}` },
  ];
  if (loss.sleeve) {
    out.push({
      what: `${where}: side sleeve`,
      value: `R·k = ${num(loss.sleeve.resistanceTimesK)} m, outer/inner area ${num(loss.sleeve.areaRatio)}`,
      source: 'conduction through a cylindrical shell ln(r₂/r₁)/(2πk) per unit height (Incropera eq. 3.28) or a plane wall t/k (eq. 3.6); k from the sleeve material\'s library file',
    });
  }
  return out;
}

function controlWords(h: Heater): string {
  const c = h.control;
  if (c.kind === 'constant') return 'constant power';
  const sensor = c.sensor.kind === 'plate' ? 'the plate' : `layer ${c.sensor.id} (mean)`;
  if (c.kind === 'on-off') return `on-off with a ${num(c.bandK)} K band, sensing ${sensor}`;
  return `PI, gain ${num(c.gainWPerK)} W/K, integral time ${num(c.integralS)} s, sampled every ${num(c.periodS)} s, sensing ${sensor}`;
}

function heaterLines(at: string, h: Heater): Coefficient[] {
  const out: Coefficient[] = [
    { what: `${at}: heater power limit`, value: `${num(h.powerW)} W (${num(h.powerWPerM2)} W/m² over the footprint)`, source: FROM_FILE },
    { what: `${at}: heater plate heat capacity`, value: `${num(h.capacityJPerM2K)} J/(m²·K)`, source: 'ρ·c_p·thickness of the plate (its material\'s library file; the thickness from the scenario file)' },
    { what: `${at}: plate-to-stack contact conductance`, value: `${num(h.contactWPerM2K)} W/(m²·K)`, source: FROM_FILE },
  ];
  if (h.lossWPerM2K > 0) out.push({ what: `${at}: heater plate loss`, value: `${num(h.lossWPerM2K)} W/(m²·K) to ${degC(h.lossToK)}`, source: FROM_FILE });
  out.push({ what: `${at}: heater control`, value: controlWords(h), source: h.control.kind === 'pi' ? `${FROM_FILE}; sampled PI with anti-windup by conditional integration (Åström & Hägglund, PID Controllers, 2nd ed., §3.2)` : FROM_FILE });
  if (h.setPoints.length > 0) {
    out.push({ what: `${at}: set-points`, value: h.setPoints.map((p) => `${degC(p.tK)} at ${num(p.atS)} s`).join(', '), source: `${FROM_FILE} (linear between points, held outside them)` });
  }
  return out;
}

function benchLines(at: string, b: Bench, restS: number): Coefficient[] {
  const m = b.material;
  const src = (key: string): string => m.sources[key] ?? NO_SOURCE;
  const depthM = benchChainWidths(benchDiffusivity(b), restS, b.thicknessM).reduce((x, y) => x + y, 0);
  const depthMm = num(mToMm(depthM));
  const slab = b.thicknessM !== undefined && depthM >= b.thicknessM * (1 - 1e-12);
  return [
    { what: `${at}: bench surface`, value: `${m.title} (${m.name}), a semi-infinite solid from ${degC(b.startK)}`, source: `${m.from ?? 'built by the caller (no file)'}; the starting temperature ${FROM_FILE} or the ambient` },
    {
      what: `${at}: bench properties (constant, read at ${degC(b.propertiesAtK)})`,
      value: `k ${num(b.conductivityWPerMK)} W/(m·K), ρc_p ${num(b.capacityJPerM3K)} J/(m³·K)`,
      source: `k: ${src('k_W_mK')}; ρ: ${src('rho_kg_m3')}; c_p: ${src('cp_J_kgK')}`,
    },
    {
      what: `${at}: bench contact conductance`,
      value: b.contactWPerM2K === undefined ? 'perfect contact' : `${num(b.contactWPerM2K)} W/(m²·K)`,
      source: b.contactWPerM2K === undefined ? 'the default without contact_W_m2K (an upper bound of the heat the bench draws)' : FROM_FILE,
    },
    {
      what: `${at}: bench cells`,
      value: `${benchDefaults.cells} cells graded ×${num(benchDefaults.growth)} to ${depthMm} mm deep${slab ? ', insulated beneath' : ''}`,
      source: slab ? `the bench's thickness ${FROM_FILE}, thinner than ${num(benchDefaults.depthDiffusionLengths)}·√(α·t) to the end of the run: physics/bench.ts`
        : `depth ${num(benchDefaults.depthDiffusionLengths)}·√(α·t), t from the segment to the end of the run (the far end then changes the surface heat flux by about e⁻¹⁶): physics/bench.ts`,
    },
  ];
}

/** restS: the time from the segment to the end of the run, s (what a bench's chain is built for). */
function faceLines(at: string, c: FaceCondition, facing: 'down' | 'up', lengthM: number, restS: number): Coefficient[] {
  if (c.kind === 'fixed') return [{ what: `${at}: held at`, value: degC(c.tK), source: FROM_FILE }];
  if (c.kind === 'heater') return heaterLines(at, c.heater);
  if (c.kind === 'bench') return benchLines(at, c.bench, restS);
  const out: Coefficient[] = [];
  if (c.fluxWPerM2 !== 0) out.push({ what: `${at}: imposed flux (heater power over the footprint included)`, value: `${num(c.fluxWPerM2)} W/m²`, source: FROM_FILE });
  if (c.plate) out.push({ what: `${at}: plate`, value: `${degC(c.plate.tK)} through ${num(c.plate.conductance)} W/(m²·K)`, source: FROM_FILE });
  if (c.convection.kind === 'fixed') {
    out.push({ what: `${at}: convection`, value: `${num(c.convection.coefficient)} W/(m²·K) to ${degC(c.fluidK)}`, source: FROM_FILE });
  } else if (c.convection.kind === 'natural') {
    const r = facing === 'up' ? naturalConvectionRanges.upperFacing : naturalConvectionRanges.lowerFacing;
    out.push({
      what: `${at}: natural convection, face looking ${facing}`,
      value: `to air at ${degC(c.fluidK)}, L = A/P = ${num(mToMm(lengthM))} mm`,
      source: `Raithby & Hollands (Handbook of Heat Transfer, 1998) thick-layer forms below Ra 10³, blended to Incropera §9.6.2 eqs. 9.30–9.32 by Ra 10⁴ (published range Ra ${num(r.low)}–${num(r.high)}); L = A/P after Goldstein, Sparrow & Jones (1973); properties at the film temperature`,
    });
  }
  if (c.emissivity > 0) out.push({ what: `${at}: radiation`, value: `ε = ${num(c.emissivity)} to ${degC(c.surroundingsK)}`, source: `Stefan–Boltzmann law, grey surface in large surroundings; ε ${FROM_FILE}` });
  if (out.length === 0) out.push({ what: `${at}: adiabatic`, value: 'no heat through the face', source: FROM_FILE });
  return out;
}

/** Every coefficient of the problem, with its source. */
export function coefficientTrace(problem: Problem): Coefficient[] {
  const out: Coefficient[] = [];
  problem.layers.forEach((layer, i) => {
    const where = `layer ${layer.id}${layer.separator ? ' (separator)' : ''}`;
    out.push({ what: `${where}: thickness`, value: `${num(mToMm(layer.thicknessM))} mm`, source: FROM_FILE });
    out.push(...materialLines(where, layer.material));
    out.push(...sourceLines(where, layer));
    for (const term of layer.terms ?? []) {
      if (term.kind === 'edge') out.push(...edgeLines(where, term.loss));
      else out.push({ what: `${where}: linear heat term a + b·T`, value: `a = ${num(term.aWPerM3)} W/m³, b = ${num(term.bWPerM3K)} W/(m³·K)`, source: FROM_FILE });
    }
    const r = problem.contactResistances[i];
    if (r !== undefined && i < problem.layers.length - 1) {
      out.push({ what: `contact ${layer.id} | ${problem.layers[i + 1]!.id}`, value: r > 0 ? `${num(r)} m²·K/W` : 'none (perfect contact)', source: r > 0 ? `${FROM_FILE}; in series with the half-cell resistances` : FROM_FILE });
    }
  });
  const lengthM = characteristicLengthM(problem.footprint);
  for (const [side, facing] of [['bottom', 'down'], ['top', 'up']] as const) {
    for (const seg of problem[side]) out.push(...faceLines(`${side} face from ${num(seg.fromS)} s`, seg.condition, facing, lengthM, problem.durationS - seg.fromS));
  }
  const usesAir = [...problem.bottom, ...problem.top].some((s) => s.condition.kind === 'terms' && s.condition.convection.kind === 'natural')
    || problem.layers.some((l) => (l.terms ?? []).some((t) => t.kind === 'edge' && t.loss.convection.kind === 'natural'));
  if (usesAir) {
    out.push({
      what: 'air properties (k, ν, α at the film temperature)',
      value: `dry air at 1 atm, tabulated ${num(AIR_TABLE_RANGE_K.low)}–${num(AIR_TABLE_RANGE_K.high)} K, linear between rows`,
      source: 'Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, Table A.4 (from memory, cross-checked within ~3 %)',
    });
  }
  out.push({ what: 'ambient and initial temperature', value: `${degC(problem.ambientK)}, ${degC(problem.initialK)}`, source: FROM_FILE });
  const n = problem.numerics;
  const acc = n.accuracy;
  out.push({
    what: 'numerics',
    value: `tolerance ${num(n.toleranceK)} K, liquid fraction ${num(n.liquidFractionTolerance)}, ${num(n.cellsPerMm)} cells/mm (separator ${num(n.separatorCellsPerMm)})${acc ? `, event accuracy ${num(acc.eventAccuracyS)} s (level ${acc.level})` : ''}`,
    source: 'the solver\'s defaults (DEVELOPERS.md), or numerics.* in the scenario file where given',
  });
  return out;
}

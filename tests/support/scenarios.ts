// Builders of scenario objects for the tests: the JSON format of sim/scenario/scenario-schema.ts, written as plain data so
// every test drives the solver through the public contract (parseScenario → runProblem), as the CLI and the browser
// view do. The materials here are invented test materials with round numbers; the references are closed forms.

import benchCoupon from '../../examples/bench-coupon.json' with { type: 'json' };
import type { AccuracyPlan, Problem } from '../../sim/physics/problem.ts';
import type { RunRecord } from '../../sim/observe/record.ts';
import type { RunOptions, RunOutcome } from '../../sim/run.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import type { FaceSegmentFile, InlineMaterialFile, LayerFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';

/** 0 °C in kelvin (SI Brochure, 9th ed., §2.3.1): the tests convert their closed forms' K to the contract's °C. */
export const ZERO_C_IN_K = 273.15;
export const toK = (celsius: number): number => celsius + ZERO_C_IN_K;
export const toC = (kelvin: number): number => kelvin - ZERO_C_IN_K;

/**
 * A constant property written as a flat table [[0 °C, v], [1000 °C, v]] (held flat outside): the same material as the
 * plain number v, read through the tabulated path. The number form has checks of its own (lumped.test.ts,
 * tests/unit/material.test.ts), so a fault in one form does not hide what the other verification tests measure.
 */
export const flat = (v: number): [number, number][] => [[0, v], [1000, v]];

/** An invented material: k = 1 W/m·K, ρ = 2000 kg/m³, cp = 1000 J/kg·K (α = 5e-7 m²/s, ρcp = 2e6 J/m³·K). */
export const PLAIN: InlineMaterialFile = { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: flat(1000) };

/** What a test states about a scenario; everything else takes a plain default. */
export interface ScenarioParts {
  readonly duration_s: number;
  readonly materials: Record<string, InlineMaterialFile>;
  readonly layers: LayerFile[];
  readonly ambient_C?: number;
  readonly initial_C?: number;
  readonly contacts?: ScenarioFile['contacts'];
  readonly bottom?: FaceSegmentFile[];
  readonly top?: FaceSegmentFile[];
  readonly output?: ScenarioFile['output'];
  readonly numerics?: ScenarioFile['numerics'];
  readonly footprint?: ScenarioFile['footprint'];
  readonly name?: string;
}

/** A complete scenario object (format version 1). Faces without segments are adiabatic. */
export function scenario(parts: ScenarioParts): ScenarioFile {
  return {
    freezeline: 1,
    name: parts.name ?? 'test scenario',
    ambient_C: parts.ambient_C ?? 20,
    initial_C: parts.initial_C ?? parts.ambient_C ?? 20,
    duration_s: parts.duration_s,
    ...(parts.footprint ? { footprint: parts.footprint } : {}),
    materials: parts.materials,
    layers: parts.layers,
    ...(parts.contacts ? { contacts: parts.contacts } : {}),
    bottom: parts.bottom ?? [],
    top: parts.top ?? [],
    ...(parts.output ? { output: parts.output } : {}),
    ...(parts.numerics ? { numerics: parts.numerics } : {}),
  };
}

/** One layer of one material named `slab`. */
export function slab(parts: Omit<ScenarioParts, 'materials' | 'layers'> & {
  readonly material: InlineMaterialFile;
  readonly thickness_mm: number;
  readonly separator?: boolean;
  readonly source_W_m3?: LayerFile['source_W_m3'];
}): ScenarioFile {
  const { material, thickness_mm, separator, source_W_m3, ...rest } = parts;
  return scenario({
    ...rest,
    materials: { slab: material },
    layers: [{
      id: 'slab', material: 'slab', thickness_mm,
      ...(separator ? { separator } : {}),
      ...(source_W_m3 !== undefined ? { source_W_m3 } : {}),
    }],
  });
}

/**
 * A slab drained beyond what it holds: 2 mm of an invented steel-like material (k = 50 W/m·K, ρ = 8000 kg/m³,
 * cp = 500 J/kg·K) from 20 °C, drained by q = 5 kW/m² from below, adiabatic above. Past a few L²/α the profile is the
 * quasi-steady parabola (Carslaw & Jaeger, Conduction of Heat in Solids, 1959, §3.8): mean T(t) = T₀ − q·t/(ρcL), the
 * face below the mean by q·L/(3k), so the face reaches 0 K at t* = ρcL·(T₀ − qL/(3k))/q (drainedSlabZeroKelvinS,
 * 469 s). Every run of it stops for a physical reason.
 */
export const DRAINED_SLAB = { kWmK: 50, rhoKgM3: 8000, cpJKgK: 500, thicknessM: 0.002, fluxWm2: 5000, startC: 20 } as const;

export function drainedSlab(durationS = 10_800): ScenarioFile {
  const d = DRAINED_SLAB;
  return slab({
    name: 'drained slab', duration_s: durationS, initial_C: d.startC, thickness_mm: d.thicknessM * 1000,
    material: { k_W_mK: d.kWmK, rho_kg_m3: d.rhoKgM3, cp_J_kgK: d.cpJKgK }, bottom: [{ from_s: 0, flux_W_m2: -d.fluxWm2 }],
  });
}

/** The closed-form time at which drainedSlab()'s bottom face reaches 0 K, s (see there). */
export function drainedSlabZeroKelvinS(): number {
  const d = DRAINED_SLAB;
  return (d.rhoKgM3 * d.cpJKgK * d.thicknessM * (toK(d.startC) - (d.fluxWm2 * d.thicknessM) / (3 * d.kWmK))) / d.fluxWm2;
}

/**
 * The demo (examples/bench-coupon.json) with its hot plate at plateC °C and, when given, its plate removed at holdS
 * (bottom[1].from_s): the window tests' and the README example's hotter demo. A fresh copy each call.
 */
export function demoOnPlate(plateC: number, holdS?: number): ScenarioFile {
  const s = structuredClone(benchCoupon) as unknown as ScenarioFile;
  s.bottom[0]!.plate!.temperature_C = plateC;
  if (holdS !== undefined) s.bottom[1]!.from_s = holdS;
  return s;
}

/**
 * `parsed` (a parsed scenario) solved to `accuracy` as it is (no ladder, no melt ramp), both tolerances × `scale`:
 * how a convergence study or a calibration sets a run's levels by hand, each caller computing its own scale so that
 * its tolerances keep their bits.
 */
export function atSettings(parsed: Problem, accuracy: AccuracyPlan, scale: number): Problem {
  return {
    ...parsed,
    numerics: {
      ...parsed.numerics,
      toleranceK: parsed.numerics.toleranceK * scale,
      liquidFractionTolerance: parsed.numerics.liquidFractionTolerance * scale,
      accuracy: { ...accuracy, meltRampK: 0, confirm: false },
    },
  };
}

/**
 * A convergence study's reference: `parsed` (a parsed scenario) solved to `plan` (its own plan, or a rung of the
 * ladder below it that a run stopped at) and refined `levels` grid and tolerance levels further (cells × 2^levels,
 * tolerances ÷ 3^levels), on the curve as written (no melt ramp, whose bias a ramped reference would share), built
 * from that plan, not by the accuracy rule, and run as it is (no ladder).
 */
export function refinedBeyond(parsed: Problem, plan: AccuracyPlan, levels: number): Problem {
  const parsedPlan = parsed.numerics.accuracy!;
  // the parsed tolerances are divided by the parsed plan's divisor: undo it, divide by the run's own and by 3^levels
  const scale = parsedPlan.toleranceDivisor / plan.toleranceDivisor / 3 ** levels;
  return atSettings(parsed, { ...plan, gridRefine: plan.gridRefine * 2 ** levels, toleranceDivisor: plan.toleranceDivisor * 3 ** levels }, scale);
}

/** parseScenario() that must succeed: throws with every field error otherwise. */
export function parseOk(value: unknown): Problem {
  const parsed = parseScenario(value);
  if (!parsed.ok) throw new Error(`scenario refused: ${parsed.errors.map((e) => `${e.path}: ${e.message}`).join('; ')}`);
  return parsed.problem;
}

export type OkOutcome = Extract<RunOutcome, { status: 'ok' }>;

/** Parses and runs a scenario that must finish with status 'ok'. */
export function runOk(value: unknown, options: RunOptions = {}): OkOutcome {
  const outcome = runProblem(parseOk(value), options);
  if (outcome.status !== 'ok') throw new Error(`run did not finish: ${JSON.stringify(outcome)}`);
  return outcome;
}

/** The probe value (°C) at a requested position (mm) and output time (s), found by exact match in the record. */
export function probeAt(record: RunRecord, xMm: number, tS: number): number {
  const i = record.probes.xMm.indexOf(xMm);
  const j = record.probes.tS.indexOf(tS);
  if (i < 0 || j < 0) throw new Error(`no probe at x = ${xMm} mm, t = ${tS} s (have ${record.probes.xMm} / ${record.probes.tS})`);
  const v = record.probes.tC[i]?.[j];
  if (v === undefined) throw new Error(`probe ${xMm} mm has no value at ${tS} s`);
  return v;
}

/** A recorded series at time t (s), linear between recorded points; throws outside the record. */
export function seriesAt(tS: Float64Array, values: Float64Array, t: number): number {
  const n = tS.length;
  for (let j = 0; j < n; j++) {
    const tj = tS[j]!;
    if (tj === t) return values[j]!;
    if (tj > t) {
      if (j === 0) break;
      const t0 = tS[j - 1]!;
      const v0 = values[j - 1]!;
      return v0 + ((values[j]! - v0) * (t - t0)) / (tj - t0);
    }
  }
  throw new Error(`t = ${t} s is outside the record [${tS[0]}, ${tS[n - 1]}]`);
}

/**
 * The README's peak time, written out over a whole series (the reference for record.ts PeakReach, which finds it as the
 * run goes): the first point within `withinK` of the series' highest value, and the time at which the series crossed
 * that level, linear between the high before that point (the highest value before it, where first reached) and the
 * point itself; the first point's own time when nothing came before it.
 */
export function peakReachedS(tS: ArrayLike<number>, values: ArrayLike<number>, withinK: number): number {
  const v = Array.from(values);
  const level = Math.max(...v) - withinK;
  const i = v.findIndex((x) => x >= level);
  if (i === 0) return tS[0]!;
  const before = Math.max(...v.slice(0, i));
  const r = v.indexOf(before);
  return tS[r]! + ((tS[i]! - tS[r]!) * (level - before)) / (v[i]! - before);
}

/** The last value of a series. */
export function last(values: Float64Array): number {
  const v = values[values.length - 1];
  if (v === undefined) throw new Error('empty series');
  return v;
}

/** Least-squares slope of log(err) against log(size): the observed order of convergence. */
export function observedOrder(sizes: readonly number[], errors: readonly number[]): number {
  const xs = sizes.map(Math.log);
  const ys = errors.map(Math.log);
  const n = xs.length;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (xs[i]! - mx) * (ys[i]! - my);
    sxx += (xs[i]! - mx) ** 2;
  }
  return sxy / sxx;
}

/** Mulberry32, a small seeded PRNG (Tommy Ettinger's public-domain generator): reproducible random scenarios. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** What a random scenario may contain. */
export interface RandomScenarioOptions {
  /** Imposed fluxes, heater power and volumetric sources (heat that can push a temperature past every bound). */
  readonly heatInputs: boolean;
  /** Natural convection and heater power (they need a footprint). */
  readonly natural: boolean;
  /** Write constant cp as a plain number half of the time (else as a flat table). */
  readonly plainNumbers: boolean;
  /** Only constant cp (so stored energy can be read off the layer means); else some cp tables rise with T. */
  readonly constantCp: boolean;
}

/** Random draws on top of a seeded generator; values are rounded to 3 digits so a failing case reads as data. */
function draws(rand: () => number) {
  const between = (lo: number, hi: number) => lo + (hi - lo) * rand();
  return {
    rand,
    between,
    logBetween: (lo: number, hi: number) => Math.exp(between(Math.log(lo), Math.log(hi))),
    pick: <T>(items: readonly T[]): T => items[Math.floor(rand() * items.length)]!,
    round: (v: number) => Number(v.toPrecision(3)),
  };
}
type Draws = ReturnType<typeof draws>;

function randomMaterial(d: Draws, options: Pick<RandomScenarioOptions, 'plainNumbers' | 'constantCp'>): InlineMaterialFile {
  const { rand, between, logBetween, round } = d;
  const cpValue = round(between(300, 2000));
  const cp: InlineMaterialFile['cp_J_kgK'] = options.plainNumbers && rand() < 0.5 ? cpValue
    : options.constantCp || rand() < 0.5 ? flat(cpValue) : [[0, cpValue], [round(between(200, 600)), round(cpValue * between(1, 1.5))]];
  const solidus = round(between(100, 450));
  const melt = rand() < 0.4
    ? { melt: { solidus_C: solidus, liquidus_C: rand() < 0.5 ? solidus : round(solidus + between(0.5, 10)), latent_J_kg: round(between(5e4, 4e5)) } }
    : {};
  return {
    k_W_mK: rand() < 0.8 ? round(logBetween(0.2, 200)) : [[0, round(logBetween(0.2, 50))], [500, round(logBetween(0.2, 50))]],
    rho_kg_m3: round(between(500, 9000)),
    cp_J_kgK: cp,
    ...melt,
  };
}

/** A random face segment from `from` (s): fixed_C alone, or a random sum of the other terms (none: adiabatic). */
function randomSegment(d: Draws, options: Pick<RandomScenarioOptions, 'heatInputs' | 'natural'>, from: number): FaceSegmentFile {
  const { rand, between, logBetween, round } = d;
  if (rand() < 0.15) return { from_s: from, fixed_C: round(between(0, 500)) };
  const seg: FaceSegmentFile = { from_s: from };
  if (rand() < 0.6) seg.convection_W_m2K = options.natural && rand() < 0.4 ? 'natural' : round(between(0, 50));
  if (rand() < 0.3) seg.fluid_C = round(between(0, 100));
  if (rand() < 0.5) seg.emissivity = round(rand());
  if (rand() < 0.2) seg.surroundings_C = round(between(0, 100));
  if (rand() < 0.3) seg.plate = { temperature_C: round(between(50, 500)), conductance_W_m2K: round(logBetween(10, 2000)) };
  if (options.heatInputs && rand() < 0.3) seg.flux_W_m2 = round(between(-5e3, 2e4));
  if (options.heatInputs && options.natural && rand() < 0.15) seg.power_W = round(between(0, 5));
  return seg;
}

function randomSchedule(d: Draws, options: Pick<RandomScenarioOptions, 'heatInputs' | 'natural'>, duration: number): FaceSegmentFile[] {
  const n = 1 + Math.floor(d.rand() * 3);
  const starts = [0, ...Array.from({ length: n - 1 }, () => d.round(d.between(0.5, duration)))].sort((a, b) => a - b);
  return [...new Set(starts)].map((from) => randomSegment(d, options, from));
}

/**
 * A random valid scenario: 1–4 layers of invented materials (some melting, isothermally or over a range), random
 * contacts, face schedules of one to three segments mixing every face term, and a short duration (10–120 s). `rand`
 * is a seeded generator (seededRandom), so a failing case can be rebuilt from its seed.
 */
export function randomScenario(rand: () => number, options: RandomScenarioOptions): ScenarioFile {
  const d = draws(rand);
  const { between, logBetween, pick, round } = d;
  const duration = round(between(10, 120));
  const layerCount = 1 + Math.floor(rand() * 4);
  const materials: Record<string, InlineMaterialFile> = {};
  const layers: LayerFile[] = [];
  for (let i = 0; i < layerCount; i++) {
    const material = randomMaterial(d, options);
    materials[`m${i}`] = material;
    const source = options.heatInputs && rand() < 0.3
      ? { source_W_m3: [{ from_s: 0, to_s: round(between(1, duration)), value: round(between(-1e6, 5e6)) }] } : {};
    const separator = material.melt && rand() < 0.5 ? { separator: true } : {};
    layers.push({ id: `L${i}`, material: `m${i}`, thickness_mm: round(between(0.2, 4)), ...separator, ...source });
  }
  const contacts = layers.slice(1).flatMap((l, i) =>
    rand() < 0.5 ? [{ below: layers[i]!.id, above: l.id, resistance_m2K_W: round(logBetween(1e-5, 1e-2)) }] : []);
  const total = layers.reduce((a, l) => a + l.thickness_mm, 0);
  return scenario({
    ambient_C: round(between(0, 40)), initial_C: round(between(0, 400)), duration_s: duration,
    ...(options.natural
      ? { footprint: pick([{ diameter_mm: round(between(10, 100)) }, { width_mm: round(between(10, 100)), length_mm: round(between(10, 100)) }]) }
      : {}),
    materials, layers, contacts,
    bottom: randomSchedule(d, options, duration), top: randomSchedule(d, options, duration),
    output: { times_s: [round(duration * rand()), duration], probes_mm: [0, Number((total * rand()).toFixed(3)), total] },
  });
}

/**
 * A random mirror-symmetric scenario: a stack A B … B A of random layers with mirrored contacts, the same random face
 * schedule on both faces (no natural convection, whose correlation depends on which way a face looks), and probes
 * placed in mirror pairs x and total − x.
 */
export function randomSymmetricScenario(rand: () => number): { scenario: ScenarioFile; pairs: [number, number][] } {
  const d = draws(rand);
  const { between, logBetween, round } = d;
  const duration = round(between(10, 120));
  const half = 1 + Math.floor(rand() * 2);
  const materials: Record<string, InlineMaterialFile> = {};
  const halfLayers: LayerFile[] = [];
  for (let i = 0; i < half; i++) {
    materials[`m${i}`] = randomMaterial(d, { plainNumbers: false, constantCp: false });
    halfLayers.push({ id: `L${i}`, material: `m${i}`, thickness_mm: round(between(0.2, 4)) });
  }
  const middle: LayerFile = { id: 'middle', material: 'mid', thickness_mm: round(between(0.2, 4)) };
  materials.mid = randomMaterial(d, { plainNumbers: false, constantCp: false });
  const layers = [...halfLayers, middle, ...halfLayers.map((l) => ({ ...l, id: `${l.id}-mirror` })).reverse()];
  const resistances = halfLayers.map(() => round(logBetween(1e-5, 1e-2)));
  const ids = layers.map((l) => l.id);
  const contacts = ids.slice(1).map((above, i) => {
    const j = i < half ? i : layers.length - 2 - i; // contact i mirrors contact (n − 2 − i)
    return { below: ids[i]!, above, resistance_m2K_W: resistances[j]! };
  });
  const schedule = randomSchedule(d, { heatInputs: true, natural: false }, duration);
  const total = layers.reduce((a, l) => a + l.thickness_mm, 0);
  const xs = [0, Number((total * 0.5 * rand()).toFixed(3)), Number((total * 0.5 * rand()).toFixed(3))];
  const pairs = xs.map((x): [number, number] => [x, total - x]);
  return {
    scenario: scenario({
      ambient_C: round(between(0, 40)), initial_C: round(between(0, 400)), duration_s: duration,
      materials, layers, contacts, bottom: schedule, top: schedule.map((s) => ({ ...s })),
      output: { times_s: [round(duration * rand()), duration], probes_mm: pairs.flat() },
    }),
    pairs,
  };
}

/**
 * A random stack that melts on a hot plate and freezes in free air (invented): a metal collector, a salt separator
 * (the library eutectic, or an invented salt melting isothermally or over up to 8 K), a metal electrode; plate, hold,
 * emissivities and thicknesses drawn uniformly over the ranges below. tests/convergence/event-accuracy.test.ts checks
 * the accuracy promise on seeds 1–8 (× 7919); bench/accuracy-calibration.ts calibrates the rule on seeds 101–108, so
 * the test's stacks stay out of the calibration.
 */
export function randomMeltScenario(rand: () => number): ScenarioFile {
  const between = (a: number, b: number) => Number((a + (b - a) * rand()).toPrecision(3));
  const solidus = between(330, 370);
  const salt = rand() < 0.4 ? 'licl-kcl-eutectic' : 'salt';
  const hold = between(120, 400);
  return {
    freezeline: 1, name: 'random melt-and-freeze stack', ambient_C: between(0, 40), duration_s: Math.round(hold + between(500, 1200)),
    footprint: { diameter_mm: between(15, 40) },
    materials: {
      salt: {
        k_W_mK: between(0.5, 2), rho_kg_m3: between(1600, 2200), cp_J_kgK: between(900, 1300),
        melt: { solidus_C: solidus, liquidus_C: rand() < 0.5 ? solidus : between(solidus, solidus + 8), latent_J_kg: between(1e5, 3e5) },
      },
    },
    layers: [
      { id: 'collector', material: rand() < 0.5 ? 'nickel' : 'mild-steel', thickness_mm: between(0.3, 1.5) },
      { id: 'separator', material: salt, thickness_mm: between(0.5, 2), separator: true },
      { id: 'electrode', material: rand() < 0.5 ? 'magnesium' : 'iron', thickness_mm: between(0.5, 2) },
    ],
    bottom: [
      { from_s: 0, plate: { temperature_C: between(430, 520), conductance_W_m2K: between(300, 1500) } },
      { from_s: hold, convection_W_m2K: 'natural', emissivity: between(0.2, 0.8) },
    ],
    top: [{ from_s: 0, convection_W_m2K: 'natural', emissivity: between(0.2, 0.8) }],
  } as ScenarioFile;
}

// fast-check arbitraries of valid scenarios across the ranges a sweep or a careless user may reach: 1–8 layers from
// 1 µm to 100 mm, library and inline materials (tabulated k(T) and cp(T) with steep rises, tiny and zero latent heat,
// isothermal melts), imposed fluxes to ±1e6 W/m², plates and held faces to 2000 °C, volumetric sources of both signs,
// durations from 1 s to 1e7 s. Every scenario is valid JSON of the contract (DESIGN.md, "Scenario file"); shrinking
// turns a failure into a small reproducer. The data are invented: they probe the solver, they describe no real cell.

import fc from 'fast-check';
import { libraryMaterial, libraryNames } from '../../sim/scenario/library.ts';
import type { FaceSegmentFile, InlineMaterialFile, LayerFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';

/** Values with three significant digits, so a reproducer reads as data. */
export const round = (v: number): number => Number(v.toPrecision(3));
/** Temperatures to 0.01 K, so the rows of a table stay strictly increasing after rounding. */
const roundT = (v: number): number => Math.round(v * 100) / 100;
/**
 * A fraction in [0, 1], uniform in value. (fc.double draws uniformly among representable doubles, most of which are
 * tiny: through exp() nearly every draw became 1, so 90 % of scenarios were 1 s long with 1 mm layers.)
 */
const FRACTION_STEPS = 2 ** 30;
export const fraction = fc.integer({ min: 0, max: FRACTION_STEPS }).map((i) => i / FRACTION_STEPS);
/** A log-uniform number in [lo, hi]. */
export const logRange = (lo: number, hi: number) => fraction.map((f) => round(lo * (hi / lo) ** f));
/** A uniform number in [lo, hi]. */
export const range = (lo: number, hi: number) => fraction.map((f) => {
  const v = lo + (hi - lo) * f;
  return Math.abs(v) < 1e-6 ? 0 : round(v);
});

const library = libraryNames();
const libraryMelting = library.filter((name) => libraryMaterial(name)?.melt !== undefined);
/** Library salts that melt, the separators of window-arbitrary.ts and body-arbitrary.ts. */
export const librarySalts = libraryMelting.filter((n) => /eutectic|^kcl$|^licl$/.test(n));

type Property = InlineMaterialFile['k_W_mK'];

/** A property: a number, a flat or gently rising table, or a steep rise (up to ×130 over 50 K). */
const property = (lo: number, hi: number): fc.Arbitrary<Property> => fc.oneof(
  logRange(lo, hi),
  fc.tuple(logRange(lo, hi), range(-50, 1500), range(1, 3)).map(([v, at, f]): Property => [[roundT(at), v], [roundT(at + 500), round(v * f)]]),
  fc.tuple(logRange(lo, hi), range(0, 1500), logRange(1, 130), logRange(1, 50))
    .map(([v, at, f, width]): Property => [[roundT(at), v], [roundT(at + width), round(v * f)]]),
);

/** A melt: isothermal or over a range, latent heat from zero through tiny to large. */
const melt = fc.record({
  solidus_C: range(-100, 1800),
  span: fc.oneof(fc.constant(0), logRange(0.01, 200)),
  latent_J_kg: fc.oneof(fc.constant(0), fc.constant(1e-6), logRange(1e-6, 1), logRange(1e3, 1e6)),
}).map((m) => ({ solidus_C: roundT(m.solidus_C), liquidus_C: roundT(roundT(m.solidus_C) + m.span), latent_J_kg: m.latent_J_kg }));

const inlineMaterial: fc.Arbitrary<InlineMaterialFile> = fc.record({
  k_W_mK: property(0.01, 400),
  rho_kg_m3: logRange(10, 20000),
  cp_J_kgK: property(100, 5000),
  melt: fc.option(melt, { nil: undefined, freq: 2 }),
}).map((m) => (m.melt === undefined ? { k_W_mK: m.k_W_mK, rho_kg_m3: m.rho_kg_m3, cp_J_kgK: m.cp_J_kgK } : m));

const temperature = range(-60, 2000);

/** One face segment from `from` (s): a held temperature alone, or any sum of the other terms. */
const segment = (from: number, natural: boolean): fc.Arbitrary<FaceSegmentFile> => fc.oneof(
  { weight: 1, arbitrary: temperature.map((t): FaceSegmentFile => ({ from_s: from, fixed_C: t })) },
  {
    weight: 4,
    arbitrary: fc.record({
      flux_W_m2: fc.option(fc.oneof(range(-1e6, 1e6), range(-1e3, 1e3)), { nil: undefined }),
      power_W: fc.option(natural ? range(-50, 200) : fc.constant(undefined), { nil: undefined }),
      convection_W_m2K: fc.option(natural ? fc.oneof(logRange(0.1, 1e4), fc.constant('natural' as const)) : logRange(0.1, 1e4), { nil: undefined }),
      fluid_C: fc.option(temperature, { nil: undefined }),
      emissivity: fc.option(range(0, 1), { nil: undefined }),
      surroundings_C: fc.option(temperature, { nil: undefined }),
      plate: fc.option(fc.record({ temperature_C: temperature, conductance_W_m2K: logRange(1, 1e6) }), { nil: undefined }),
    }).map((terms) => {
      const seg: FaceSegmentFile = { from_s: from };
      for (const [key, value] of Object.entries(terms)) if (value !== undefined) Object.assign(seg, { [key]: value });
      return seg;
    }),
  },
);

/** A face schedule of one to three segments, the first from 0, each later one inside the run. */
const schedule = (duration: number, natural: boolean): fc.Arbitrary<FaceSegmentFile[]> =>
  fc.uniqueArray(range(0, 0.999).map((f) => round(f * duration)), { maxLength: 2 })
    .chain((starts) => {
      const froms = [...new Set([0, ...starts])].sort((a, b) => a - b);
      return fc.tuple(...froms.map((from) => segment(from, natural)));
    });

interface LayerDraft {
  readonly material: InlineMaterialFile | string;
  readonly thicknessMm: number;
  readonly separator: boolean;
  readonly source: { from: number; to: number; value: number } | undefined;
  readonly contact: number | undefined;
}

const layerDraft = (duration: number, maxMm: number): fc.Arbitrary<LayerDraft> => fc.record({
  material: fc.oneof(inlineMaterial, fc.constantFrom(...library)),
  thicknessMm: logRange(0.001, maxMm),
  separator: fc.boolean(),
  source: fc.option(fc.record({ from: range(0, 0.99), to: range(0, 1), value: fc.oneof(range(-1e8, 1e8), range(-1e5, 1e6)) })
    .map((s) => ({ from: round(s.from * duration), to: round(Math.max(s.from, s.to) * duration), value: s.value })), { nil: undefined, freq: 3 }),
  contact: fc.option(logRange(1e-6, 1), { nil: undefined }),
});

const melts = (m: InlineMaterialFile | string): boolean =>
  (typeof m === 'string' ? libraryMelting.includes(m) : m.melt !== undefined);

/** Numerical settings a user may try: tolerances from tight to loose, finer and coarser grids, a capped step. */
const numericsDraft = (minToleranceK: number) => fc.record({
  toleranceK: fc.option(logRange(minToleranceK, 5), { nil: undefined }),
  liquidFraction: fc.option(logRange(1e-4, 0.2), { nil: undefined }),
  cellsPerMm: fc.option(logRange(0.5, 40), { nil: undefined }),
  minCells: fc.option(fc.integer({ min: 1, max: 40 }), { nil: undefined }),
  maxStepShare: fc.option(logRange(1e-3, 1), { nil: undefined }),
  /**
   * numerics.event_accuracy_s as a share of the duration (at least 1e-3 s, the least one may ask): from 1.4e-4, which
   * cells ×2 and tolerances ÷3 reach within the cell limit and the work budget for any stack drawn here (the rule's
   * (1, 1) models 1.3e-4), to the whole duration, where the plan loosens the tolerances × 9.
   */
  accuracyShare: fc.option(logRange(1.4e-4, 1), { nil: undefined }),
});

/** The numerics block, its cell density capped so the stack stays within 2000 cells (validation allows 10 000). */
function numericsFor(n: ReturnType<typeof numericsDraft> extends fc.Arbitrary<infer T> ? T : never, duration: number, totalMm: number) {
  const cellsPerMm = n.cellsPerMm === undefined ? undefined : round(Math.min(n.cellsPerMm, 1000 / totalMm));
  return {
    ...(n.toleranceK !== undefined ? { tolerance_K: n.toleranceK } : {}),
    ...(n.liquidFraction !== undefined ? { liquid_fraction_tolerance: n.liquidFraction } : {}),
    ...(cellsPerMm !== undefined && cellsPerMm > 0 ? { cells_per_mm: cellsPerMm, separator_cells_per_mm: cellsPerMm } : {}),
    ...(n.minCells !== undefined ? { min_cells_per_layer: n.minCells, min_separator_cells: n.minCells } : {}),
    ...(n.maxStepShare !== undefined ? { max_step_s: round(n.maxStepShare * duration) } : {}),
    ...(n.accuracyShare !== undefined ? { event_accuracy_s: Math.max(1e-3, round(n.accuracyShare * duration)) } : {}),
  };
}

export interface ScenarioRanges {
  /** Longest run, s. */
  readonly maxDurationS: number;
  /** Thickest layer, mm. */
  readonly maxLayerMm: number;
  /** Tightest numerics.tolerance_K drawn, K. */
  readonly minToleranceK: number;
}

/** The ranges of the long tier (`npm run fuzz`). */
export const FULL_RANGES: ScenarioRanges = { maxDurationS: 1e7, maxLayerMm: 100, minToleranceK: 1e-3 };
/** The quick tier's (`npm test`): runs up to an hour, layers up to 10 mm, tolerances from 0.01 K; the rest as above. */
export const QUICK_RANGES: ScenarioRanges = { maxDurationS: 3600, maxLayerMm: 10, minToleranceK: 1e-2 };

/** Valid scenarios across the given ranges. */
const anyScenario = (r: ScenarioRanges): fc.Arbitrary<ScenarioFile> => fc.record({
  duration: fc.oneof(logRange(1, r.maxDurationS), logRange(1, Math.min(3600, r.maxDurationS))),
  ambient: range(-40, 60),
  initial: fc.option(range(-60, 1500), { nil: undefined }),
  footprint: fc.option(fc.oneof(
    logRange(1, 500).map((d) => ({ diameter_mm: d })),
    fc.tuple(logRange(1, 500), logRange(1, 500)).map(([w, l]) => ({ width_mm: w, length_mm: l })),
  ), { nil: undefined }),
}).chain((base) => {
  const natural = base.footprint !== undefined;
  return fc.record({
    base: fc.constant(base),
    layers: fc.array(layerDraft(base.duration, r.maxLayerMm), { minLength: 1, maxLength: 8 }),
    bottom: schedule(base.duration, natural),
    top: schedule(base.duration, natural),
    outputs: fc.uniqueArray(range(0, 1).map((f) => round(f * base.duration)), { maxLength: 4 }),
    numerics: fc.option(numericsDraft(r.minToleranceK), { nil: undefined, freq: 5 }),
  });
}).map(({ base, layers, bottom, top, outputs, numerics }) => {
  const materials: Record<string, InlineMaterialFile> = {};
  const files: LayerFile[] = layers.map((l, i) => {
    let name: string;
    if (typeof l.material === 'string') name = l.material;
    else { name = `m${i}`; materials[name] = l.material; }
    const valid = l.source !== undefined && l.source.to > l.source.from;
    return {
      id: `L${i}`, material: name, thickness_mm: l.thicknessMm,
      ...(l.separator && melts(l.material) ? { separator: true } : {}),
      ...(valid ? { source_W_m3: [{ from_s: l.source!.from, to_s: l.source!.to, value: l.source!.value }] } : {}),
    };
  });
  const contacts = layers.slice(1).flatMap((l, i) =>
    (l.contact === undefined ? [] : [{ below: `L${i}`, above: `L${i + 1}`, resistance_m2K_W: l.contact }]));
  return {
    freezeline: 1,
    name: 'fuzzed scenario',
    ambient_C: base.ambient,
    ...(base.initial !== undefined ? { initial_C: base.initial } : {}),
    duration_s: base.duration,
    ...(base.footprint ? { footprint: base.footprint } : {}),
    materials,
    layers: files,
    ...(contacts.length > 0 ? { contacts } : {}),
    bottom,
    top,
    ...(outputs.length > 0 ? { output: { times_s: outputs.filter((t) => t > 0) } } : {}),
    ...(numerics ? { numerics: numericsFor(numerics, base.duration, layers.reduce((a, l) => a + l.thicknessMm, 0)) } : {}),
  } satisfies ScenarioFile;
});

/**
 * The same scenario with no heat input: every imposed flux, heater power and volumetric source removed, so the
 * maximum principle applies (check.ts). Drawn otherwise, nearly every scenario has one: 3 of 1000 were bounded.
 */
export function withoutHeatInput(s: ScenarioFile): ScenarioFile {
  const face = (segs: ScenarioFile['bottom']) => segs.map(({ flux_W_m2: _flux, power_W: _power, ...rest }) => rest);
  return { ...s, bottom: face(s.bottom), top: face(s.top), layers: s.layers.map(({ source_W_m3: _source, ...rest }) => rest) };
}

/** Share of scenarios drawn without heat input, 1 in this many: enough to exercise the maximum principle. */
const WITHOUT_HEAT_EVERY = 4;

/** Valid scenarios across the given ranges, one in WITHOUT_HEAT_EVERY without heat input. */
export const scenarios = (r: ScenarioRanges): fc.Arbitrary<ScenarioFile> =>
  fc.tuple(anyScenario(r), fc.integer({ min: 1, max: WITHOUT_HEAT_EVERY }))
    .map(([s, draw]) => (draw === 1 ? withoutHeatInput(s) : s));

/** A valid scenario across the full ranges. */
export const scenarioArbitrary: fc.Arbitrary<ScenarioFile> = scenarios(FULL_RANGES);

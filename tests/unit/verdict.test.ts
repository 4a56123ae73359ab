// Event times and the end of heating (sim/observe/verdict.ts) on hand-made series and scenarios, against the definitions of
// DESIGN.md ("Result") worked out by hand: linear interpolation between recorded points, never rounding to a step.

import { describe, expect, it } from 'vitest';
import ndarray from 'ndarray';
import { firstCrossing, heatInputs, heatOffTime, lastHeatInput, summarize } from '../../sim/observe/verdict.ts';
import { recordDefaults, type RunRecord } from '../../sim/observe/record.ts';
import { assertClose } from '../support/assert-close.ts';
import { PLAIN, parseOk, peakReachedS, scenario, slab } from '../support/scenarios.ts';
import type { FaceSegmentFile, InlineMaterialFile, LayerFile } from '../../sim/scenario/scenario-schema.ts';

const f64 = (values: number[]) => Float64Array.from(values);
/** Interpolated times are exact up to round-off in one division. */
const EXACT = { abs: 1e-12 };

type Kind = 'rise-to' | 'fall-below' | 'fall-to';
const cases: [string, number[], number[], number, number, Kind, number | null][] = [
  // what, t, values, level, fromS, kind, expected (by hand)
  ['rises through the level between two points', [0, 1, 2, 3], [0, 0.5, 1.5, 2], 1, 0, 'rise-to', 1.5],
  ['reaches the level exactly at a point', [0, 1, 2, 3], [0, 0.5, 1, 1.5], 1, 0, 'rise-to', 2],
  ['is already above at the start', [0, 1, 2], [2, 2, 2], 1, 0, 'rise-to', 0],
  ['is above when the search starts inside a step', [0, 1, 2], [2, 2, 2], 1, 1.5, 'rise-to', 1.5],
  ['crosses before the search starts, in the same step', [0, 1], [0, 1], 0.5, 0.8, 'rise-to', 0.8],
  ['never reaches the level', [0, 1, 2], [0, 0.2, 0.4], 1, 0, 'rise-to', null],
  ['falls below the level between two points', [0, 1, 2, 3], [0.2, 0.8, 0.4, 0.1], 0.5, 0, 'fall-below', 1.75],
  ['starts below and never comes back up', [0, 1, 2], [0.2, 0.1, 0], 0.5, 0, 'fall-below', null],
  ['fell below before the search started', [0, 1, 2], [1, 0, 0], 0.5, 0.7, 'fall-below', null],
  ['falls below a second time after the search starts', [0, 1, 2, 3, 4], [1, 0, 1, 1, 0], 0.5, 1.5, 'fall-below', 3.5],
  ['falls to the level, reaching it at a point', [0, 1, 2], [1, 0.5, 0], 0, 0, 'fall-to', 2],
  ['falls to the level between two points', [0, 1, 2], [1, 0.5, 0], 0.25, 0, 'fall-to', 1.5],
  ['one point at or past the level', [5], [0], 0.5, 0, 'fall-to', 5],
  ['one point cannot fall below', [5], [0], 0.5, 0, 'fall-below', null],
  ['one point exactly where the search starts', [5], [0], 0.5, 5, 'fall-to', 5],
  ['touches the level at a point, then goes below', [0, 1, 2], [1, 0.5, 0.2], 0.5, 0, 'fall-below', 1],
  ['falls below exactly where the search starts', [0, 1, 2], [1, 1, 0], 0.5, 1.5, 'fall-below', 1.5],
  ['was above before the search started, dips, then rises again', [0, 1, 2, 3], [2, 0, 0, 2], 1, 0.5, 'rise-to', 2.5],
];

describe('firstCrossing()', () => {
  it.each(cases)('firstCrossing() on a series that %s', (_what, t, v, level, fromS, kind, expected) => {
    const got = firstCrossing(f64(t), f64(v), level, fromS, kind);
    if (expected === null) expect(got).toBeNull();
    else assertClose(got ?? Number.NaN, expected, EXACT, 'crossing time, s');
  });
});

describe('heatOffTime()', () => {
  const problem = (bottom: FaceSegmentFile[], top: FaceSegmentFile[] = [], source?: LayerFile['source_W_m3']) =>
    parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600, bottom, top, ...(source !== undefined ? { source_W_m3: source } : {}) }));

  const heating: [string, ReturnType<typeof problem>, number | null][] = [
    ['a plate until 900 s, then air', problem([{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 900, convection_W_m2K: 6 }]), 900],
    ['a positive flux until 100 s, then a negative one', problem([{ from_s: 0, flux_W_m2: 1000 }, { from_s: 100, flux_W_m2: -50 }]), 100],
    ['a held face until 250 s', problem([{ from_s: 0, fixed_C: 400 }, { from_s: 250, convection_W_m2K: 10 }]), 250],
    ['a source until 50 s', problem([{ from_s: 0, convection_W_m2K: 10 }], [], [{ from_s: 0, to_s: 50, value: 1e6 }]), 50],
    ['a heat sink only (negative source)', problem([{ from_s: 0, convection_W_m2K: 10 }], [], [{ from_s: 0, to_s: 50, value: -1e6 }]), 0],
    ['a source of zero', problem([{ from_s: 0, convection_W_m2K: 10 }], [], [{ from_s: 0, to_s: 50, value: 0 }]), 0],
    ['the later of a top plate (200 s) and a bottom flux (300 s)', problem(
      [{ from_s: 0, flux_W_m2: 1000 }, { from_s: 300 }],
      [{ from_s: 0, plate: { temperature_C: 300, conductance_W_m2K: 100 } }, { from_s: 200, emissivity: 0.5 }]), 300],
    ['no heat input at all', problem([{ from_s: 0, convection_W_m2K: 10, emissivity: 0.3 }]), 0],
    ['a plate that lasts to the end', problem([{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }]), null],
    ['a source that lasts to the end', problem([], [], 1e5), null],
  ];

  it.each(heating)('heatOffTime() of %s', (_what, p, expected) => {
    const got = heatOffTime(p);
    if (expected === null) expect(got).toBeNull();
    else assertClose(got ?? Number.NaN, expected, { abs: 0 }, 'heat_off_s');
  });
});

// summarize() on hand-made records: every safe_window_status, the zero-margin edge, the binding layer and the energy
// sums, each worked out by hand from the definitions in the README's verdict table (no solver run involved).
describe('summarize()', () => {
  const SALT: InlineMaterialFile = { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1000, melt: { solidus_C: 350, liquidus_C: 354, latent_J_kg: 1.5e5 } };
  const METAL: InlineMaterialFile = { k_W_mK: 100, rho_kg_m3: 1700, cp_J_kgK: 1000, limits: [{ kind: 'melt', at_C: 650 }, { kind: 'ignition', at_C: 600 }] };
  const CASE: InlineMaterialFile = { k_W_mK: 20, rho_kg_m3: 8000, cp_J_kgK: 500, limits: [{ kind: 'softening', at_C: 700 }] };
  const plateUntil = (offS: number | undefined): FaceSegmentFile[] => [
    { from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } },
    ...(offS === undefined ? [] : [{ from_s: offS, convection_W_m2K: 10 }]),
  ];
  const problemOf = (opts: { separator?: boolean; offS?: number | undefined } = {}) => parseOk(scenario({
    duration_s: 1000,
    materials: { salt: SALT, metal: METAL, case: CASE },
    layers: [
      { id: 'case', material: 'case', thickness_mm: 1 },
      { id: 'sep', material: 'salt', thickness_mm: 1, ...(opts.separator === false ? {} : { separator: true }) },
      { id: 'anode', material: 'metal', thickness_mm: 1 },
    ],
    bottom: plateUntil('offS' in opts ? opts.offS : 100),
  }));

  /** The separator trace worked out by hand below: molten at 25 s, half-frozen at 175 s, frozen at 225 s. */
  const TRACE = {
    tS: [0, 50, 100, 150, 200, 250],
    melt: [-1, 1, 2, 1, -1, -3], // rises through 0 halfway between 0 and 50 s → 25 s
    mean: [0, 1, 1, 0.8, 0.2, 0], // after 100 s falls through 0.5 at 150 + 50·(0.3/0.6) = 175 s
    freeze: [-1, 2, 3, 2, 0.5, -0.5], // after 175 s falls to 0 at 200 + 50·(0.5/1) = 225 s
  };
  type Trace = typeof TRACE;

  /** A record with the given per-layer peak series (°C, on TRACE.tS) and separator trace. */
  function recordOf(peaks: { case: number[]; sep: number[]; anode: number[] }, trace: Trace | null = TRACE,
    energy: Partial<RunRecord['energy']> = {}): RunRecord {
    const tS = f64(TRACE.tS);
    // the recorder's peak time, written out (tests/support peakReachedS)
    const series = (id: keyof typeof peaks) => ({ id, minC: f64(peaks[id]), meanC: f64(peaks[id]), maxC: f64(peaks[id]), liquidFraction: undefined,
      peakReachedS: peakReachedS(TRACE.tS, peaks[id], recordDefaults.peakReachedWithinK) });
    return {
      tS,
      layers: [series('case'), series('sep'), series('anode')],
      bottomC: f64(peaks.case), topC: f64(peaks.anode), nodeXMm: f64([0, 3]),
      map: ndarray(new Float64Array(tS.length * 2), [tS.length, 2]),
      separator: trace ? { tS: f64(trace.tS), meltMargin: f64(trace.melt), meanLiquid: f64(trace.mean), freezeMargin: f64(trace.freeze), peakMeltMargin: Math.max(...trace.melt), peakMeanLiquid: Math.max(...trace.mean) } : undefined,
      probes: { xMm: [], tS: [], tC: [] },
      energy: { bottomInJ: 0, bottomOutJ: 0, topInJ: 0, topOutJ: 0, sourceJ: 0, storedJ: 0, ...energy },
      warnings: [],
    };
  }
  const flat = (v: number) => TRACE.tS.map(() => v);
  /** Peaks: case 400 °C, sep 420 °C, anode rising to `anodePeak` at 100 s. */
  const peaks = (anodePeak: number) => ({ case: flat(400), sep: flat(420), anode: [20, 300, anodePeak, 450, 400, 300] });

  it('summarize() gives status ok and the window half_frozen_at_s − heat_off_s when every margin is positive', () => {
    const s = summarize(problemOf(), recordOf(peaks(500)));
    expect(s.safe_window_status).toBe('ok');
    assertClose(s.heat_off_s ?? Number.NaN, 100, EXACT, 'heat_off_s');
    assertClose(s.separator.molten_at_s ?? Number.NaN, 25, EXACT, 'molten_at_s');
    assertClose(s.separator.half_frozen_at_s ?? Number.NaN, 175, EXACT, 'half_frozen_at_s');
    assertClose(s.separator.frozen_at_s ?? Number.NaN, 225, EXACT, 'frozen_at_s');
    assertClose(s.safe_window_s ?? Number.NaN, 75, EXACT, 'safe_window_s');
  });

  it('summarize() takes the smallest-margin limit of a layer and the smallest-margin layer as binding', () => {
    const s = summarize(problemOf(), recordOf(peaks(500)));
    const anode = s.layers.anode!;
    // ignition 600 °C − peak 500 °C = 100 K beats melt 650 °C − 500 °C = 150 K; the case has 700 − 400 = 300 K
    expect(anode.limit).toEqual({ kind: 'ignition', at_C: 600 });
    assertClose(anode.margin_K ?? Number.NaN, 100, EXACT, 'anode margin');
    assertClose(anode.peak_C, 500, EXACT, 'anode peak');
    // 300 °C at 50 s, 500 °C at 100 s: within 0.05 K of the peak at 50 + 50·(199.95/200) = 99.9875 s (by hand)
    assertClose(anode.peak_at_s, 99.9875, { abs: 1e-12 }, 'anode peak time');
    assertClose(s.layers.case!.margin_K ?? Number.NaN, 300, EXACT, 'case margin');
    expect(s.layers.sep!.margin_K).toBeNull();
    expect(s.binding_layer).toBe('anode');
    // a hotter case (690 °C: 10 K to softening) takes over as the binding layer
    const hotCase = summarize(problemOf(), recordOf({ ...peaks(500), case: flat(690) }));
    expect(hotCase.binding_layer).toBe('case');
    expect(hotCase.safe_window_status).toBe('ok');
  });

  it('summarize() gives the first time of a peak that lasts, and the first of equally close layers and limits as binding', () => {
    // the case layer holds 400 °C from the start: its peak time is 0 s, not the last time it was there
    const s = summarize(problemOf(), recordOf(peaks(500)));
    assertClose(s.layers.case!.peak_at_s, 0, EXACT, 'case peak time');
    // case at 600 °C (100 K to softening at 700) and anode at 500 °C (100 K to ignition): the lower layer is listed first
    const tie = summarize(problemOf(), recordOf({ ...peaks(500), case: flat(600) }));
    expect(tie.binding_layer).toBe('case');
    // two limits 100 K away (melt 650 °C from a 550 °C peak, and a second melt limit at 650 °C): the first listed binds
    const twin = parseOk(scenario({ duration_s: 1000, materials: { salt: SALT, metal: { ...METAL, limits: [{ kind: 'softening', at_C: 650 }, { kind: 'melt', at_C: 650 }] }, case: CASE },
      layers: [{ id: 'case', material: 'case', thickness_mm: 1 }, { id: 'sep', material: 'salt', thickness_mm: 1, separator: true }, { id: 'anode', material: 'metal', thickness_mm: 1 }],
      bottom: plateUntil(100) }));
    expect(summarize(twin, recordOf(peaks(550))).layers.anode!.limit?.kind).toBe('softening');
  });

  it('summarize() reports limit-crossed and no window when a layer goes past its limit', () => {
    const s = summarize(problemOf(), recordOf(peaks(610)));
    expect(s.safe_window_status).toBe('limit-crossed');
    expect(s.safe_window_s).toBeNull();
    assertClose(s.layers.anode!.margin_K ?? Number.NaN, -10, EXACT, 'anode margin');
    // the event times are still reported: only the window is withheld
    assertClose(s.separator.half_frozen_at_s ?? Number.NaN, 175, EXACT, 'half_frozen_at_s');
  });

  it('summarize() counts a margin of exactly zero as reaching the limit (README verdict table)', () => {
    const s = summarize(problemOf(), recordOf(peaks(600)));
    assertClose(s.layers.anode!.margin_K ?? Number.NaN, 0, EXACT, 'anode margin');
    expect(s.safe_window_status).toBe('limit-crossed');
    expect(s.safe_window_s).toBeNull();
    // a hair below the limit is still ok
    expect(summarize(problemOf(), recordOf(peaks(599.999))).safe_window_status).toBe('ok');
  });

  it('summarize() reports limit-crossed for a layer that is not the separator or the anode', () => {
    const s = summarize(problemOf(), recordOf({ ...peaks(500), case: flat(700) }));
    expect(s.safe_window_status).toBe('limit-crossed');
    expect(s.binding_layer).toBe('case');
  });

  it('summarize() reports never-molten when the separator never becomes fully liquid', () => {
    const s = summarize(problemOf(), recordOf(peaks(500), { ...TRACE, melt: [-1, -0.5, -0.01, -0.5, -1, -3] }));
    expect(s.safe_window_status).toBe('never-molten');
    expect(s.separator.molten_at_s).toBeNull();
    expect(s.safe_window_s).toBeNull();
  });

  it('summarize() puts limit-crossed before never-molten when both hold', () => {
    const s = summarize(problemOf(), recordOf(peaks(650), { ...TRACE, melt: flat(-1) }));
    expect(s.safe_window_status).toBe('limit-crossed');
  });

  it('summarize() reports no-separator when no layer is marked as the separator', () => {
    const s = summarize(problemOf({ separator: false }), recordOf(peaks(500), null));
    expect(s.safe_window_status).toBe('no-separator');
    expect(s.separator).toEqual({ molten_at_s: null, half_frozen_at_s: null, frozen_at_s: null });
    expect(s.safe_window_s).toBeNull();
  });

  it('summarize() reports heat-never-off when the plate is held to the end, and looks for no half-freeze', () => {
    const s = summarize(problemOf({ offS: undefined }), recordOf(peaks(500)));
    expect(s.heat_off_s).toBeNull();
    expect(s.safe_window_status).toBe('heat-never-off');
    expect(s.separator.half_frozen_at_s).toBeNull();
    expect(s.separator.frozen_at_s).toBeNull();
    expect(s.safe_window_s).toBeNull();
  });

  it('summarize() reports still-molten-at-end when the mean liquid fraction stays at or above 0.5 after heat-off', () => {
    const s = summarize(problemOf(), recordOf(peaks(500), { ...TRACE, mean: [0, 1, 1, 0.8, 0.6, 0.5] }));
    expect(s.safe_window_status).toBe('still-molten-at-end');
    expect(s.separator.half_frozen_at_s).toBeNull();
    expect(s.separator.frozen_at_s).toBeNull();
    expect(s.safe_window_s).toBeNull();
  });

  it('summarize() measures the half-freeze from heat-off, not from an earlier dip during heating', () => {
    // the mean liquid fraction dips below 0.5 at 75 s (before heat-off at 100 s is over): half_frozen_at_s ignores it
    const s = summarize(problemOf(), recordOf(peaks(500), { ...TRACE, mean: [0, 1, 0.4, 0.8, 0.2, 0] }));
    assertClose(s.separator.half_frozen_at_s ?? Number.NaN, 175, EXACT, 'half_frozen_at_s');
  });

  it('summarize() adds heat in and out over both faces and the source, and states the imbalance', () => {
    const s = summarize(problemOf(), recordOf(peaks(500), TRACE, { bottomInJ: 1000, bottomOutJ: 100, topInJ: 50, topOutJ: 300, sourceJ: 200, storedJ: 840 }));
    assertClose(s.energy.in_J_m2, 1250, EXACT, 'in');
    assertClose(s.energy.out_J_m2, 400, EXACT, 'out');
    assertClose(s.energy.stored_J_m2, 840, EXACT, 'stored');
    // |840 − (1250 − 400)| / max(1250, 400, 840) = 10 / 1250
    assertClose(s.energy.imbalance_rel, 10 / 1250, { rel: 1e-12 }, 'imbalance');
    const sink = summarize(problemOf(), recordOf(peaks(500), TRACE, { bottomInJ: 500, sourceJ: -200, storedJ: 300 }));
    assertClose(sink.energy.out_J_m2, 200, EXACT, 'a sink counts as heat out');
  });
});

describe('heatInputs() and lastHeatInput()', () => {
  it('lastHeatInput() names the face segment whose start ends the heat, and the source interval otherwise', () => {
    const p = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600,
      bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 900, convection_W_m2K: 6 }],
      source_W_m3: [{ from_s: 0, to_s: 300, value: 1e6 }] }));
    expect(lastHeatInput(p)).toEqual({ kind: 'face', side: 'bottom', segment: 0, next: 1, fromS: 0, endS: 900 });
    expect(heatInputs(p)).toContainEqual({ kind: 'source', layer: 0, interval: 0, fromS: 0, endS: 300 });
    const q = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600,
      bottom: [{ from_s: 0, convection_W_m2K: 6 }], source_W_m3: [{ from_s: 10, to_s: 300, value: 1e6 }] }));
    expect(lastHeatInput(q)).toEqual({ kind: 'source', layer: 0, interval: 0, fromS: 10, endS: 300 });
    expect(lastHeatInput(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 60, bottom: [{ from_s: 0, convection_W_m2K: 6 }] })))).toBeUndefined();
    // a plate and a source that end together: the first found (the face) is named
    const r = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600,
      bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 900, convection_W_m2K: 6 }],
      source_W_m3: [{ from_s: 0, to_s: 900, value: 1e6 }] }));
    expect(lastHeatInput(r)?.kind).toBe('face');
  });
});

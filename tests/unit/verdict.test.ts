// Event times and the end of heating (sim/verdict.ts) on hand-made series and scenarios, against the definitions of
// DESIGN.md ("Result") worked out by hand: linear interpolation between recorded points, never rounding to a step.

import { describe, expect, it } from 'vitest';
import { firstCrossing, heatOffTime } from '../../sim/verdict.ts';
import { assertClose } from '../support/assert-close.ts';
import { PLAIN, parseOk, slab } from '../support/scenarios.ts';
import type { FaceSegmentFile, LayerFile } from '../../sim/scenario-schema.ts';

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

// Goal seeking (sim/study/seek.ts): the smallest convection coefficient that warms a lumped slab to a temperature,
// against the closed form solved for h (Incropera 6th ed. eq. 5.6, see lumped-slab.ts) and against a brute-force scan
// of the same runs; a target that cannot be met; and the search itself on step functions whose answer is known exactly.
import { describe, expect, it } from 'vitest';
import { resolveLeaf, parsePath } from '../../sim/study/scenario-path.ts';
import { scenarioProbe, seek, type Probe } from '../../sim/study/seek.ts';
import { parseTarget, type Target } from '../../sim/study/target.ts';
import { assertClose } from '../support/assert-close.ts';
import { SLAB, hForEndC, slabFile } from './lumped-slab.ts';

const doc = slabFile();
const target = (t: string): Target => { const r = parseTarget(t); if (!r.ok) throw new Error(r.message); return r.value; };
const place = (() => {
  const p = parsePath('top.0.convection_W_m2K');
  const r = p.ok ? resolveLeaf(doc, p.value) : p;
  if (!r.ok) throw new Error(r.message);
  return r.value;
})();

/** A probe from a plain rule, no solver: met where `rule` holds. */
const ruleProbe = (rule: (v: number) => boolean) => (value: number): Probe => ({ value, met: rule(value), reading: value, shortfall: null, summary: null, error: null });

describe('seek() on a lumped slab', () => {
  it('finds the smallest h that warms the slab to 80 °C in 600 s, as the closed form gives', () => {
    const r = seek(scenarioProbe(doc, place, target('layers.slab.peak_C>=80')), { min: 1, max: 20, largest: false, tolerance: 1e-3 });
    expect(r.met).toBe(true);
    expect(r.monotonic).toBe(true);
    // h* = ρcL/t·ln(80/20) = 4.621 W/m²K. Error budget: the final bracket (1e-3) plus the solver's end-temperature
    // error (< 0.02 K) divided by dT/dh there (= 0.3·20 = 6 K per W/m²K), about 0.004; allow 0.01.
    assertClose(r.value!, hForEndC(80), { abs: 0.01 }, 'h meeting peak ≥ 80 °C');
    expect(r.summary!.layers.slab!.peak_C).toBeGreaterThanOrEqual(80);
    expect(r.solves).toBeLessThan(30);
  });

  it('agrees with a brute-force scan of the same runs to within the scan step', () => {
    const probe = scenarioProbe(doc, place, target('layers.slab.peak_C>=70'));
    const step = 0.25;
    let firstMet: number | null = null;
    for (let h = 1; h <= 8 && firstMet === null; h += step) if (probe(h).met) firstMet = h;
    const r = seek(probe, { min: 1, max: 8, largest: false, tolerance: 1e-3 });
    expect(firstMet).not.toBeNull();
    // the scan's first met value is within one step above the true edge; the seek value must lie in that step
    expect(r.value!).toBeGreaterThan(firstMet! - step);
    expect(r.value!).toBeLessThanOrEqual(firstMet! + 1e-3);
  });

  it('says a target above the fluid temperature cannot be met, with the value that came closest', () => {
    const r = seek(scenarioProbe(doc, place, target(`layers.slab.peak_C>=${SLAB.fluidC + 20}`)), { min: 1, max: 20, largest: false });
    expect(r.met).toBe(false);
    expect(r.value).toBeNull();
    // the largest h warms the slab the most: it is the closest miss
    expect(r.best!.value).toBe(20);
    expect(r.summary).not.toBeNull();
  });
});

/** A probe reading f(v) against `reading >= t` (or `>` when strict); null readings are missing verdicts (not met). */
const readingProbe = (f: (v: number) => number | null, t: number, strict = false) => (value: number): Probe => {
  const reading = f(value);
  const met = reading !== null && (strict ? reading > t : reading >= t);
  return { value, met, reading, shortfall: reading === null ? null : t - reading, summary: null, error: null };
};

describe('seek() on a numeric reading', () => {
  it('narrows by the reading\'s slope: the smallest v with v² ≥ 10 is √10, in fewer runs than halving takes', () => {
    const r = seek(readingProbe((v) => v * v, 10), { min: 0, max: 10, largest: false, tolerance: 1e-6 });
    expect(r.met).toBe(true);
    expect(r.value! * r.value!).toBeGreaterThanOrEqual(10); // met by construction
    assertClose(r.value!, Math.sqrt(10), { abs: 1e-6 }, 'smallest v with v² ≥ 10');
    expect(r.bracket).toBeLessThanOrEqual(1e-6);
    // halving the scan's 1.25 to 1e-6 takes ⌈log2(1.25e6)⌉ = 21 runs after the 9 of the scan: 30 in all. Regula falsi
    // with Anderson and Björck's scaling (bracket.ts) takes 16 after the scan (measured)
    expect(r.solves).toBeLessThanOrEqual(9 + 16);
  });

  it('finds the largest value as well: the largest v with −v² ≥ −10', () => {
    const r = seek(readingProbe((v) => -v * v, -10), { min: 0, max: 10, largest: true, tolerance: 1e-6 });
    assertClose(r.value!, Math.sqrt(10), { abs: 1e-6 }, 'largest v with −v² ≥ −10');
    expect(r.value!).toBeLessThanOrEqual(Math.sqrt(10));
    expect(r.solves).toBeLessThanOrEqual(9 + 16);
  });

  it('closes at once on an end that reads exactly the target: v > 5 from the unmet scan point 5, v ≥ 5 from the met one', () => {
    // the scan of 9 values over [0, 10] has 5 itself; bisection would take ⌈log2(1.25e6)⌉ = 21 runs more
    const strict = seek(readingProbe((v) => v, 5, true), { min: 0, max: 10, largest: false, tolerance: 1e-6 });
    expect(strict.value!).toBeGreaterThan(5);
    assertClose(strict.value!, 5, { abs: 1e-6 }, 'smallest v > 5');
    const atLeast = seek(readingProbe((v) => v, 5), { min: 0, max: 10, largest: false, tolerance: 1e-6 });
    expect(atLeast.value!).toBe(5);
    // the secant lands on the end reading the target; the tol/2 guard steps just off it and closes the bracket
    expect([strict.solves, atLeast.solves]).toEqual([9 + 1, 9 + 1]);
  });

  it('keeps to the met side across a stretch where the verdict is missing (null reading, not met)', () => {
    // reading v, but no verdict on (5, 5.95): the bracket [5, 6.25] starts by slope and must cross the gap
    const r = seek(readingProbe((v) => (v > 5 && v < 5.95 ? null : v), 6), { min: 0, max: 10, largest: false, tolerance: 1e-6 });
    assertClose(r.value!, 6, { abs: 1e-6 }, 'smallest v with reading ≥ 6');
    expect(r.value!).toBeGreaterThanOrEqual(6);
  });
});

describe('seek() on known step functions', () => {
  it('bisects to the edge of a single met stretch, smallest and largest', () => {
    const rule = (v: number) => v >= 3.3 && v <= 7.7;
    const small = seek(ruleProbe(rule), { min: 0, max: 10, largest: false, tolerance: 1e-6 });
    const large = seek(ruleProbe(rule), { min: 0, max: 10, largest: true, tolerance: 1e-6 });
    assertClose(small.value!, 3.3, { abs: 1e-6 }, 'smallest'); // the bracket width is the stated tolerance
    assertClose(large.value!, 7.7, { abs: 1e-6 }, 'largest');
    expect(rule(small.value!) && rule(large.value!)).toBe(true);
  });

  it('reports a non-monotonic response with every met stretch the scan saw', () => {
    const rule = (v: number) => (v >= 2.2 && v <= 3.6) || (v >= 6 && v <= 7.2);
    const r = seek(ruleProbe(rule), { min: 0, max: 10, largest: false, scanCount: 11, tolerance: 1e-6 });
    expect(r.monotonic).toBe(false);
    expect(r.met_intervals).toEqual([[3, 3], [6, 7]]);
    assertClose(r.value!, 2.2, { abs: 1e-6 }, 'smallest edge of the first stretch');
  });

  it('returns an end of the range with a zero bracket when the target is met there', () => {
    const r = seek(ruleProbe((v) => v <= 4), { min: 0, max: 10, largest: false });
    expect([r.value, r.bracket, r.solves]).toEqual([0, 0, 9]);
    expect(r.unfinished).toEqual([]);
  });

  it('lists the runs that did not finish, in the order run, and counts them as not meeting the target', () => {
    // runs below 2 stop; the target holds from 5 up: the scan at 0, 1.25, …, 10 has two that stop (0 and 1.25)
    const stopsBelow2 = (value: number): Probe => (value < 2
      ? { value, met: false, reading: null, shortfall: null, summary: null, error: `the run stopped at ${value}` }
      : { value, met: value >= 5, reading: value, shortfall: null, summary: null, error: null });
    const r = seek(stopsBelow2, { min: 0, max: 10, largest: false, tolerance: 1e-6 });
    assertClose(r.value!, 5, { abs: 1e-6 }, 'smallest value meeting the target');
    expect(r.unfinished).toEqual([{ value: 0, error: 'the run stopped at 0' }, { value: 1.25, error: 'the run stopped at 1.25' }]);
    // every run stopping: not met, and every run listed
    const all = seek((value) => ({ value, met: false, reading: null, shortfall: null, summary: null, error: 'stopped' }), { min: 0, max: 10, largest: false });
    expect(all.met).toBe(false);
    expect(all.unfinished).toHaveLength(all.solves);
  });
});

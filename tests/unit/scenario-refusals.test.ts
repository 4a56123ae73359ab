// Refusals that stay short and exact (issue 9, "Refusals stay short", "Bounded resources"; issue 7, "Messages for
// people"): each class of bad input is refused before any computation in one message that names the field, the value
// and the limit, however large the input. The limits are those of sim/scenario/scenario-limits.ts; what the tests hold the
// code to is that the message states the limit in force and the value given, and that nothing grows with the input.

import { describe, expect, it } from 'vitest';
import type { FieldError } from '../../sim/scenario/field-errors.ts';
import { parseScenario, parseScenarioText } from '../../sim/scenario/scenario.ts';
import { scenarioLimitDefaults as LIMIT } from '../../sim/scenario/scenario-limits.ts';
import { PLAIN, scenario } from '../support/scenarios.ts';
import { scenarioFromText } from '../../ui/files.ts';
import { recordDefaults } from '../../sim/observe/record.ts';
import { stepGuardDefaults } from '../../sim/time/step-guards.ts';

type Json = Record<string, unknown>;

/** A valid scenario: a metal layer, a salt separator, a metal layer with a heat source; heated, then cooling. */
function valid(): Json {
  return structuredClone(scenario({
    duration_s: 1200, ambient_C: 20,
    materials: {
      metal: PLAIN,
      salt: { ...PLAIN, melt: { solidus_C: 350, liquidus_C: 354, latent_J_kg: 2e5 } },
    },
    layers: [
      { id: 'base', material: 'metal', thickness_mm: 1 },
      { id: 'sep', material: 'salt', thickness_mm: 1.5, separator: true },
      { id: 'top', material: 'metal', thickness_mm: 2, source_W_m3: [{ from_s: 0, to_s: 60, value: 1e5 }] },
    ],
    bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 600, convection_W_m2K: 6 }],
    top: [{ from_s: 0, convection_W_m2K: 12 }],
    output: { times_s: [300, 900] },
  })) as Json;
}

/** The errors of a scenario that must be refused. */
function refused(input: Json | string): readonly FieldError[] {
  const result = typeof input === 'string' ? parseScenarioText(input) : parseScenario(input);
  expect(result.ok, 'the scenario was accepted').toBe(false);
  return result.ok ? [] : result.errors;
}

/** The single error of a refusal, at the path given. */
function onlyError(input: Json | string, path: string): string {
  const errors = refused(input);
  expect(errors, JSON.stringify(errors)).toHaveLength(1);
  expect(errors[0]!.path).toBe(path);
  return errors[0]!.message;
}

const cut = (layers: Json[]) => layers as unknown as Json[];

describe('parseScenario() refusals', () => {
  it('parseScenario() accepts the base scenario the refusals below break', () => {
    expect(parseScenario(valid()).ok).toBe(true);
  });

  it('parseScenario() lists at most 20 errors, then "and N more", for 2000 output times past the end', () => {
    const s = valid();
    s.output = { times_s: Array.from({ length: 2000 }, (_, i) => 5000 + i) };
    const errors = refused(s);
    expect(errors).toHaveLength(21);
    expect(errors[0]).toEqual({ path: 'output.times_s[0]', message: 'must be within [0, duration_s = 1200], got 5000' });
    expect(errors[20]!.message).toContain('and 1980 more errors');
  });

  it('parseScenario() lists 2000 unknown keys in at most 21 lines', () => {
    const s = valid();
    for (let i = 0; i < 2000; i++) s[`extra_${i}`] = 1;
    const errors = refused(s);
    expect(errors).toHaveLength(21);
    expect(errors[20]!.message).toContain('and 1980 more');
  });

  it('parseScenario() cuts a 100 kB material name and a 100 kB unknown key to a readable length', () => {
    const long = 'x'.repeat(100_000);
    const s = valid();
    (s.layers as Json[])[0]!.material = long;
    const message = onlyError(s, 'layers[0].material');
    expect(message).toContain('(100000 characters)');
    expect(message).toContain(`at most ${LIMIT.maxIdChars} characters`);
    expect(message.length).toBeLessThan(300);
    const k = valid();
    k[long] = 1;
    const errors = refused(k);
    expect(errors[0]!.path.length).toBeLessThan(100);
    expect(errors[0]!.path).toContain('(100000 characters)');
  });

  it('parseScenarioText() refuses a key given twice, naming the key and both lines', () => {
    const text = JSON.stringify(valid(), null, 2).replace('"duration_s": 1200,', '"duration_s": -5,\n  "duration_s": 1200,');
    const line = text.split('\n').findIndex((l) => l.includes('"duration_s": -5')) + 1;
    expect(onlyError(text, 'duration_s')).toContain(`lines ${line} and ${line + 1}`);
  });

  it('parseScenarioText() accepts a UTF-8 byte-order mark and reads the same scenario as without it', () => {
    const text = JSON.stringify(valid());
    const withMark = parseScenarioText(`\uFEFF${text}`);
    expect(withMark.ok).toBe(true);
    expect(withMark).toEqual(parseScenarioText(text));
  });

  it('parseScenarioText() gives the line and column of invalid JSON', () => {
    const text = '{\n  "freezeline": 1,\n  "duration_s": 1200\n  "ambient_C": 20\n}';
    // line 4 starts with two spaces; the key's opening quote is the 3rd character
    expect(onlyError(text, '(file)')).toMatch(/^is not valid JSON: line 4, column 3: .*comma missing/);
  });

  it('parseScenario() refuses a heat source that starts and ends after the run, naming both times', () => {
    const s = valid();
    (s.layers as Json[])[2]!.source_W_m3 = [{ from_s: 5000, to_s: 6000, value: 2e6 }];
    const errors = refused(s);
    expect(errors.map((e) => e.path)).toEqual(['layers[2].source_W_m3[0].from_s', 'layers[2].source_W_m3[0].to_s']);
    expect(errors[0]!.message).toBe('must be ≤ duration_s (1200): the run ends before it, got 5000');
    expect(errors[1]!.message).toContain('got 6000');
  });

  it('parseScenario() refuses a face segment and an output time after the run', () => {
    const s = valid();
    (s.top as Json[]).push({ from_s: 1500, convection_W_m2K: 3 });
    (s.output as Json).times_s = [300, 1300];
    expect(refused(s).map((e) => e.path)).toEqual(['top[1].from_s', 'output.times_s[1]']);
  });

  it('parseScenario() refuses a separator whose material has no melt, naming the layer and the material', () => {
    const s = valid();
    (s.layers as Json[])[0]!.separator = true;
    const message = onlyError(s, 'layers[0].separator');
    expect(message).toContain('layer "base"');
    expect(message).toContain('"metal" has no melt data');
  });

  it('parseScenario() refuses cells: 1e9 in one line naming the limit, without building a grid', () => {
    const s = valid();
    (s.layers as Json[])[1]!.cells = 1e9;
    const message = onlyError(s, 'layers[1].cells');
    expect(message).toContain(`≤ ${LIMIT.maxCells}`);
    expect(message).toContain('got 1000000000');
  });

  it('parseScenario() refuses cells_per_mm: 1e7 by the total it would make, naming the knob, the total and the limit', () => {
    const s = valid();
    s.numerics = { cells_per_mm: 1e7 };
    // 1 mm and 2 mm of metal at 1e7 cells/mm, plus the separator's default 24 cells (16/mm over 1.5 mm)
    const message = onlyError(s, 'numerics.cells_per_mm');
    expect(message).toContain('30000024 cells');
    expect(message).toContain(`limit is ${LIMIT.maxCells} cells`);
  });

  it('parseScenario() refuses a separator cell density that overflows the total, naming the separator knob', () => {
    const s = valid();
    s.numerics = { separator_cells_per_mm: 1e300 };
    expect(onlyError(s, 'numerics.separator_cells_per_mm')).toContain('in layer "sep"');
  });

  it('parseScenario() refuses 100 000 layers in one line, before checking any of them', () => {
    const s = valid();
    s.layers = cut(Array.from({ length: 100_000 }, (_, i) => ({ id: `L${i}`, material: 'metal', thickness_mm: -1 })));
    expect(onlyError(s, 'layers')).toBe(`holds 100000 layers; the limit is ${LIMIT.maxLayers} (scenarioLimitDefaults, sim/scenario/scenario-limits.ts)`);
  });

  it('scenarioLimitDefaults admits no more output times than the recorder keeps exactly (recordDefaults)', () => {
    expect(LIMIT.maxOutputTimes).toBeLessThanOrEqual(recordDefaults.maxOutputTimes);
  });

  it('scenarioLimitDefaults admits no more forced cell-steps than the solver\'s work budget (stepGuardDefaults)', () => {
    expect(LIMIT.maxForcedCellSteps).toBeLessThanOrEqual(stepGuardDefaults.maxCellSteps);
  });

  it('parseScenario() refuses two million output times in one line', () => {
    const s = valid();
    s.output = { times_s: new Array<number>(2_000_000).fill(-1) };
    expect(onlyError(s, 'output.times_s')).toContain(`holds 2000000 output times; the limit is ${LIMIT.maxOutputTimes}`);
  });

  it('parseScenario() refuses every other over-long list in one line each: segments, source intervals, probes, table rows, materials', () => {
    const s = valid();
    const n = (max: number) => max + 1;
    s.top = Array.from({ length: n(LIMIT.maxFaceSegments) }, (_, i) => ({ from_s: i * 1e-3, convection_W_m2K: 5 }));
    (s.layers as Json[])[2]!.source_W_m3 = Array.from({ length: n(LIMIT.maxSourceIntervals) }, (_, i) => ({ from_s: i, to_s: i + 0.5, value: 1 }));
    s.output = { probes_mm: new Array<number>(n(LIMIT.maxProbes)).fill(1) };
    (s.materials as Json).metal = { ...PLAIN, k_W_mK: Array.from({ length: n(LIMIT.maxTableRows) }, (_, i) => [i, 1]) };
    expect(refused(s).map((e) => e.message.replace(/ \(.*$/, ''))).toEqual([
      `holds ${n(LIMIT.maxSourceIntervals)} source intervals; the limit is ${LIMIT.maxSourceIntervals}`,
      `holds ${n(LIMIT.maxFaceSegments)} segments; the limit is ${LIMIT.maxFaceSegments}`,
      `holds ${n(LIMIT.maxProbes)} probe depths; the limit is ${LIMIT.maxProbes}`,
      `holds ${n(LIMIT.maxTableRows)} table rows; the limit is ${LIMIT.maxTableRows}`,
    ]);
    const many = valid();
    many.materials = Object.fromEntries(Array.from({ length: n(LIMIT.maxMaterials) }, (_, i) => [`m${i}`, PLAIN]));
    expect(onlyError(many, 'materials')).toContain(`holds ${n(LIMIT.maxMaterials)} materials; the limit is ${LIMIT.maxMaterials}`);
  });

  it('parseScenario() refuses max_step_s: 1e-9, giving the forced step count, the limit and the smallest step allowed', () => {
    const s = valid();
    s.numerics = { max_step_s: 1e-9 };
    const message = onlyError(s, 'numerics.max_step_s');
    // 1200 s / 1e-9 s = 1.2e12 steps; 1200 s / limit steps is the smallest max_step_s allowed
    expect(message).toContain('1.20e+12 steps');
    expect(message).toContain(`limit is ${LIMIT.maxForcedSteps}`);
    expect(message).toContain(`≥ ${(1200 / LIMIT.maxForcedSteps).toPrecision(3)} s`);
    expect(message).toContain('got 1e-9');
  });

  it('parseScenario() refuses many cells times many forced steps, naming max_step_s', () => {
    const s = valid();
    // 9000 cells (3000 per layer) × 1200 s / 0.05 s = 24 000 steps → 2.16e8 cell-steps, over the limit
    (s.layers as Json[]).forEach((l) => { l.cells = 3000; });
    s.numerics = { max_step_s: 0.05 };
    expect(LIMIT.maxForcedCellSteps).toBeLessThan(9000 * 24_000);
    expect(onlyError(s, 'numerics.max_step_s')).toContain('9000 cells × 24000 forced steps');
  });

  it('parseScenario() refuses tolerances below what double precision can give, naming the limit', () => {
    const s = valid();
    s.numerics = { tolerance_K: 1e-300, liquid_fraction_tolerance: 1e-300 };
    const errors = refused(s);
    expect(errors.map((e) => e.path)).toEqual(['numerics.tolerance_K', 'numerics.liquid_fraction_tolerance']);
    expect(errors[0]!.message).toContain(`≥ ${LIMIT.minToleranceK} K`);
    expect(errors[0]!.message).toContain('got 1e-300');
    expect(errors[1]!.message).toContain(`≥ ${LIMIT.minLiquidFractionTolerance}`);
  });

  it('parseScenario() refuses a duration past the limit and a temperature past the hottest allowed', () => {
    const s = valid();
    s.duration_s = 1e12;
    (s.bottom as Json[])[0] = { from_s: 0, fixed_C: 1e300 };
    const errors = refused(s);
    expect(errors.map((e) => e.path)).toEqual(['duration_s', 'bottom[0].fixed_C']);
    expect(errors[0]!.message).toBe(`must be ≤ ${LIMIT.maxDurationS} s (scenarioLimitDefaults.maxDurationS, about three years), got 1000000000000`);
    expect(errors[1]!.message).toContain(`≤ ${LIMIT.maxTemperatureC} °C`);
  });

  it('scenarioFromText() (the view\'s file loader) refuses the same files as the CLI, in one line naming lines and columns', () => {
    const text = JSON.stringify(valid(), null, 2);
    expect(scenarioFromText('a.json', `\uFEFF${text}`)).toEqual({ ok: true, value: valid() });
    const twice = text.replace('"duration_s": 1200,', '"duration_s": -5,\n  "duration_s": 1200,');
    const dup = scenarioFromText('a.json', twice);
    expect(dup.ok).toBe(false);
    if (!dup.ok) expect(dup.message).toMatch(/^a\.json: duration_s: this key is given twice in the same object \(lines \d+ and \d+\)/);
    const broken = scenarioFromText('b.json', '{\n  "name": "x",\n}');
    expect(broken).toEqual({ ok: false, message: expect.stringMatching(/^b\.json is not valid JSON: line 3, column 1: .*comma after the last entry/) });
    // many duplicates: three named, the rest counted
    const many = `{${Array.from({ length: 10 }, (_, i) => `"k${i}": 1, "k${i}": 2`).join(', ')}}`;
    const capped = scenarioFromText('c.json', many);
    if (!capped.ok) expect(capped.message).toContain('and 7 more errors');
    expect(capped.ok).toBe(false);
  });
});

/**
 * The view's "heat off at" control moves every heat input that ends at heat off (ui/heat-off.ts, by the core's hold
 * knob). The expected field lists and times are read from the example files themselves (their keys and numbers), not
 * from the code under test; heat_off_s is the result contract's "when the last heat input ends" (DESIGN.md).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseScenario, runProblem } from '../../sim/index.ts';
import { heatOffFieldWords, heatOffFields, setHeatOff } from '../../ui/heat-off.ts';
import { fieldsToFill } from '../../ui/incomplete.ts';
import type { JsonObject } from '../../ui/json.ts';
import { getAt } from '../../ui/paths.ts';

const example = (name: string): JsonObject =>
  JSON.parse(readFileSync(new URL(`../../examples/${name}`, import.meta.url), 'utf8')) as JsonObject;

const paths = (found: ReturnType<typeof heatOffFields>): readonly string[] => {
  if ('reason' in found) throw new Error(`no heat-off fields: ${found.reason}`);
  return found.paths;
};

describe('ui/heat-off heatOffFields()', () => {
  // examples/soaked-cloth-cell.json: the plate row ends at bottom[1].from_s = 900, the collector's W/kg interval and
  // the anode's Joule heat both have to_s = 900 (read off the file)
  const soakedFields = ['bottom[1].from_s', 'layers[0].heat_W_kg[0].to_s', 'layers[3].joule.to_s'];

  it('heatOffFields() names the bottom row, the W/kg interval and the Joule heat that all end at 900 s in the soaked-cloth example', () => {
    const draft = example('soaked-cloth-cell.json');
    for (const p of soakedFields) expect(getAt(draft, p)).toBe(900);
    expect([...paths(heatOffFields(draft))].sort()).toEqual([...soakedFields].sort());
  });

  it('moving heat off to 600 s with setHeatOff() moves the run\'s heat_off_s to 600 s; moving the bottom row alone would leave it at 900 s', () => {
    const draft = example('soaked-cloth-cell.json');
    const fields = paths(heatOffFields(draft));
    const bottomOnly = structuredClone(draft);
    setHeatOff(bottomOnly, ['bottom[1].from_s'], 600);
    setHeatOff(draft, fields, 600);
    const moved = parseScenario(draft);
    const partly = parseScenario(bottomOnly);
    if (!moved.ok || !partly.ok) throw new Error('a moved draft was refused');
    // heat off is the end of the last heat input (DESIGN.md): the Joule heat and W/kg still end at 900 s in the partial move
    const runBottomOnly = runProblem(partly.problem, { detail: 'summary' });
    const run = runProblem(moved.problem, { detail: 'summary' });
    if (run.status !== 'ok' || runBottomOnly.status !== 'ok') throw new Error('run failed');
    // exact: heat_off_s is a schedule time copied from the file, not computed
    expect(run.summary.heat_off_s).toBe(600);
    expect(runBottomOnly.summary.heat_off_s).toBe(900);
    // half-frozen is defined after heat off (DESIGN.md), so it follows the earlier removal
    expect(run.summary.separator.half_frozen_at_s).not.toBeNull();
    expect(run.summary.separator.half_frozen_at_s!).toBeGreaterThan(600);
  });

  it('heatOffFields() keeps its list while a half-typed value leaves the draft refused, and while the control is being typed in', () => {
    const draft = example('soaked-cloth-cell.json');
    const fields = paths(heatOffFields(draft));
    // "6" on the way to "600": the anode's Joule heat runs from 300 s, so a to_s of 6 s is refused by the core
    setHeatOff(draft, fields, 6);
    expect(parseScenario(draft).ok).toBe(false);
    expect(paths(heatOffFields(draft, fields))).toEqual(fields);
    setHeatOff(draft, fields, 600);
    expect(paths(heatOffFields(draft, fields, true))).toEqual(fields);
    // a field edited on its own (the bottom row's start typed in its row) breaks the group: the core's list is read again
    setHeatOff(draft, ['bottom[1].from_s'], 1200);
    expect(paths(heatOffFields(draft, fields))).toEqual(['bottom[1].from_s']);
  });

  it('heatOffFields() lists a pellet ending at heat off apart and never as a field to move', () => {
    const draft = example('soaked-cloth-cell.json');
    // a pellet lit at 898 s burning 2 s ends at 900 s with the others (README: pellet.from_s + burn_s)
    (draft.layers as JsonObject[])[1]!.pellet = { KClO4_fraction: 0.16, burn_s: 2, from_s: 898 };
    const found = heatOffFields(draft);
    if ('reason' in found) throw new Error(found.reason);
    expect(found.pellets).toEqual(['cathode']);
    expect(found.paths.some((p) => p.includes('pellet'))).toBe(false);
    expect([...found.paths].sort()).toEqual([...soakedFields].sort());
  });

  it('heatOffFields() gives the core\'s reason when the heat lasts to the end of the run and no bottom row ends it', () => {
    const draft = example('soaked-cloth-cell.json');
    draft.bottom = [{ from_s: 0, plate: { temperature_C: 420, conductance_W_m2K: 800 } }];
    const found = heatOffFields(draft);
    expect('reason' in found && found.reason).toMatch(/lasts to the end of the run/);
  });

  it('heatOffFieldWords() names each field by its row or layer id, as the control\'s note prints it', () => {
    const draft = example('soaked-cloth-cell.json');
    expect(soakedFields.map((p) => heatOffFieldWords(draft, p))).toEqual(['bottom row 2 start', 'collector W/kg heat 1 end', 'anode Joule heat end']);
  });
});

describe('ui/incomplete fieldsToFill() and side-wall losses', () => {
  it('fieldsToFill() asks for the emissivity of side walls just switched on and for the material and thickness of a new sleeve', () => {
    // the edges key requires emissivity, and a sleeve its material and thickness_mm (README, edges table)
    const draft = example('bench-coupon.json');
    draft.edges = { loss: true, convection_W_m2K: 'natural' };
    expect(fieldsToFill(draft)).toEqual(['edges.emissivity']);
    draft.edges = { loss: true, emissivity: 0.7, sleeve: {} };
    expect(fieldsToFill(draft)).toEqual(['edges.sleeve.material', 'edges.sleeve.thickness_mm']);
    // the example file with edges on has nothing left to fill in
    expect(fieldsToFill(example('sleeved-square-cell.json'))).toEqual([]);
  });
});

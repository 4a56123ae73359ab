// Layer ids are the user's own strings and key the summary and the series. Whatever the id, it must come out as an
// ordinary key: "__proto__" written as `obj[id] = v` would set the object's prototype and drop the layer silently.
import { describe, expect, it } from 'vitest';
import { resultDocument } from '../../sim/observe/result.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';

describe('layer ids in the result', () => {
  it('summarize() and resultDocument() keep every layer id as an own key, "__proto__" and "constructor" included', () => {
    const parsed = parseScenario({
      freezeline: 1, ambient_C: 20, initial_C: 400, duration_s: 300,
      layers: [
        { id: '__proto__', material: 'nickel', thickness_mm: 1 },
        { id: 'constructor', material: 'licl-kcl-eutectic', thickness_mm: 1, separator: true },
      ],
      bottom: [{ from_s: 0, convection_W_m2K: 10 }], top: [{ from_s: 0, convection_W_m2K: 10 }],
    });
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    const out = runProblem(parsed.problem);
    if (out.status !== 'ok') throw new Error(out.status);
    const doc = JSON.parse(JSON.stringify(resultDocument(out.problem, out.grid, out.record, out.summary, out.stats)));
    expect(Object.keys(doc.summary.layers)).toEqual(['__proto__', 'constructor']);
    expect(Object.keys(doc.series.layers)).toEqual(['__proto__', 'constructor']);
    expect(Object.getPrototypeOf(out.summary.layers)).toBe(Object.prototype);
    expect(doc.series.layers.constructor.liquid_fraction).toHaveLength(out.record.tS.length);
  });
});

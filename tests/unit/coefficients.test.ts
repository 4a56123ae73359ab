// The coefficient trace (sim/observe/coefficients.ts; `run --coefficients`, the result's `coefficients`): every
// number the solver used is listed with a source, and a library number carries the library file's own source text.
// Checked against the material files read straight from disk (materials/*.json) and against hand computation.
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { coefficientTrace, FROM_FILE } from '../../sim/observe/coefficients.ts';
import { resultDocument } from '../../sim/observe/result.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';
import type { Problem } from '../../sim/physics/problem.ts';

const examples = new URL('../../examples/', import.meta.url);
const materials = new URL('../../materials/', import.meta.url);
const files = readdirSync(examples).filter((f) => f.endsWith('.json')).sort();

function problemOf(file: string): Problem {
  const parsed = parseScenarioText(readFileSync(new URL(file, examples), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('; '));
  return parsed.problem;
}

const find = (trace: ReturnType<typeof coefficientTrace>, what: string) => {
  const hit = trace.find((c) => c.what === what);
  if (!hit) throw new Error(`no coefficient "${what}" in: ${trace.map((c) => c.what).join(' | ')}`);
  return hit;
};

describe('coefficientTrace()', () => {
  it.each(files)('gives every coefficient of %s a value and a source, with no missing number written as text', (file) => {
    const trace = coefficientTrace(problemOf(file));
    expect(trace.length).toBeGreaterThan(10);
    for (const c of trace) {
      expect(c.what.length * c.value.length * c.source.length).toBeGreaterThan(0);
      expect(`${c.value} ${c.source}`).not.toMatch(/NaN|undefined|Infinity|—/);
    }
  });

  it.each(files)('quotes the library file\'s own source for each library property of %s', (file) => {
    const problem = problemOf(file);
    const trace = coefficientTrace(problem);
    for (const layer of problem.layers) {
      if (!layer.material.from?.startsWith('materials/')) continue;
      const json = JSON.parse(readFileSync(new URL(`${layer.material.name}.json`, materials), 'utf8'));
      const where = `layer ${layer.id}${layer.separator ? ' (separator)' : ''}`;
      expect(find(trace, `${where}: material`).source).toBe(`materials/${layer.material.name}.json`);
      const rho = find(trace, `${where}: density ρ`);
      expect(rho.value).toBe(`${json.rho_kg_m3} kg/m³`);
      expect(rho.source).toBe(json.sources.rho_kg_m3);
      expect(find(trace, `${where}: conductivity k(T)`).source).toBe(json.sources.k_W_mK);
      if (json.melt) expect(find(trace, `${where}: melt (solidus, liquidus, latent heat)`).source).toBe(json.sources.melt);
    }
  });

  it('names the natural-convection correlations and L = A/P of a 25 mm disc: 25/4 = 6.25 mm (Goldstein, Sparrow & Jones 1973)', () => {
    const trace = coefficientTrace(problemOf('bench-coupon.json'));
    const nc = trace.filter((c) => c.what.includes('natural convection'));
    expect(nc.length).toBeGreaterThan(0);
    for (const c of nc) {
      expect(c.value).toContain('L = A/P = 6.25 mm');
      expect(c.source).toContain('Raithby & Hollands');
    }
    expect(trace.some((c) => c.what.startsWith('air properties'))).toBe(true);
  });

  it('traces the side-wall loss to Churchill & Chu and the sleeve to the shell conduction formula (sleeved-square-cell.json)', () => {
    const trace = coefficientTrace(problemOf('sleeved-square-cell.json'));
    // P/A of a 30 × 30 mm square: 4·0.03 / 0.03² = 133.3 1/m (hand computation)
    expect(find(trace, 'layer cup: side-wall loss, perimeter/area').value).toBe('133.333 1/m');
    expect(trace.some((c) => c.source.includes('Churchill & Chu'))).toBe(true);
    expect(trace.some((c) => c.what.endsWith('side sleeve'))).toBe(true);
  });

  it('gives the heater power over the footprint: 150 W on a 25 mm disc is 150/(π·0.0125²) = 305 577 W/m² (heater-plate-lift-off.json)', () => {
    const trace = coefficientTrace(problemOf('heater-plate-lift-off.json'));
    const power = find(trace, 'bottom face from 0 s: heater power limit');
    expect(power.value).toBe('150 W (305577 W/m² over the footprint)');
    expect(power.source).toBe(FROM_FILE);
    expect(find(trace, 'bottom face from 0 s: heater control').value).toMatch(/^on-off with a \d+(\.\d+)? K band, sensing /);
  });

  it('is the result document\'s coefficients key', () => {
    const problem = problemOf('bench-coupon.json');
    const out = runProblem(problem);
    if (out.status !== 'ok') throw new Error(out.status);
    expect(resultDocument(problem, out.grid, out.record, out.summary, out.stats).coefficients).toEqual(coefficientTrace(problem));
  });
});

// Reproducers of the failure classes the fuzz suite and a sweep of random scenarios met, each kept with the property
// it broke: a thin layer under a held face, tiny and zero latent heat, a steep k(T), a long run's memory, heat drawn
// beyond what the stack holds, and the energy ledger at rest. Scenarios are invented; the references are closed forms
// (named beside each check) or the same scenario without the feature under test (a cost parity, not a value).

import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { recordDefaults } from '../../sim/observe/record.ts';
import type { InlineMaterialFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { checkScenario } from '../fuzz/check.ts';
import { assertClose } from '../support/assert-close.ts';
import { drainedSlab, drainedSlabZeroKelvinS, parseOk, runOk, scenario } from '../support/scenarios.ts';
import { runProblem, stopSentence } from '../../sim/run.ts';

const salt = (latent: number, solidus = 350, liquidus = 354): InlineMaterialFile =>
  ({ k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1100, melt: { solidus_C: solidus, liquidus_C: liquidus, latent_J_kg: latent } });

/** A separator heated on a plate until 900 s, then left in still air: the demo's shape with an invented salt. */
const heatedSeparator = (material: InlineMaterialFile, plateC = 450): ScenarioFile => scenario({
  duration_s: 3600,
  materials: { s: material },
  layers: [{ id: 'sep', material: 's', thickness_mm: 1.5, ...(material.melt ? { separator: true } : {}) }],
  bottom: [{ from_s: 0, plate: { temperature_C: plateC, conductance_W_m2K: 500 } }, { from_s: 900, convection_W_m2K: 10 }],
  top: [{ from_s: 0, convection_W_m2K: 10 }],
});

describe('thin layer under a held face', () => {
  const thinUnderHeldFace = (duration: number, fromS: number): ScenarioFile => scenario({
    duration_s: duration, materials: {},
    layers: [{ id: 'base', material: 'alumina', thickness_mm: 5 }, { id: 'foil', material: 'nickel', thickness_mm: 0.001 }],
    top: fromS === 0 ? [{ from_s: 0, fixed_C: 600 }] : [{ from_s: 0, convection_W_m2K: 10 }, { from_s: fromS, fixed_C: 600 }],
  });

  it.each([[3600, 0], [1000, 0], [3600, 1000]])('runProblem() finishes a 1 µm nickel foil under a face held at 600 °C (run %i s, held from %i s)', (duration, fromS) => {
    // this stopped at t = 0 with "time step fell below 3.6e-9 s" when the smallest step was a share of the duration
    const out = runOk(thinUnderHeldFace(duration, fromS));
    expect(out.summary.energy.imbalance_rel).toBeLessThan(1e-12);
    expect(out.stats.steps + out.stats.rejected).toBeLessThan(2000);
  });
});

describe('tiny and zero latent heat', () => {
  it('an isothermal melt with zero latent heat gives finite event times', () => {
    const { summary } = runOk(heatedSeparator(salt(0, 350, 350)));
    for (const t of [summary.separator.molten_at_s, summary.separator.half_frozen_at_s, summary.separator.frozen_at_s]) {
      expect(Number.isFinite(t)).toBe(true);
    }
  });

  it.each([1e-6, 1e-3, 0])('a latent heat of %f J/kg costs no more steps than no melt at all, within a tenth', (latent) => {
    const plain = runOk(heatedSeparator({ k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1100 }));
    const tiny = runOk(heatedSeparator(salt(latent)));
    const attempts = (o: typeof plain) => o.stats.steps + o.stats.rejected;
    // the melt still adds its two kinks of T(H), crossed twice; 10 % and 10 attempts leave room for that
    expect(attempts(tiny)).toBeLessThanOrEqual(1.1 * attempts(plain) + 10);
  });

  it('a melting material whose melt is never reached costs what the same material without a melt costs', () => {
    const plain = runOk(heatedSeparator({ k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1100 }, 300));
    const never = runOk(heatedSeparator(salt(1e-3), 300));
    expect(never.summary.separator.molten_at_s).toBeNull();
    expect(never.stats.steps + never.stats.rejected).toBeLessThanOrEqual(1.1 * (plain.stats.steps + plain.stats.rejected) + 10);
  });
});

describe('steep k(T)', () => {
  it('a conductivity that rises ×130 over 50 K next to a 1068 °C plate finishes in a few hundred steps', () => {
    const out = runOk(scenario({
      duration_s: 3600,
      materials: { k: { k_W_mK: [[1000, 0.3], [1050, 39]], rho_kg_m3: 3000, cp_J_kgK: 900 } },
      layers: [{ id: 'a', material: 'k', thickness_mm: 2 }, { id: 'b', material: 'nickel', thickness_mm: 1 }],
      bottom: [{ from_s: 0, plate: { temperature_C: 1068, conductance_W_m2K: 2000 } }],
      top: [{ from_s: 0, convection_W_m2K: 10, emissivity: 0.5 }],
    }));
    // before dk/dT entered the Jacobian this took 1.97 million steps; a smooth run of this length takes ~300
    expect(out.stats.steps + out.stats.rejected).toBeLessThan(2000);
  });
});

describe('bounded memory', () => {
  it('a run of 100 000 steps keeps at most the row budget in its record, the last row at the end of the run', () => {
    const out = runOk(scenario({
      duration_s: 1e7, materials: {}, layers: [{ id: 'a', material: 'nickel', thickness_mm: 2 }],
      bottom: [{ from_s: 0, flux_W_m2: 5000 }], top: [{ from_s: 0, convection_W_m2K: 10 }], numerics: { max_step_s: 100 },
    }));
    expect(out.stats.steps).toBeGreaterThanOrEqual(1e5);
    expect(out.record.tS.length).toBeLessThanOrEqual(recordDefaults.seriesPoints + 3);
    expect(out.record.tS[out.record.tS.length - 1]).toBe(1e7);
  });
});

describe('heat drawn beyond what the stack holds', () => {
  it('runProblem() stops a slab drained by a constant flux when its face reaches 0 K, at the time of the closed form', () => {
    // the closed form t* = ρcL·(T₀ − qL/(3k))/q of the quasi-steady parabola: tests/support/scenarios.ts drainedSlab()
    const problem = parseOk(drainedSlab(3600));
    const out = runProblem(problem);
    expect(out.status).toBe('failed');
    if (out.status !== 'failed') return;
    expect(out.message).toMatch(/^the heat drawn from the bottom face exceeds what the stack holds: its temperature would fall below absolute zero at t = /);
    expect(out.reason).toBe('physical');
    expect(stopSentence(out)).toBe(`the run stopped: ${out.message}`);
    const exact = drainedSlabZeroKelvinS();
    // the stop time is interpolated linearly inside one step, and the steps here are a few seconds: 1 %
    assertClose(out.tS, exact, { rel: 1e-2 }, 'time the bottom face reaches 0 K, s');
  });
});

describe('energy ledger at rest', () => {
  it('a stack at the ambient temperature reports an imbalance of exactly 0, not rounding over a vanishing scale', () => {
    const { summary } = runOk(scenario({
      duration_s: 3600, materials: {}, layers: [{ id: 'a', material: 'nickel', thickness_mm: 2 }],
      bottom: [{ from_s: 0, convection_W_m2K: 10 }], top: [{ from_s: 0, convection_W_m2K: 10, emissivity: 0.5 }],
    }));
    expect(summary.energy).toEqual({ in_J_m2: 0, out_J_m2: 0, stored_J_m2: 0, imbalance_rel: 0 });
  });
});

describe('the face named when the stack would fall below absolute zero', () => {
  it('runProblem() names the face that draws heat at 0 K, not a face held at a temperature', () => {
    const file = new URL('./fuzz/below-absolute-zero-names-face-70.json', import.meta.url);
    const kept = JSON.parse(readFileSync(file, 'utf8')) as { scenario: ScenarioFile };
    // by hand: the top face's imposed terms draw 1000 W/m² + 50 W / (π·(11.6 mm)²/4 = 1.06e-4 m²) ≈ 474 kW/m² whatever
    // its temperature; the bottom face is held at −60 °C and can cool nothing below that
    const out = runProblem(parseOk(kept.scenario));
    expect(out.status).toBe('failed');
    if (out.status !== 'failed') return;
    expect(out.message).toMatch(/^the heat drawn from the top face exceeds what the stack holds/);
    expect(out.reason).toBe('physical');
  });
});

describe('scenarios found by the fuzz suite', () => {
  const dir = new URL('./fuzz/', import.meta.url);
  const files = readdirSync(dir).filter((f) => f.endsWith('.json'));
  it.each(files)('%s finishes or stops with a physical message, with every fuzz property holding', (file) => {
    const kept = JSON.parse(readFileSync(new URL(file, dir), 'utf8')) as { scenario: ScenarioFile };
    const outcome = checkScenario(kept.scenario);
    expect(outcome.kind, outcome.message).toMatch(/^(finished|stopped)$/);
  });
});

/**
 * The salt-soaked separator as a material kind in the view (ui/composite-editor.ts): a layer turned into a porous
 * matrix filled with a salt writes the scenario's `composite` entry, shows the effective properties the core computes,
 * and runs; a file that holds one (examples/soaked-cloth-cell.json) opens with the panel filled in.
 *
 * Expected values are hand computations from the library's own numbers (materials/magnesia.json, licl-kcl-eutectic.json):
 *   ρ = (1 − φ)·ρ_m + φ·ρ_s (volume weighting), L = L_s·φρ_s/ρ (the salt's mass fraction), and for two phases the
 *   effective-medium conductivity in closed form (Landauer, J. Appl. Phys. 23 (1952) 779 — citation from memory; the rule as in sim/physics/composite.ts):
 *   k = ¼·[(3v₁ − 1)k₁ + (3v₂ − 1)k₂ + √(((3v₁ − 1)k₁ + (3v₂ − 1)k₂)² + 8k₁k₂)].
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { assertClose } from '../support/assert-close.ts';
import { artifacts, freshPage, repoRoot, runCount, startHarness, text, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const library = (name: string) => JSON.parse(readFileSync(`${repoRoot}materials/${name}.json`, 'utf8')) as {
  rho_kg_m3: number; k_W_mK: number | [number, number][]; melt?: { solidus_C: number; latent_J_kg: number };
};

/** A library table [[T_C, v], …] read linearly between rows (the format's rule, DESIGN.md "Scenario file"). */
function tableAt(rows: [number, number][], tC: number): number {
  for (let j = 1; j < rows.length; j++) {
    const [t0, v0] = rows[j - 1]!;
    const [t1, v1] = rows[j]!;
    if (tC <= t1) return v0 + ((v1 - v0) * (tC - t0)) / (t1 - t0);
  }
  return rows[rows.length - 1]![1];
}

/** Landauer's two-component effective-medium conductivity. */
function landauer(v1: number, k1: number, k2: number): number {
  const b = (3 * v1 - 1) * k1 + (3 * (1 - v1) - 1) * k2;
  return (b + Math.sqrt(b * b + 8 * k1 * k2)) / 4;
}

/** The number at the start of a printed value ("2614 kg/m³" → 2614). */
const leading = (s: string): number => Number(/^-?\d+(?:\.\d+)?/.exec(s.trim())?.[0] ?? Number.NaN);

const NEW_COMPOSITE = '(new salt-soaked matrix)';
const MIXTURE = '(LiCl–KCl by composition)';

async function value(page: Page, testid: string): Promise<string> {
  return page.$eval(`[data-testid="${testid}"]`, (e) => (e as HTMLInputElement | HTMLSelectElement).value);
}

describe('salt-soaked matrix in the stack editor', () => {
  it('a layer made a salt-soaked matrix shows the effective ρ, k and latent heat of its rules, saves the composite entry and computes', async () => {
    const page = await freshPage(harness);
    let before = await runCount(page);
    await page.selectOption('[data-testid="layer-material-1"]', NEW_COMPOSITE);
    before = await waitForDone(page, before);
    await page.selectOption('[data-testid="composite-matrix-1"]', 'magnesia');
    before = await waitForDone(page, before);
    await page.selectOption('[data-testid="composite-salt-1"]', 'licl-kcl-eutectic');
    await page.fill('[data-testid="composite-porosity-1"]', '0.5');
    await waitForDone(page, before);

    const mgo = library('magnesia');
    const salt = library('licl-kcl-eutectic');
    const phi = 0.5;
    const rho = (1 - phi) * mgo.rho_kg_m3 + phi * salt.rho_kg_m3;
    const latent = (salt.melt!.latent_J_kg * phi * salt.rho_kg_m3) / rho;
    // printed to 4 significant figures (2614 kg/m³) and 3 (66.8 kJ/kg): half the last digit
    assertClose(leading(await text(page, 'composite-rho-1')), rho, { abs: 0.5 }, 'effective density, kg/m³');
    assertClose(leading(await text(page, 'composite-latent-1')) * 1000, latent, { abs: 50 }, 'effective latent heat, J/kg');

    // k of the matrix at the salt's melting point (its table is linear between rows); the salt's solid and liquid k
    // are its table's rows on either side of the melt. Tolerance: half the printed digit (0.005) plus the shift from
    // reading the matrix 0.5 K off the melting point (its slope is 0.053 W/(m·K²): under 0.03 in k_m, ≤ 0.01 in k).
    const kMatrix = tableAt(mgo.k_W_mK as [number, number][], salt.melt!.solidus_C);
    const saltRows = salt.k_W_mK as [number, number][];
    const kSolid = landauer(1 - phi, kMatrix, saltRows[0]![1]);
    const kLiquid = landauer(1 - phi, kMatrix, saltRows[saltRows.length - 1]![1]);
    assertClose(leading(await text(page, 'composite-k-solid-1')), kSolid, { abs: 0.02 }, 'k with the salt solid, W/(m·K)');
    assertClose(leading(await text(page, 'composite-k-liquid-1')), kLiquid, { abs: 0.02 }, 'k with the salt liquid, W/(m·K)');
    // both lie between the series and parallel bounds of the two phases (a bound pair, whatever the rule)
    const solid = leading(await text(page, 'composite-k-solid-1'));
    expect(solid).toBeGreaterThan(1 / ((1 - phi) / kMatrix + phi / saltRows[0]![1]));
    expect(solid).toBeLessThan((1 - phi) * kMatrix + phi * saltRows[0]![1]);
    expect(await text(page, 'composite-melt-1')).toBe(`${salt.melt!.solidus_C.toFixed(1)} °C`);

    // the run used it: the separator (layer 1 of the demo) became fully molten and the result names the time
    expect(Number.isFinite(leading(await text(page, 'verdict-molten-at')))).toBe(true);
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid="save-json"]')]);
    await download.saveAs(`${artifacts}/composite-saved.json`);
    const saved = JSON.parse(readFileSync(`${artifacts}/composite-saved.json`, 'utf8')) as {
      layers: { material: string }[]; materials: Record<string, { composite?: unknown }>;
    };
    const name = saved.layers[1]!.material;
    expect(saved.materials[name]).toEqual({ composite: { matrix: 'magnesia', salt: 'licl-kcl-eutectic', porosity: 0.5 } });
    await page.screenshot({ path: `${artifacts}/composite-editor.png`, fullPage: false });
    await page.context().close();
  });

  it('a LiCl–KCl mixture keeps KCl = 1 − LiCl and melts from the eutectic up to a liquidus above it', async () => {
    const page = await freshPage(harness);
    let before = await runCount(page);
    await page.selectOption('[data-testid="layer-material-1"]', NEW_COMPOSITE);
    before = await waitForDone(page, before);
    await page.selectOption('[data-testid="composite-salt-1"]', MIXTURE);
    before = await waitForDone(page, before);
    await page.fill('[data-testid="composite-licl-1"]', '0.7');
    await waitForDone(page, before);
    expect(await page.textContent('.composite-kcl')).toBe('KCl 0.3');
    // the LiCl–KCl eutectic is 352 °C (Sandia, as cited in materials/licl-kcl-eutectic.json); 70 mol % LiCl lies on the
    // LiCl-rich side, so it melts over a range that starts there
    const melt = await text(page, 'composite-melt-1');
    const m = /^([\d.]+) °C to ([\d.]+) °C$/.exec(melt);
    expect(m, melt).not.toBeNull();
    assertClose(Number(m![1]), 352, { abs: 0.05 }, 'solidus, °C (printed to 0.1 °C)');
    expect(Number(m![2])).toBeGreaterThan(352);
    await page.context().close();
  });

  it('loading examples/soaked-cloth-cell.json shows its separator as a salt-soaked matrix, filled in', async () => {
    const page = await freshPage(harness);
    const before = await runCount(page);
    await page.setInputFiles('[data-testid="load-json"]', `${repoRoot}examples/soaked-cloth-cell.json`);
    await waitForDone(page, before, 60_000);
    // the separator is layer 2 of the file (collector, cathode, separator, anode)
    expect(await value(page, 'composite-matrix-2')).toBe('e-glass');
    expect(await value(page, 'composite-salt-2')).toBe(MIXTURE);
    expect(await value(page, 'composite-licl-2')).toBe('0.44');
    expect(await value(page, 'composite-basis-2')).toBe('mass');
    expect(await value(page, 'composite-porosity-2')).toBe('0.6');
    expect(await value(page, 'composite-fill-2')).toBe('0.95');
    expect(await page.textContent('[data-testid="composite-2"] .composite-kcl')).toBe('KCl 0.56');
    expect(leading(await text(page, 'composite-rho-2'))).toBeGreaterThan(0);
    await page.locator('[data-testid="composite-2"]').screenshot({ path: `${artifacts}/composite-example.png` });
    await page.context().close();
  });
});

// The ripple an on-off relay sends into the stack (sim/time/relay-ripple.ts), which decides whether a relay slower
// than the fast rule's 0.1 s cycles is held in its band (time/plates.ts, heldThermostatDefaults.heldQuietWithinS).
// Checked against
// - the periodic steady state of a semi-infinite solid whose surface meets an oscillating plate through a contact
//   conductance G_c, a closed form (Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed. 1959, §2.6: the method of
//   complex temperatures; with a surface conductance the surface amplitude is A·G_c/|G_c + e·√(iω)|, e = √(kρc_p) the
//   effusivity, √i = (1 + i)/√2);
// - the face node alone when every cell is on an isothermal plateau (no cell can store a ripple): the two
//   conductances in series, A·G_c/(G_c + G₀);
// - the relay followed switch by switch (holdFastThermostats: false), on a rig whose relay switches every 0.15 s
//   behind a weak contact (fuzz body seed 37 case 209, tests/regressions/fuzz/thermostat-chatter-209.json).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createWorkspace, evaluate } from '../../sim/grid/discretization.ts';
import { buildGrid } from '../../sim/grid/mesh.ts';
import { heldThermostatDefaults as HELD } from '../../sim/physics/heater.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { initialState } from '../../sim/time/evolve.ts';
import { createRippleScratch, rippleInStackK, sawtoothFundamentalK } from '../../sim/time/relay-ripple.ts';
import { assertClose } from '../support/assert-close.ts';
import { observedOrder, parseOk, runOk, slab } from '../support/scenarios.ts';

/** The largest ripple amplitude over the nodes of a one-layer stack in its initial state, K. */
function ripple(file: ScenarioFile, side: 0 | 1, contact: number, amplitudeK: number, periodS: number): number {
  const problem = parseOk(file);
  const grid = buildGrid(problem);
  const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
  const U = new Float64Array(grid.n + 2);
  initialState(problem, grid, U);
  evaluate(ws, U, { bottom: { kind: 'fixed', tK: problem.initialK }, top: { kind: 'fixed', tK: problem.initialK }, source: new Float64Array(grid.n) });
  return rippleInStackK(ws, side, contact, amplitudeK, periodS, createRippleScratch(grid.n + 2));
}

describe('rippleInStackK(): the relay\'s ripple in the linear periodic regime', () => {
  // an invented steel-like slab, 20 mm: k = 20 W/m·K, ρ = 8000 kg/m³, c_p = 500 J/kg·K (α = 5e-6 m²/s); at P = 1 s the
  // penetration depth √(2α/ω) is 1.26 mm, so 20 mm is semi-infinite to e^−16; 2000 cells of 10 µm resolve it
  const steel = slab({ name: 'semi-infinite', duration_s: 10, thickness_mm: 20, initial_C: 300,
    material: { k_W_mK: 20, rho_kg_m3: 8000, cp_J_kgK: 500 } });
  const withCells = (cells: number): ScenarioFile => ({ ...steel, layers: [{ ...steel.layers[0]!, cells }] });
  const semiInfinite = withCells(2000);
  const G_C = 5000;
  const A = 1;
  const P = 1;

  const e = Math.sqrt(20 * 8000 * 500);
  const r = e * Math.sqrt(Math.PI / P); // e·√(ω/2)
  const exact = (A * G_C) / Math.hypot(G_C + r, r);

  it('gives the surface amplitude of a semi-infinite solid behind a contact, A·G_c/|G_c + e·√(iω)|', () => {
    // the semi-discrete grid's error, second order in Δx/δ (δ/Δx = 126 here): measured 4.2e-7
    assertClose(ripple(semiInfinite, 0, G_C, A, P), exact, { rel: 2e-6 }, 'largest amplitude (the face), K');
  });

  it('converges to it at second order in the cell width', () => {
    // measured: 6.8e-6, 1.7e-6, 4.2e-7 at 500, 1000, 2000 cells
    const cells = [500, 1000, 2000];
    const errors = cells.map((n) => Math.abs(ripple(withCells(n), 0, G_C, A, P) - exact));
    assertClose(observedOrder(cells.map((n) => 1 / n), errors), 2, { abs: 0.1 }, 'observed order');
  });

  it('is the same from the top face as from the bottom face of a uniform slab', () => {
    assertClose(ripple(semiInfinite, 1, G_C, A, P), ripple(semiInfinite, 0, G_C, A, P), { rel: 1e-12 }, 'top against bottom');
  });

  it('stops at cells on an isothermal plateau: only the face swings, by A·G_c/(G_c + G₀)', () => {
    // an invented salt with an isothermal melt at 400 °C, every cell set halfway through its latent heat
    const salt = slab({ name: 'plateau', duration_s: 10, thickness_mm: 2, initial_C: 300,
      material: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1000, melt: { solidus_C: 400, liquidus_C: 400, latent_J_kg: 2e5 } } });
    const problem = parseOk(salt);
    const grid = buildGrid(problem);
    const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
    const melt = grid.materials[0]!.melt!;
    const U = new Float64Array(grid.n + 2).fill(problem.initialK);
    for (let i = 0; i < grid.n; i++) U[i + 1] = 0.5 * (melt.hSolidus + melt.hLiquidus);
    evaluate(ws, U, { bottom: { kind: 'fixed', tK: 673.15 }, top: { kind: 'fixed', tK: 673.15 }, source: new Float64Array(grid.n) });
    expect(ws.tau[1]).toBe(0);
    const g0 = ws.G[0]!;
    assertClose(rippleInStackK(ws, 0, G_C, A, P, createRippleScratch(grid.n + 2)), (A * G_C) / (G_C + g0), { rel: 1e-12 }, 'face amplitude, K');
  });

  it('sawtoothFundamentalK() is the first Fourier term of a triangle wave: 4Δ/π²', () => {
    // a triangle wave of peak-to-peak Δ: (4Δ/π²)·Σ cos((2k+1)ωt)/(2k+1)², which at t = 0 sums to Δ/2 (Σ 1/(2k+1)² = π²/8)
    let sum = 0;
    for (let k = 0; k < 100_000; k++) sum += sawtoothFundamentalK(2) / (2 * k + 1) ** 2;
    assertClose(sum, 1, { rel: 1e-5 }, 'the series at its peak: half the peak-to-peak');
  });
});

describe('a relay whose ripple in the stack is small is held (heldQuietWithinS)', () => {
  const kept = JSON.parse(readFileSync(new URL('../regressions/fuzz/thermostat-chatter-209.json', import.meta.url), 'utf8')) as { scenario: ScenarioFile };
  /** The rig for `durationS`, heated to its first set-point only (the schedule's later points and the bench are past it). */
  const rig = (durationS: number, contact?: number): ScenarioFile => {
    const file = structuredClone(kept.scenario) as ScenarioFile & { bottom: { heater: { set_points: unknown[]; contact_W_m2K: number } }[] };
    file.duration_s = durationS;
    file.bottom = [file.bottom[0]!];
    const heater = file.bottom[0]!.heater;
    heater.set_points = heater.set_points.slice(0, 1);
    if (contact !== undefined) heater.contact_W_m2K = contact;
    return file;
  };

  it('runProblem() holds a relay switching every 0.15 s behind a 114 W/m²K contact, and agrees with it followed switch by switch', () => {
    // measured: 20 events held against 3201 followed; heat 367.124 / 367.025 J; layer peaks within 0.034 K
    const held = runOk(rig(600));
    const followed = runOk(rig(600), { holdFastThermostats: false });
    expect(held.record.heater!.heldS).toBeGreaterThan(590);
    expect(held.record.warnings.some((w) => w.startsWith(`the heater's thermostat switched ${HELD.heldSwitches} times within ${HELD.heldQuietWithinS} s by t = `)
      && w.includes(`its ripple in the stack under ${HELD.heldRippleShare} × tolerance_K`))).toBe(true);
    expect(held.stats.events * 50).toBeLessThan(followed.stats.events);
    // the hold leaves out a ripple under half of tolerance_K (0.2 K) and a lean of the relay's mean within tolerance_K
    assertClose(held.summary.heater!.energy_J, followed.summary.heater!.energy_J, { rel: 1e-3 }, 'heater energy, J');
    for (const [id, layer] of Object.entries(held.summary.layers)) {
      assertClose(layer.peak_C, followed.summary.layers[id]!.peak_C, { abs: 0.2 }, `${id} peak, °C`);
    }
    expect(held.summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
  });

  it('runProblem() does not hold it behind a 1e6 W/m²K contact, where its ripple reaches the stack', () => {
    // the face then swings with nearly the plate's own 1.1 K fundamental (rippleInStackK): above 0.1 K, not held
    const out = runOk(rig(150, 1e6));
    expect(out.record.heater!.heldS).toBe(0);
    expect(out.stats.events).toBeGreaterThan(500);
  });
});

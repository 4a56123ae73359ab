// The scenario's `edges` key (sim/scenario/edge-schema.ts, edge-terms.ts): what it turns on, and the refusals that
// name the field and the value.
import { describe, expect, it } from 'vitest';
import type { FieldError } from '../../sim/scenario/field-errors.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';
import { PLAIN, scenario } from '../support/scenarios.ts';

type Json = Record<string, unknown>;

/** Two layers (4 mm in all) on a 20 × 30 mm footprint, with the given edges. */
const withEdges = (edges: unknown, footprint: unknown = { width_mm: 20, length_mm: 30 }): Json => ({
  ...scenario({
    duration_s: 100, materials: { metal: PLAIN, board: { k_W_mK: 0.1, rho_kg_m3: 300, cp_J_kgK: 1000 } },
    layers: [{ id: 'a', material: 'metal', thickness_mm: 1.5 }, { id: 'b', material: 'metal', thickness_mm: 2.5 }],
  }),
  ...(footprint ? { footprint } : {}),
  edges,
});

function errorsOf(input: Json): readonly FieldError[] {
  const r = parseScenario(input);
  expect(r.ok, 'the scenario was accepted').toBe(false);
  return r.ok ? [] : r.errors;
}

describe('scenario key edges', () => {
  it('parseScenario() gives every layer one edge term with P/A, the stack height and the ambient', () => {
    const r = parseScenario(withEdges({ loss: true, emissivity: 0.6 }));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    for (const layer of r.problem.layers) {
      expect(layer.terms).toHaveLength(1);
      const term = layer.terms![0]!;
      if (term.kind !== 'edge') throw new Error(term.kind);
      // P/A = 2(20 + 30)/(20·30) mm⁻¹ = 1/6 mm⁻¹ = 166.67 m⁻¹; height 4 mm; ambient 20 °C; natural convection by default
      assertClose(term.loss.perimeterPerArea, 1000 / 6, { rel: 1e-12 }, 'P/A, 1/m');
      assertClose(term.loss.heightM, 0.004, { rel: 1e-12 }, 'height, m');
      assertClose(term.loss.ambientK, 293.15, { rel: 1e-15 }, 'ambient, K');
      expect(term.loss.convection).toEqual({ kind: 'natural' });
      expect(term.loss.sleeve).toBeUndefined();
    }
  });

  it('parseScenario() builds a sleeve of the scenario\'s own material with the plane-wall geometry on a rectangle', () => {
    const r = parseScenario(withEdges({ loss: true, emissivity: 0.6, convection_W_m2K: 5, sleeve: { material: 'board', thickness_mm: 2 } }));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const term = r.problem.layers[0]!.terms![0]!;
    if (term.kind !== 'edge' || !term.loss.sleeve) throw new Error('no sleeve');
    // R·k = t = 2 mm; outer/inner area = (P + 8t)/P = (100 + 16)/100
    assertClose(term.loss.sleeve.resistanceTimesK, 0.002, { rel: 1e-12 }, 'R·k, m');
    assertClose(term.loss.sleeve.areaRatio, 1.16, { rel: 1e-12 }, 'area ratio');
    expect(term.loss.convection).toEqual({ kind: 'fixed', coefficient: 5 });
  });

  it('parseScenario() gives no terms with "loss": false or without the key', () => {
    for (const input of [withEdges({ loss: false, emissivity: 0.6 }), withEdges(undefined)]) {
      const r = parseScenario(input);
      if (!r.ok) throw new Error(JSON.stringify(r.errors));
      for (const layer of r.problem.layers) expect(layer.terms).toBeUndefined();
    }
  });

  it('parseScenario() refuses edge losses without a footprint, naming edges.loss', () => {
    const [e] = errorsOf(withEdges({ loss: true, emissivity: 0.6 }, null));
    expect(e!.path).toBe('edges.loss');
    expect(e!.message).toMatch(/footprint/);
  });

  it('parseScenario() refuses an unknown or melting sleeve material, naming edges.sleeve.material and the name', () => {
    const [unknown] = errorsOf(withEdges({ loss: true, emissivity: 0.6, sleeve: { material: 'bord', thickness_mm: 2 } }));
    expect(unknown!.path).toBe('edges.sleeve.material');
    expect(unknown!.message).toMatch(/unknown material.*"board".*"bord"/);
    const [melting] = errorsOf(withEdges({ loss: true, emissivity: 0.6, sleeve: { material: 'licl-kcl-eutectic', thickness_mm: 2 } }));
    expect(melting!.path).toBe('edges.sleeve.material');
    expect(melting!.message).toMatch(/must not melt.*licl-kcl-eutectic/);
  });

  it('parseScenario() refuses an emissivity outside [0, 1], a missing one, and a sleeve of no thickness', () => {
    const [high] = errorsOf(withEdges({ loss: true, emissivity: 1.5 }));
    expect(high!.path).toBe('edges.emissivity');
    expect(high!.message).toMatch(/\[0, 1\].*1\.5/);
    const [missing] = errorsOf(withEdges({ loss: true }));
    expect(missing!.path).toBe('edges.emissivity');
    const [thin] = errorsOf(withEdges({ loss: true, emissivity: 0.5, sleeve: { material: 'board', thickness_mm: 0 } }));
    expect(thin!.path).toBe('edges.sleeve.thickness_mm');
    expect(thin!.message).toMatch(/> 0.*0/);
  });
});

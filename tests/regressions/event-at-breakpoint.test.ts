// A state event located at the very end of a step that lands on a breakpoint: the heat off set to the separator's own
// molten time, which is where the window search puts its first trial of the molten edge (study/window.ts
// heldUntilMolten). The step that carried the melt was cut to the breakpoint, the melt was located at its end, and the
// step then counted as an event step, not a landing: the schedule was never re-read, and the heat stayed on to the end
// of the run (found by a fuzz of the window search over random stacks; scenario invented from its reproducer).
// Reference: a constant imposed flux q delivers q·t_off per unit area (closed form), and the run must freeze.

import { describe, expect, it } from 'vitest';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { assertClose } from '../support/assert-close.ts';
import { runOk, scenario } from '../support/scenarios.ts';

const FLUX_W_M2 = 2290;

/** LiCl under a LiCl–KCl separator, fed a constant flux from below until `offS`, then cooled by 10 W/(m²·K). */
const fedUntil = (offS: number, after: ScenarioFile['bottom'][number]): ScenarioFile => scenario({
  duration_s: 2790, ambient_C: 59.7, materials: {},
  footprint: { diameter_mm: 19.6 },
  layers: [{ id: 'base', material: 'licl', thickness_mm: 2.42 }, { id: 'sep', material: 'licl-kcl-eutectic', thickness_mm: 0.659, separator: true }],
  contacts: [{ below: 'base', above: 'sep', resistance_m2K_W: 0.01 }],
  bottom: [{ from_s: 0, flux_W_m2: FLUX_W_M2 }, { ...after, from_s: offS }],
  top: [{ from_s: 0, flux_W_m2: 0 }],
});

describe('a separator event at a schedule change', () => {
  it.each([
    ['still air', { from_s: 0, convection_W_m2K: 'natural', emissivity: 0.05 }],
    ['a fixed coefficient', { from_s: 0, convection_W_m2K: 10 }],
  ] as const)('runProblem() removes the heat at the separator\'s molten time when the heat off is set to it (%s after)', (_, after) => {
    const moltenAt = runOk(fedUntil(1500, after)).summary.separator.molten_at_s;
    expect(moltenAt).not.toBeNull();
    const out = runOk(fedUntil(moltenAt!, after));
    expect(out.summary.heat_off_s).toBe(moltenAt);
    // the flux's energy is q·t_off exactly (the ledger integrates a constant by TR-BDF2's weights; round-off only);
    // with the heat left on it was q × 2790 s
    assertClose(out.summary.energy.in_J_m2, FLUX_W_M2 * moltenAt!, { rel: 1e-12 });
    expect(out.summary.energy.out_J_m2).toBeGreaterThan(0);
    expect(out.summary.separator.frozen_at_s).not.toBeNull();
  });
});

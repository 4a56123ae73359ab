// Why a window search finds no usable window at the value it reports: the reason is the wording table's clause for
// the run's status (sim/observe/wording.ts windowStatusWords[status].at), naming the run by what was varied — "at this
// hold" for a hold search, "at this plate temperature" for a search over the plate's temperature.
// The scenarios are invented: a 1 mm salt layer (melting 350–354 °C) on a plate that is lifted at 600 s.

import { describe, expect, it } from 'vitest';
import { searchWindow, type WindowOptions } from '../../sim/study/window.ts';
import type { InlineMaterialFile } from '../../sim/scenario/scenario-schema.ts';
import { parseOk, slab, toK } from '../support/scenarios.ts';

/** An invented salt: melts over 350–354 °C, with a service limit at 500 °C so a plate-temperature search has a range. */
const SALT: InlineMaterialFile = {
  k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1000,
  melt: { solidus_C: 350, liquidus_C: 354, latent_J_kg: 150000 },
  limits: [{ kind: 'service', at_C: 500 }],
};

const onPlate = (plateC: number, durationS: number) => parseOk(slab({
  material: SALT, thickness_mm: 1, separator: true, duration_s: durationS, ambient_C: 20,
  bottom: [{ from_s: 0, plate: { temperature_C: plateC, conductance_W_m2K: 500 } }, { from_s: 600, convection_W_m2K: 10 }],
  top: [{ from_s: 0, convection_W_m2K: 10 }],
}));

function reasonAt(plateC: number, durationS: number, options: WindowOptions): string | null | undefined {
  const result = searchWindow(onPlate(plateC, durationS), options);
  if (!result.ok) throw new Error(result.reason);
  return result.report.window?.reason;
}

describe('searchWindow() reasons for a missing window', () => {
  it('searchWindow() says the separator is not fully molten "at this hold" when a 300 °C plate never melts a 350 °C salt', () => {
    expect(reasonAt(300, 1800, { at: 600 })).toBe('the separator is not fully molten at this hold');
  });

  it('searchWindow() over the plate temperature names the plate temperature, not a hold', () => {
    expect(reasonAt(300, 1800, { vary: 'power', at: toK(300) })).toBe('the separator is not fully molten at this plate temperature');
  });

  it('searchWindow() says the separator is still at least half molten when the run ends 20 s after the lift', () => {
    // 1 mm of salt at about 400 °C with 10 W/m²K on both faces loses far less than its latent heat in 20 s
    expect(reasonAt(400, 620, { at: 600 })).toBe('the separator is still at least half molten at the end of the run');
  });
});

// fast-check arbitraries of valid scenarios with the contract's bodies and side walls, which arbitrary.ts leaves out: a
// heater body (a plate of a library solid under an electric heater of 1–500 W, constant, on-off or PI control on the
// plate or a layer, with or without a set-point schedule) from t = 0, then from the hold on a bench surface (a library
// solid, semi-infinite or a slab) or still air; side walls that lose heat, bare or in a sleeve, on half the draws. The
// stack: one library salt separator and one or two library layers below it, up to two above, 0.1–10 mm each, on a
// 5–100 mm disc, 300–7200 s, ambient −40 to 60 °C. Every draw is valid; the data are invented and describe no real rig.

import fc from 'fast-check';
import { fraction, librarySalts, logRange, range, round } from './arbitrary.ts';
import { libraryMaterial, libraryNames } from '../../sim/scenario/library.ts';
import type { FaceSegmentFile, HeaterFile, LayerFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';

const library = libraryNames();
/** Library materials that do not melt: plates, benches and sleeves must stay solid (validation refuses the others). */
const solids = library.filter((n) => libraryMaterial(n)?.melt === undefined);

const sensor = fc.constantFrom('plate', 'separator', 'below0');
const control: fc.Arbitrary<HeaterFile['control']> = fc.oneof(
  fc.constant({ kind: 'constant' as const }),
  fc.record({ kind: fc.constant('on-off' as const), set_point_C: range(100, 900), band_K: logRange(0.5, 20), sensor }),
  fc.record({
    kind: fc.constant('pi' as const), set_point_C: range(100, 900), gain_W_K: logRange(0.1, 100), integral_s: logRange(1, 1000),
    period_s: fc.option(logRange(0.1, 10), { nil: undefined }), sensor,
  }).map((c) => (c.period_s === undefined ? { kind: c.kind, set_point_C: c.set_point_C, gain_W_K: c.gain_W_K, integral_s: c.integral_s, sensor: c.sensor } : c)),
);

const heater = fc.record({
  power_W: logRange(1, 500),
  plate: fc.record({ material: fc.constantFrom(...solids), thickness_mm: logRange(0.5, 20) }),
  contact_W_m2K: logRange(100, 1e4),
  loss: fc.option(logRange(0.1, 50), { nil: undefined }),
  control,
  /** A set-point schedule instead of the control's own set-point: shares of the run and set-points. */
  schedule: fc.option(fc.array(fc.tuple(fraction, range(100, 900)), { minLength: 1, maxLength: 3 }), { nil: undefined }),
});

const stillAir = fc.record({ convection_W_m2K: fc.constant('natural' as const), emissivity: range(0.05, 0.95) });
const afterHold: fc.Arbitrary<Omit<FaceSegmentFile, 'from_s'>> = fc.oneof(
  stillAir,
  fc.record({
    material: fc.constantFrom(...solids),
    contact: fc.option(logRange(50, 5000), { nil: undefined }),
    thickness: fc.option(logRange(1, 50), { nil: undefined }),
  }).map((b) => ({
    bench: { material: b.material, ...(b.contact !== undefined ? { contact_W_m2K: b.contact } : {}), ...(b.thickness !== undefined ? { thickness_mm: b.thickness } : {}) },
  })),
);

const edges = fc.record({
  convection: fc.oneof(fc.constant('natural' as const), logRange(1, 50)),
  emissivity: range(0, 1),
  sleeve: fc.option(fc.record({ material: fc.constantFrom(...solids), thickness_mm: logRange(0.5, 20) }), { nil: undefined }),
}).map((e) => ({ loss: true, convection_W_m2K: e.convection, emissivity: e.emissivity, ...(e.sleeve ? { sleeve: e.sleeve } : {}) }));

export const bodyScenarios: fc.Arbitrary<ScenarioFile> = fc.record({
  below: fc.array(fc.tuple(fc.constantFrom(...library), logRange(0.1, 10)), { minLength: 1, maxLength: 2 }),
  above: fc.array(fc.tuple(fc.constantFrom(...library), logRange(0.1, 10)), { maxLength: 2 }),
  salt: fc.constantFrom(...librarySalts),
  saltMm: logRange(0.1, 10),
  diameterMm: logRange(5, 100),
  heater,
  holdShare: range(0.05, 0.8),
  durationS: logRange(300, 7200),
  ambientC: range(-40, 60),
  after: afterHold,
  top: fc.oneof(stillAir, fc.constant({ flux_W_m2: 0 })),
  edges: fc.option(edges, { nil: undefined }),
}).map((g): ScenarioFile => {
  const layers: LayerFile[] = [
    ...g.below.map(([material, mm], i) => ({ id: `below${i}`, material, thickness_mm: mm })),
    { id: 'separator', material: g.salt, thickness_mm: g.saltMm, separator: true },
    ...g.above.map(([material, mm], i) => ({ id: `above${i}`, material, thickness_mm: mm })),
  ];
  const h = g.heater;
  const scheduled = h.schedule !== undefined && h.control.kind !== 'constant';
  const points = scheduled
    ? [...new Map(h.schedule!.map(([f, c]) => [round(f * g.durationS), c])).entries()].sort((a, b) => a[0] - b[0])
      .map(([at, c], i) => ({ at_s: i === 0 ? 0 : at, set_point_C: c }))
    : [];
  const controlOf = (): HeaterFile['control'] => {
    if (!scheduled || h.control.kind === 'constant') return h.control;
    const { set_point_C: _own, ...rest } = h.control;
    return rest as HeaterFile['control'];
  };
  const heaterFile: HeaterFile = {
    power_W: h.power_W, plate: h.plate, contact_W_m2K: h.contact_W_m2K, ...(h.loss !== undefined ? { loss_W_m2K: h.loss } : {}),
    control: controlOf(), ...(scheduled ? { set_points: points } : {}),
  };
  return {
    freezeline: 1, name: 'fuzzed body scenario', ambient_C: g.ambientC, initial_C: g.ambientC, duration_s: g.durationS,
    footprint: { diameter_mm: g.diameterMm }, materials: {}, layers,
    bottom: [{ from_s: 0, heater: heaterFile }, { from_s: round(g.durationS * g.holdShare), ...g.after }],
    top: [{ from_s: 0, ...g.top }],
    ...(g.edges ? { edges: g.edges } : {}),
  };
});

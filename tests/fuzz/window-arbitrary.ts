// fast-check arbitraries of the scenarios the operating-duration search is asked about: a stack with one separator of
// a library salt and up to two library layers below and above it (0.1–10 mm each), heated from below by a plate
// (200–1000 °C) or an imposed flux (1e3–1e5 W/m²) from t = 0 and then cooled from the hold on (still air with an
// emissivity, or a fixed coefficient), the top face in still air or adiabatic, on a 5–100 mm disc, at −40 to 60 °C,
// for 300–7200 s. Every draw is valid; the data are invented and describe no real cell.
//
// The shape is chosen so that physics fixes the answer's form: one heat input, removed at the hold, every later
// condition cooler than it. By the comparison principle for the heat equation (a longer hold is a boundary input at
// least as large at every instant, so the stack is at least as hot everywhere; Protter & Weinberger, Maximum
// Principles in Differential Equations, 1967, ch. 3), every margin falls and the separator's melt can only advance as
// the hold grows: the safe holds and the molten holds are each one interval (window-check.ts).

import fc from 'fast-check';
import { librarySalts, logRange, range, round } from './arbitrary.ts';
import { libraryNames } from '../../sim/scenario/library.ts';
import type { FaceSegmentFile, LayerFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';

const library = libraryNames();

const heating: fc.Arbitrary<Omit<FaceSegmentFile, 'from_s'>> = fc.oneof(
  fc.record({ plate: fc.record({ temperature_C: range(200, 1000), conductance_W_m2K: logRange(50, 5000) }) }),
  fc.record({ flux_W_m2: logRange(1e3, 1e5) }),
);
const stillAir = fc.record({ convection_W_m2K: fc.constant('natural' as const), emissivity: range(0.05, 0.95) });
const cooling: fc.Arbitrary<Omit<FaceSegmentFile, 'from_s'>> = fc.oneof(stillAir, fc.record({ convection_W_m2K: logRange(2, 50) }));
const passiveTop: fc.Arbitrary<Omit<FaceSegmentFile, 'from_s'>> = fc.oneof(stillAir, fc.constant({ flux_W_m2: 0 }));

export const windowScenarios: fc.Arbitrary<ScenarioFile> = fc.record({
  below: fc.array(fc.tuple(fc.constantFrom(...library), logRange(0.1, 10)), { maxLength: 2 }),
  above: fc.array(fc.tuple(fc.constantFrom(...library), logRange(0.1, 10)), { maxLength: 2 }),
  salt: fc.constantFrom(...librarySalts),
  saltMm: logRange(0.1, 10),
  contact: fc.oneof(fc.constant(0), logRange(1e-5, 1e-2)),
  diameterMm: logRange(5, 100),
  heat: heating,
  holdShare: range(0.05, 0.8),
  durationS: logRange(300, 7200),
  ambientC: range(-40, 60),
  after: cooling,
  top: passiveTop,
}).map((g): ScenarioFile => {
  const layers: LayerFile[] = [
    ...g.below.map(([material, mm], i) => ({ id: `below${i}`, material, thickness_mm: mm })),
    { id: 'separator', material: g.salt, thickness_mm: g.saltMm, separator: true },
    ...g.above.map(([material, mm], i) => ({ id: `above${i}`, material, thickness_mm: mm })),
  ];
  const contacts = g.contact > 0 ? layers.slice(1).map((l, i) => ({ below: layers[i]!.id, above: l.id, resistance_m2K_W: g.contact })) : [];
  return {
    freezeline: 1, name: 'fuzzed window scenario', ambient_C: g.ambientC, initial_C: g.ambientC, duration_s: g.durationS,
    footprint: { diameter_mm: g.diameterMm }, materials: {}, layers, ...(contacts.length > 0 ? { contacts } : {}),
    bottom: [{ from_s: 0, ...g.heat }, { from_s: round(g.durationS * g.holdShare), ...g.after }],
    top: [{ from_s: 0, ...g.top }],
  } as ScenarioFile;
});

/**
 * The scenario file (format version 1): its shape, as a zod schema. This is the contract of DESIGN.md; every key is
 * accepted with exactly that meaning, and unknown keys are refused so a misspelt key is never silently ignored.
 * Units are in the key names (_mm, _C, _s, _W_m2, _W_m2K, _W_m3, _J_kg, _kg_m3, _W_mK, _J_kgK, _m2K_W).
 *
 * Checks that need more than one field (material names, adjacency of contacts, probe positions, time order) live in
 * scenario.ts, which runs after this shape check and reports errors in the same `path: message, got value` form.
 */
import { z } from 'zod';
import { LIMIT_KINDS } from '../physics/material.ts';
import { ZERO_CELSIUS_K } from '../physics/units.ts';
import { scenarioLimitDefaults as LIMIT } from './scenario-limits.ts';
import { accuracyDefaults } from './accuracy.ts';
import { compositeSchema, heatPerKgSchema, jouleSchema, pelletSchema, saltMixtureSchema } from './rig-schema.ts';
import { edgesSchema } from './edge-schema.ts';

/** The coldest temperature a °C field may hold: absolute zero. */
const ABSOLUTE_ZERO_C = -ZERO_CELSIUS_K;

const celsius = () => z.number().gte(ABSOLUTE_ZERO_C, { error: `must be ≥ ${ABSOLUTE_ZERO_C} °C (absolute zero)` })
  .lte(LIMIT.maxTemperatureC, { error: `must be ≤ ${LIMIT.maxTemperatureC} °C (scenarioLimitDefaults.maxTemperatureC: above every solid's melting point)` });
/** A layer id or material name: it heads table columns and chart legends, so it is short. */
const shortName = () => z.string().min(1, { error: 'must not be empty' })
  .max(LIMIT.maxIdChars, { error: `must hold at most ${LIMIT.maxIdChars} characters (scenarioLimitDefaults.maxIdChars)` });
const positive = () => z.number().gt(0, { error: 'must be > 0' });
const nonNegative = () => z.number().gte(0, { error: 'must be ≥ 0' });
const timeS = () => z.number().gte(0, { error: 'must be ≥ 0 s' });
/** A fraction such as an emissivity: a number in [0, 1]. */
const unitInterval = () => z.number().gte(0, { error: 'must be in [0, 1]' }).lte(1, { error: 'must be in [0, 1]' });

/** A property: one number, or a table [[T_C, value], ...] with strictly increasing temperatures (checked later). */
const property = () =>
  z.union([
    positive(),
    z.array(z.tuple([celsius(), positive()]), { error: 'must be a number or a table [[T_C, value], ...]' })
      .min(1, { error: 'must have at least one row' }),
  ], { error: 'must be a number > 0 or a table [[T_C, value], ...]' });


const limitSchema = z.strictObject({
  kind: z.enum(LIMIT_KINDS, { error: `must be one of ${LIMIT_KINDS.join(', ')}` }),
  at_C: celsius(),
  source: z.string().optional(),
  note: z.string().optional(),
});

const meltSchema = z.strictObject({
  solidus_C: celsius(),
  liquidus_C: celsius(),
  latent_J_kg: nonNegative(),
});

/** Material fields shared by inline materials (scenario) and library files (materials/*.json). */
const materialFields = {
  title: z.string().optional(),
  k_W_mK: property(),
  rho_kg_m3: positive(),
  cp_J_kgK: property(),
  melt: meltSchema.optional(),
  limits: z.array(limitSchema).optional(),
  emissivity: z.strictObject({
    low: unitInterval(),
    high: unitInterval(),
    note: z.string().optional(),
    source: z.string().optional(),
  }).optional(),
  sources: z.record(z.string(), z.string()).optional(),
  notes: z.string().optional(),
};

export const inlineMaterialSchema = z.strictObject(materialFields);

/**
 * A scenario's inline material: properties given directly, or a LiCl–KCl mixture (`salt`), or a salt-filled porous
 * matrix (`composite`) whose properties a model computes (additions to the contract; rig-schema.ts).
 */
const MODEL_KEYS = ['k_W_mK', 'rho_kg_m3', 'cp_J_kgK', 'melt'] as const;
export const materialEntrySchema = z.strictObject({
  ...materialFields,
  k_W_mK: property().optional(),
  rho_kg_m3: positive().optional(),
  cp_J_kgK: property().optional(),
  salt: saltMixtureSchema.optional(),
  composite: compositeSchema.optional(),
}).superRefine((m, ctx) => {
  const kind = m.salt ? 'salt' : m.composite ? 'composite' : undefined;
  if (m.salt && m.composite) ctx.addIssue({ code: 'custom', path: ['composite'], input: m.composite, message: 'a material is a salt mixture or a composite, not both' });
  for (const key of MODEL_KEYS) {
    if (kind && m[key] !== undefined) ctx.addIssue({ code: 'custom', path: [key], input: m[key], message: `comes from the ${kind} model here; remove it` });
    if (!kind && key !== 'melt' && m[key] === undefined) ctx.addIssue({ code: 'custom', path: [key], input: undefined, message: 'is required (a number or a table) unless the material is a "salt" or a "composite"' });
  }
});

export const libraryMaterialSchema = z.strictObject({
  freezeline_material: z.literal(1, { error: 'must be 1 (the material format version)' }),
  name: z.string().min(1),
  ...materialFields,
  sources: z.record(z.string(), z.string()),
});

const scheduledValue = z.strictObject({ from_s: timeS(), to_s: timeS(), value: z.number() });

const layerSchema = z.strictObject({
  id: shortName(),
  material: shortName(),
  thickness_mm: positive(),
  separator: z.boolean().optional(),
  /** Volumetric heat source, W/m³: a constant, or intervals [from_s, to_s) each with a value. */
  source_W_m3: z.union([z.number(), z.array(scheduledValue)], {
    error: 'must be a number or a list of { from_s, to_s, value }',
  }).optional(),
  /** Optional override of the cell count in this layer (default: chosen from the layer's thickness). */
  cells: z.number().int({ error: 'must be a whole number' }).gte(1, { error: 'must be ≥ 1' })
    .lte(LIMIT.maxCells, { error: `must be ≤ ${LIMIT.maxCells} (scenarioLimitDefaults.maxCells, the most cells a whole stack may hold)` }).optional(),
  /** Internal heat in the user's terms, converted to W/m³ at the edge (heat-sources.ts; additions to the contract). */
  pellet: pelletSchema.optional(),
  joule: jouleSchema.optional(),
  heat_W_kg: heatPerKgSchema.optional(),
});

const contactSchema = z.strictObject({
  below: z.string(),
  above: z.string(),
  resistance_m2K_W: nonNegative(),
});

const plateSchema = z.strictObject({ temperature_C: celsius(), conductance_W_m2K: positive() });

/**
 * A heater with a body (an addition to the contract; physics/heater.ts): a plate of a named material and thickness
 * under the footprint, an electric power limit, a contact conductance to the face, an optional loss to the ambient,
 * and its control. The set-point is one number in the control, or a schedule of ramps and holds in `set_points`.
 */
const heaterSchema = z.strictObject({
  power_W: positive(),
  plate: z.strictObject({ material: shortName(), thickness_mm: positive() }),
  contact_W_m2K: positive(),
  loss_W_m2K: nonNegative().optional(),
  control: z.discriminatedUnion('kind', [
    z.strictObject({ kind: z.literal('constant') }),
    z.strictObject({
      kind: z.literal('on-off'),
      set_point_C: celsius().optional(),
      band_K: positive(),
      /** "plate", or a layer id (its mean temperature). */
      sensor: shortName(),
    }),
    z.strictObject({
      kind: z.literal('pi'),
      set_point_C: celsius().optional(),
      gain_W_K: positive(),
      integral_s: positive(),
      /** Sampling period, s (default 1). */
      period_s: positive().optional(),
      sensor: shortName(),
    }),
  ], { error: 'must be { "kind": "constant" }, { "kind": "on-off", "band_K", "sensor" } or { "kind": "pi", "gain_W_K", "integral_s", "sensor" }' }),
  set_points: z.array(z.strictObject({ at_s: timeS(), set_point_C: celsius() })).min(1, { error: 'must hold at least one point' }).optional(),
});
export type HeaterFile = z.infer<typeof heaterSchema>;

/**
 * A bench surface the face rests on (an addition to the contract; physics/bench.ts): a semi-infinite solid of a named
 * material, from `start_C` (default: ambient_C), through `contact_W_m2K` (default: perfect contact); `thickness_mm`
 * makes it a slab of that thickness insulated beneath.
 */
const benchSchema = z.strictObject({
  material: shortName(),
  contact_W_m2K: positive().optional(),
  start_C: celsius().optional(),
  /** A bench of this thickness, insulated beneath (default: semi-infinite). */
  thickness_mm: positive().optional(),
});
export type BenchFile = z.infer<typeof benchSchema>;

/** One segment of a face schedule: the sum of its terms holds from `from_s` until the next segment. */
const faceSegmentSchema = z.strictObject({
  from_s: timeS(),
  flux_W_m2: z.number().optional(),
  /** Heater power into the face, W, spread over the footprint (an addition to the contract; needs `footprint`). */
  power_W: z.number().optional(),
  convection_W_m2K: z.union([nonNegative(), z.literal('natural')], {
    error: 'must be a number ≥ 0 or "natural"',
  }).optional(),
  fluid_C: celsius().optional(),
  emissivity: unitInterval().optional(),
  surroundings_C: celsius().optional(),
  plate: plateSchema.optional(),
  fixed_C: celsius().optional(),
  heater: heaterSchema.optional(),
  bench: benchSchema.optional(),
});

const footprintSchema = z.union([
  z.strictObject({ diameter_mm: positive() }),
  z.strictObject({ width_mm: positive(), length_mm: positive() }),
], { error: 'must be { "diameter_mm": d } or { "width_mm": w, "length_mm": l }' });

export const scenarioSchema = z.strictObject({
  freezeline: z.literal(1, { error: 'must be 1 (the only scenario format version this program reads)' }),
  name: z.string().max(LIMIT.maxNameChars, { error: `must hold at most ${LIMIT.maxNameChars} characters (scenarioLimitDefaults.maxNameChars)` }).optional(),
  description: z.string().optional(),
  ambient_C: celsius(),
  initial_C: celsius().optional(),
  duration_s: positive().lte(LIMIT.maxDurationS, { error: `must be ≤ ${LIMIT.maxDurationS} s (scenarioLimitDefaults.maxDurationS, about three years)` }),
  footprint: footprintSchema.optional(),
  materials: z.record(z.string(), materialEntrySchema).optional(),
  layers: z.array(layerSchema).min(1, { error: 'must hold at least one layer' }),
  contacts: z.array(contactSchema).optional(),
  /** Heat lost through the side walls (an addition to the contract; edge-schema.ts). Off without it. */
  edges: edgesSchema.optional(),
  bottom: z.array(faceSegmentSchema),
  top: z.array(faceSegmentSchema),
  output: z.strictObject({
    times_s: z.array(timeS()).optional(),
    probes_mm: z.array(nonNegative()).optional(),
  }).optional(),
  /**
   * What the scenario's author expects of the result (an addition to the contract). The example files state their
   * claim here, and the test suite runs every example and holds it to that claim.
   */
  expect: z.strictObject({
    molten_before_s: positive().optional(),
    half_frozen_after_s: timeS().optional(),
    half_frozen_before_s: positive().optional(),
    window_at_least_s: nonNegative().optional(),
    window_at_most_s: nonNegative().optional(),
    window_status: z.enum(['ok', 'limit-crossed', 'never-molten', 'no-separator', 'heat-never-off', 'still-molten-at-end']).optional(),
    margin_at_least_K: z.record(z.string(), z.number()).optional(),
  }).optional(),
  /** Numerical settings; the defaults meet the accuracy stated in DEVELOPERS.md. */
  numerics: z.strictObject({
    tolerance_K: z.number().gte(LIMIT.minToleranceK, {
      error: `must be ≥ ${LIMIT.minToleranceK} K (scenarioLimitDefaults.minToleranceK: below it rounding in double precision, not the step, sets the error)`,
    }).optional(),
    liquid_fraction_tolerance: z.number().gte(LIMIT.minLiquidFractionTolerance, {
      error: `must be ≥ ${LIMIT.minLiquidFractionTolerance} (scenarioLimitDefaults.minLiquidFractionTolerance: below it rounding in double precision sets the error)`,
    }).optional(),
    cells_per_mm: positive().optional(),
    min_cells_per_layer: z.number().int().gte(1).optional(),
    separator_cells_per_mm: positive().optional(),
    min_separator_cells: z.number().int().gte(1).optional(),
    max_step_s: positive().optional(),
    /** Accuracy wanted on the verdict times, s: the grid and the tolerances are chosen for it (scenario/accuracy.ts). */
    event_accuracy_s: z.number().gte(accuracyDefaults.minEventAccuracyS, {
      error: `must be ≥ ${accuracyDefaults.minEventAccuracyS} s (accuracyDefaults.minEventAccuracyS: finer needs more cells than a run may hold)`,
    }).optional(),
  }).optional(),
});

export type ScenarioFile = z.infer<typeof scenarioSchema>;
export type InlineMaterialFile = z.infer<typeof inlineMaterialSchema>;
export type MaterialEntryFile = z.infer<typeof materialEntrySchema>;
export type LibraryMaterialFile = z.infer<typeof libraryMaterialSchema>;
export type FaceSegmentFile = z.infer<typeof faceSegmentSchema>;
export type LayerFile = z.infer<typeof layerSchema>;
export type PropertyFile = z.infer<ReturnType<typeof property>>;

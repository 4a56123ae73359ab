/**
 * Scenario keys that describe a rig in the user's terms (additions to the contract), as zod schemas imported by
 * scenario-schema.ts: a LiCl–KCl mixture by composition (`salt`), a salt-filled porous matrix (`composite`), and a
 * layer's internal heat given as a pellet, as Joule heat or per kilogram (`pellet`, `joule`, `heat_W_kg`). Each is
 * converted at the edge: a material (salt-mixture.ts, composite.ts) or the layer's W/m³ schedule (heat-sources.ts).
 */
import { z } from 'zod';

const fraction = () => z.number().gte(0, { error: 'must be in [0, 1]' }).lte(1, { error: 'must be in [0, 1]' });
const positive = () => z.number().gt(0, { error: 'must be > 0' });
const timeS = () => z.number().gte(0, { error: 'must be ≥ 0 s' });

/** A LiCl–KCl mixture: LiCl and KCl fractions adding up to 1, by mole (default) or by mass. */
export const saltMixtureSchema = z.strictObject({
  LiCl: fraction(),
  KCl: fraction(),
  basis: z.enum(['mole', 'mass'], { error: 'must be "mole" or "mass"' }).optional(),
});

/** A porous matrix (a library material that does not melt) filled with a salt (a library salt or a mixture). */
export const compositeSchema = z.strictObject({
  matrix: z.string().min(1, { error: 'must not be empty' }),
  salt: z.union([z.string().min(1), saltMixtureSchema], {
    error: 'must be a library salt name or { "LiCl": x, "KCl": 1 − x, "basis": "mole" | "mass" }',
  }),
  /** Pore volume over total volume. */
  porosity: fraction(),
  /** Share of the pore volume the salt fills (the rest is gas); default 1. */
  fill: fraction().optional(),
});

/** A heat pellet burning inside the layer: its heat per gram, or the Fe/KClO₄ composition to compute it from. */
export const pelletSchema = z.strictObject({
  heat_J_g: positive().optional(),
  /** Mass fraction of KClO₄ in an Fe/KClO₄ mixture (the rest iron). */
  KClO4_fraction: fraction().optional(),
  /** Ignition time (default 0) and burn time: the heat is released evenly over [from_s, from_s + burn_s). */
  from_s: timeS().optional(),
  burn_s: positive().optional(),
  /**
   * Or the burn-front speed, mm/s, in place of burn_s: the front crosses the layer's thickness at this constant speed,
   * so the burn time is thickness / speed (heat-sources.ts); give exactly one of the two.
   */
  burn_front_mm_s: positive().optional(),
});

/** Joule heat I²R released evenly in the layer's volume (footprint × thickness) over [from_s, to_s). */
export const jouleSchema = z.strictObject({
  current_A: z.number(),
  resistance_ohm: z.number().gte(0, { error: 'must be ≥ 0' }),
  from_s: timeS(),
  to_s: timeS(),
});

/** A calibration heat per kilogram of the layer, W/kg: a constant, or intervals each with a value. */
export const heatPerKgSchema = z.union([
  z.number(),
  z.array(z.strictObject({ from_s: timeS(), to_s: timeS(), value: z.number() })),
], { error: 'must be a number or a list of { from_s, to_s, value }' });

export type SaltMixtureFile = z.infer<typeof saltMixtureSchema>;
export type CompositeFile = z.infer<typeof compositeSchema>;
export type PelletFile = z.infer<typeof pelletSchema>;
export type JouleFile = z.infer<typeof jouleSchema>;
export type HeatPerKgFile = z.infer<typeof heatPerKgSchema>;

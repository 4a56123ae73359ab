/**
 * The scenario's `edges` key (an addition to the contract): heat lost through the stack's side walls, which the 1D
 * stack otherwise treats as adiabatic. Off without the key, or with `"loss": false`. Converted to each layer's edge
 * term in edge-terms.ts; the physics is sim/physics/edge-loss.ts.
 */
import { z } from 'zod';

export const edgesSchema = z.strictObject({
  /** Whether the side walls lose heat (false keeps the settings but runs adiabatic sides, as without the key). */
  loss: z.boolean({ error: 'must be true or false' }),
  /** Side-wall convection: a coefficient, or "natural" (default) for Churchill & Chu's vertical-plate correlation. */
  convection_W_m2K: z.union([z.number().gte(0, { error: 'must be ≥ 0' }), z.literal('natural')], {
    error: 'must be a number ≥ 0 or "natural"',
  }).optional(),
  /** Emissivity of the side surface (the sleeve's outer surface when there is one). */
  emissivity: z.number().gte(0, { error: 'must be in [0, 1]' }).lte(1, { error: 'must be in [0, 1]' }),
  /** An insulation sleeve around the stack: a material (scenario or library) and its thickness. */
  sleeve: z.strictObject({
    material: z.string().min(1, { error: 'must not be empty' }),
    thickness_mm: z.number().gt(0, { error: 'must be > 0' }),
  }).optional(),
});

export type EdgesFile = z.infer<typeof edgesSchema>;

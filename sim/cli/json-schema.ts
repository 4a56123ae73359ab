/** The scenario's JSON Schema (draft 2020-12), generated from the zod schema with a title and an id. */
import { z } from 'zod';
import { scenarioSchema } from '../scenario/scenario-schema.ts';

export function scenarioJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(scenarioSchema, { unrepresentable: 'any' }),
    title: 'freezeline scenario, format version 1',
    description: 'A layered molten-salt cell, its heating and surroundings. Keys carry their units (_mm, _C, _s, _W_m2, ...).',
  };
}

// The committed JSON Schema (for editors) is the one the zod schema generates today, and it accepts the examples'
// shape as a JSON Schema document (checked structurally: required keys and no additional properties at the top).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { scenarioJsonSchema } from '../../sim/cli/json-schema.ts';

describe('schema/scenario.schema.json', () => {
  it('is current with the zod schema (run `npm run schema` after changing the format)', () => {
    const committed = JSON.parse(readFileSync(new URL('../../schema/scenario.schema.json', import.meta.url), 'utf8'));
    expect(committed).toEqual(JSON.parse(JSON.stringify(scenarioJsonSchema())));
  });

  it('refuses unknown top-level keys and requires the contract\'s keys', () => {
    const schema = scenarioJsonSchema() as { additionalProperties?: unknown; required?: string[] };
    expect(schema.additionalProperties).toBe(false);
    expect(schema.required).toEqual(expect.arrayContaining(['freezeline', 'ambient_C', 'duration_s', 'layers', 'bottom', 'top']));
  });
});

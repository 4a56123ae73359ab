/**
 * Every key the scenario format knows, read off the schema itself (through its JSON Schema), so the suggestions for
 * a misspelt key can never fall out of step with the format.
 */
import { z } from 'zod';
import { scenarioSchema } from './scenario-schema.ts';

function collect(node: unknown, out: Set<string>): void {
  if (typeof node !== 'object' || node === null) return;
  const props = (node as { properties?: Record<string, unknown> }).properties;
  if (props) for (const k of Object.keys(props)) out.add(k);
  for (const v of Object.values(node)) collect(v, out);
}

let keys: readonly string[] | undefined;

export function knownKeys(): readonly string[] {
  if (!keys) {
    const out = new Set<string>();
    collect(z.toJSONSchema(scenarioSchema, { unrepresentable: 'any' }), out);
    keys = [...out].sort();
  }
  return keys;
}

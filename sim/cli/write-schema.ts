/**
 * `npm run schema`: writes the JSON Schema of the scenario file (generated from the zod schema) to
 * schema/scenario.schema.json, so editors can validate and complete scenario files. A test checks it is current.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { scenarioJsonSchema } from './json-schema.ts';

const out = new URL('../../schema/scenario.schema.json', import.meta.url);
mkdirSync(new URL('.', out), { recursive: true });
writeFileSync(out, `${JSON.stringify(scenarioJsonSchema(), null, 2)}\n`);
process.stdout.write(`wrote ${out.pathname.split('/').slice(-2).join('/')}\n`);

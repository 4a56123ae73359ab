// `npx tsx tests/fuzz/replay.ts FILE...`: runs kept fuzz scenarios (JSON with `scenario`, as `npm run fuzz --save`
// writes them) through the fuzz properties (check.ts) one at a time and prints each outcome, its time and steps.
import { readFileSync } from 'node:fs';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { checkScenario } from './check.ts';

for (const file of process.argv.slice(2)) {
  const kept = JSON.parse(readFileSync(file, 'utf8')) as { scenario: ScenarioFile };
  const o = checkScenario(kept.scenario);
  console.log(`${file}: ${o.kind} in ${o.ms.toFixed(0)} ms, ${o.cells} cells, ${o.steps} steps${o.message ? `: ${o.message}` : ''}`);
}

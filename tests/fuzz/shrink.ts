// `npx tsx tests/fuzz/shrink.ts IN OUT`: shrinks a saved fuzz scenario (JSON with `scenario` and `why`, as
// `npm run fuzz --save` writes it) greedily while it still breaks the same property (the first four words of the
// violation): drops layers (with their contacts), sources, face segments and their keys, output, footprint, numerics
// keys and unused materials, one at a time, keeping each drop that still fails. Run it on the code before the fix.
import { readFileSync, writeFileSync } from 'node:fs';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { checkScenario } from './check.ts';

type Loose = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- edits any key of the file

const [inFile, outFile] = process.argv.slice(2);
if (!inFile || !outFile) { console.error('usage: shrink.ts IN OUT'); process.exit(2); }
const kept = JSON.parse(readFileSync(inFile, 'utf8')) as { scenario: Loose };
const classOf = (m: string) => m.split(' ').slice(0, 4).join(' ');
const want = classOf(checkScenario(kept.scenario as ScenarioFile).message);
const fails = (s: Loose) => {
  try { const o = checkScenario(s as ScenarioFile); return o.kind === 'violation' && classOf(o.message) === want; } catch { return false; }
};
const clone = (x: Loose): Loose => JSON.parse(JSON.stringify(x)) as Loose;

function* candidates(s: Loose): Generator<Loose> {
  const layers = s.layers as Loose[];
  for (let i = 0; i < layers.length && layers.length > 1; i++) {
    const t = clone(s);
    const id = (t.layers as Loose[])[i]!.id as string;
    (t.layers as Loose[]).splice(i, 1);
    if (t.contacts) t.contacts = (t.contacts as Loose[]).filter((c) => c.below !== id && c.above !== id);
    yield t;
  }
  for (let i = 0; i < layers.length; i++) if (layers[i]!.source_W_m3) { const t = clone(s); delete (t.layers as Loose[])[i]!.source_W_m3; yield t; }
  for (const side of ['bottom', 'top']) {
    const segs = (s[side] ?? []) as Loose[];
    for (let i = 0; i < segs.length; i++) {
      const t = clone(s);
      (t[side] as Loose[]).splice(i, 1);
      if ((t[side] as Loose[]).length === 0) delete t[side]; else (t[side] as Loose[])[0]!.from_s = 0;
      yield t;
      for (const k of Object.keys(segs[i]!)) if (k !== 'from_s') { const u = clone(s); delete (u[side] as Loose[])[i]![k]; yield u; }
    }
  }
  for (const k of ['output', 'footprint', 'contacts', 'initial_C']) if (s[k] !== undefined) { const t = clone(s); delete t[k]; yield t; }
  if (s.numerics) for (const k of Object.keys(s.numerics as Loose)) { const t = clone(s); delete (t.numerics as Loose)[k]; yield t; }
}

let s = kept.scenario;
for (let changed = true; changed;) {
  changed = false;
  for (const t of candidates(s)) if (fails(t)) { s = t; changed = true; break; }
}
const used = new Set((s.layers as Loose[]).map((l) => l.material as string));
for (const k of Object.keys((s.materials ?? {}) as Loose)) if (!used.has(k)) delete (s.materials as Loose)[k];
const o = checkScenario(s as ScenarioFile);
writeFileSync(outFile, `${JSON.stringify({ why: o.message, scenario: s }, null, 1)}\n`);
console.log(`shrunk to ${JSON.stringify(s).length} characters: ${o.kind}: ${o.message}`);

/**
 * Key paths a study can vary, offered as suggestions: every number in the scenario outside the materials, outputs and
 * expectations, with layers named by their id (`layers.anode.thickness_mm`) and face rows by position
 * (`bottom.1.from_s`). Typed paths are not limited to these.
 */
import { isObject, type Json } from './json.ts';

const SKIP = new Set(['freezeline', 'materials', 'output', 'expect', 'numerics']);

export function numericPaths(doc: Json): string[] {
  const out: string[] = [];
  const walk = (v: Json, path: string) => {
    if (typeof v === 'number') { out.push(path); return; }
    if (Array.isArray(v)) {
      v.forEach((e, i) => {
        const id = path === 'layers' && isObject(e) && typeof e.id === 'string' && !e.id.includes('.') ? e.id : String(i);
        walk(e, `${path}.${id}`);
      });
    } else if (isObject(v)) {
      for (const [k, e] of Object.entries(v)) {
        if (path === '' && SKIP.has(k)) continue;
        walk(e, path === '' ? k : `${path}.${k}`);
      }
    }
  };
  walk(doc, '');
  return out;
}

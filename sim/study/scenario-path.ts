/**
 * A key path into a scenario file, as a person types it on the command line: `ambient_C`, `bottom.1.from_s`,
 * `bottom[1].from_s`, `layers.separator.thickness_mm` (a layer named by its id), `materials["salt.v2"].k_W_mK`
 * (a quoted key, for names holding a dot). Reading and writing work on plain JSON values; writing returns a deep copy
 * and never touches the original.
 *
 * A path that does not lead anywhere is refused with a message naming it and saying what exists at the place it
 * failed (the keys of an object, the ids or index range of a list). The last key may name an optional key the file
 * leaves out (e.g. `top.0.emissivity`); whether the format knows that key is then the scenario parser's call.
 */
import { formatPath } from '../scenario/field-errors.ts';

export type PathStep = { readonly kind: 'key'; readonly key: string } | { readonly kind: 'index'; readonly index: number };

export interface ScenarioPath {
  /** The path as typed, used as the column name and the key of `inputs`. */
  readonly text: string;
  readonly steps: readonly PathStep[];
}

export type Outcome<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly message: string };

/** Where a path leads in one document: the concrete path (ids replaced by indices) and the value found there. */
export interface Resolved {
  /** Concrete steps, e.g. ['layers', 1, 'thickness_mm'], and as text in the parser's notation (`layers[1].thickness_mm`). */
  readonly concrete: readonly (string | number)[];
  readonly concreteText: string;
  /** The value at the path; undefined when the last key is absent from its object. */
  readonly value: unknown;
}

const TOKEN = /^(?:\.?([^.[\]"]+)|\[(\d+)\]|\["([^"]*)"\]|\[([A-Za-z_][^\]"]*)\])/;

/** Splits a typed path into steps; refuses an empty path and stray brackets or dots. */
export function parsePath(text: string): Outcome<ScenarioPath> {
  const src = text.trim();
  if (src === '') return { ok: false, message: 'an empty path; give a key such as ambient_C or layers.separator.thickness_mm' };
  const steps: PathStep[] = [];
  let rest = src;
  while (rest !== '') {
    if (steps.length > 0 && rest.startsWith('.') && (rest[1] === '.' || rest.length === 1)) {
      return { ok: false, message: `${src}: an empty key after a dot` };
    }
    const m = TOKEN.exec(rest);
    if (!m || (steps.length === 0 && rest.startsWith('.'))) return { ok: false, message: `${src}: cannot read the path at "${rest}" (write keys with dots, list entries as .1 or [1], a key holding a dot as ["a.b"])` };
    if (m[2] !== undefined) steps.push({ kind: 'index', index: Number(m[2]) });
    else {
      const key = m[1] ?? m[3] ?? m[4]!;
      steps.push(/^\d+$/.test(key) && m[1] !== undefined ? { kind: 'index', index: Number(key) } : { kind: 'key', key });
    }
    rest = rest.slice(m[0].length);
  }
  return { ok: true, value: { text: src, steps } };
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const kindOf = (v: unknown): string => (Array.isArray(v) ? 'a list' : v === null ? 'null' : typeof v === 'object' ? 'an object' : typeof v === 'string' ? 'a text' : `a ${typeof v}`);

function listIds(list: readonly unknown[]): string {
  const ids = list.map((e) => (isObject(e) && typeof e.id === 'string' ? e.id : null)).filter((id): id is string => id !== null);
  const range = list.length === 0 ? 'it is empty' : `entries 0–${list.length - 1}`;
  return ids.length > 0 ? `${range}, ids ${ids.join(', ')}` : range;
}

/** Follows a path through a document. The last key may be absent from an object (value undefined); nothing else may. */
export function resolvePath(doc: unknown, path: ScenarioPath): Outcome<Resolved> {
  let node: unknown = doc;
  const concrete: (string | number)[] = [];
  const where = () => (concrete.length === 0 ? 'the top level' : formatPath(concrete));
  for (let i = 0; i < path.steps.length; i++) {
    const step = path.steps[i]!;
    const last = i === path.steps.length - 1;
    const fail = (why: string): Outcome<Resolved> => ({ ok: false, message: `${path.text}: ${why}` });
    if (Array.isArray(node)) {
      let index: number;
      if (step.kind === 'index') index = step.index;
      else {
        index = node.findIndex((e) => isObject(e) && e.id === step.key);
        if (index < 0) return fail(`no entry with id "${step.key}" in ${where()} (${listIds(node)})`);
      }
      if (index >= node.length) return fail(`${where()} has no entry ${index} (${listIds(node)})`);
      concrete.push(index);
      node = node[index];
    } else if (isObject(node)) {
      if (step.kind === 'index') return fail(`${where()} is an object, not a list; its keys are ${Object.keys(node).join(', ') || '(none)'}`);
      if (!Object.hasOwn(node, step.key)) {
        if (!last) return fail(`no key "${step.key}" in ${where()} (keys there: ${Object.keys(node).join(', ') || 'none'})`);
        concrete.push(step.key);
        return { ok: true, value: { concrete, concreteText: formatPath(concrete), value: undefined } };
      }
      concrete.push(step.key);
      node = node[step.key];
    } else {
      return fail(`${where()} is ${kindOf(node)}, so it has no "${step.kind === 'key' ? step.key : step.index}" inside it`);
    }
  }
  return { ok: true, value: { concrete, concreteText: formatPath(concrete), value: node } };
}

/** Resolves a path that must end at a single value (a number, a text, true/false, or an absent optional key). */
export function resolveLeaf(doc: unknown, path: ScenarioPath): Outcome<Resolved> {
  const r = resolvePath(doc, path);
  if (!r.ok) return r;
  const v = r.value.value;
  if (isObject(v)) return { ok: false, message: `${path.text}: is an object, not a single value; name one of its keys (${Object.keys(v).join(', ')})` };
  if (Array.isArray(v)) return { ok: false, message: `${path.text}: is a list, not a single value; name an entry (${listIds(v)})` };
  return r;
}

/** A deep copy of `doc` with the value at `resolved.concrete` replaced (or the absent last key added). */
export function setAt(doc: unknown, resolved: Resolved, value: unknown): unknown {
  const copy = structuredClone(doc);
  let node = copy as Record<string | number, unknown>;
  resolved.concrete.forEach((step, i) => {
    if (i === resolved.concrete.length - 1) node[step] = value;
    else node = node[step] as Record<string | number, unknown>;
  });
  return copy;
}

/** Reads a typed path in one go (parse + resolve); for callers that only need the value. */
export function getAt(doc: unknown, text: string): Outcome<unknown> {
  const p = parsePath(text);
  if (!p.ok) return p;
  const r = resolvePath(doc, p.value);
  return r.ok ? { ok: true, value: r.value.value } : r;
}

/**
 * Field paths in the solver's notation (`layers[1].thickness_mm`, `bottom[0].plate.temperature_C`): parsing, reading
 * and writing the draft at a path. Inputs carry their path in `data-path`, so a FieldError finds its input.
 */
import { isObject, type Json, type JsonObject } from './json.ts';

export type PathPart = string | number;

export function parsePath(path: string): PathPart[] {
  const parts: PathPart[] = [];
  for (const m of path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) {
    if (m[2] !== undefined) parts.push(Number(m[2]));
    else if (m[1] !== undefined) parts.push(m[1]);
  }
  return parts;
}

function child(container: Json | undefined, key: PathPart): Json | undefined {
  if (typeof key === 'number') return Array.isArray(container) ? container[key] : undefined;
  return isObject(container) && Object.hasOwn(container, key) ? container[key] : undefined;
}

export function getAt(root: JsonObject, path: string): Json | undefined {
  let here: Json | undefined = root;
  for (const key of parsePath(path)) here = child(here, key);
  return here;
}

/**
 * Writes `value` at `path`, creating missing objects on the way; `undefined` deletes the key. With `prune`, a parent
 * object left empty by the deletion is removed too (an optional group such as `plate` with both fields cleared).
 */
export function setAt(root: JsonObject, path: string, value: Json | undefined, prune = false): void {
  const parts = parsePath(path);
  const last = parts.pop();
  if (last === undefined) return;
  const chain: { holder: Json[] | JsonObject; key: PathPart }[] = [];
  let here: Json[] | JsonObject = root;
  for (const [i, key] of parts.entries()) {
    let next = child(here, key);
    if (!isObject(next) && !Array.isArray(next)) {
      if (value === undefined) return;
      next = typeof parts[i + 1] === 'number' || (i + 1 === parts.length && typeof last === 'number') ? [] : {};
      put(here, key, next);
    }
    chain.push({ holder: here, key });
    here = next;
  }
  if (value === undefined) {
    remove(here, last);
    if (prune) {
      for (let i = chain.length - 1; i >= 0; i--) {
        const link = chain[i]!;
        const node = child(link.holder, link.key);
        if (!isObject(node) || Object.keys(node).length > 0) break;
        remove(link.holder, link.key);
      }
    }
  } else {
    put(here, last, value);
  }
}

function put(holder: Json[] | JsonObject, key: PathPart, value: Json): void {
  if (Array.isArray(holder)) {
    if (typeof key === 'number') holder[key] = value;
  } else {
    holder[String(key)] = value;
  }
}

function remove(holder: Json[] | JsonObject, key: PathPart): void {
  if (Array.isArray(holder)) return; // list entries are removed by the editor's own operations, never by a field
  delete holder[String(key)];
}

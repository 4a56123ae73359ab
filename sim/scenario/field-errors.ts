/**
 * Field errors in one form everywhere (CLI, worker, tests): `path: message, got value`, with the path written the way
 * a person reads the file (`layers[1].thickness_mm`). Zod's issues are translated here into words for people: a value
 * of the wrong kind reads `expected a number in mm, got the text "abc"` (the unit from the key's suffix), a misspelt
 * key gets the nearest known key, long texts are cut, and a long list of errors ends with "and N more".
 */
import type { core } from 'zod';
import { knownKeys } from './known-keys.ts';

export const fieldErrorDefaults = {
  /** Messages listed before "and N more": about a screenful; the first errors usually explain the rest. */
  maxMessages: 20,
  /** Characters of a text echoed in a message (a value, a key in a path); a longer one is cut and its length given. */
  maxEchoChars: 60,
} as const;

export interface FieldError {
  /** Where in the file, e.g. `layers[1].thickness_mm`; `(file)` for the whole file. */
  readonly path: string;
  readonly message: string;
}

export const formatFieldError = (e: FieldError): string => `${e.path}: ${e.message}`;

/** At most `max` errors; the rest are counted in one closing "and N more" entry. */
export function capErrors(errors: readonly FieldError[], max: number = fieldErrorDefaults.maxMessages): FieldError[] {
  if (errors.length <= max) return [...errors];
  const rest = errors.length - max;
  return [...errors.slice(0, max), { path: '(file)', message: `and ${rest} more error${rest === 1 ? '' : 's'} (only the first ${max} are listed)` }];
}

/** A text cut to a readable length, for messages and paths: `abcd… (100000 characters)`. */
export function clip(text: string, max: number = fieldErrorDefaults.maxEchoChars): string {
  return text.length <= max ? text : `${text.slice(0, max)}… (${text.length} characters)`;
}

/** A text quoted as in the file, cut to a readable length. */
export const quote = (text: string): string =>
  (text.length <= fieldErrorDefaults.maxEchoChars ? JSON.stringify(text) : `${JSON.stringify(text.slice(0, fieldErrorDefaults.maxEchoChars))}… (${text.length} characters)`);

export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const p of path) {
    if (typeof p === 'number') out += `[${p}]`;
    else out += out === '' ? clip(String(p)) : `.${clip(String(p))}`;
  }
  return out === '' ? '(file)' : out;
}

/** Unit suffixes of keys (DESIGN.md, "Scenario file"), longest first so `_m2K_W` is not read as `_W`. */
const UNIT_SUFFIXES: readonly (readonly [string, string])[] = [
  ['_m2K_W', 'm²·K/W'], ['_W_m2K', 'W/(m²·K)'], ['_J_kgK', 'J/(kg·K)'], ['_kg_m3', 'kg/m³'], ['_W_mK', 'W/(m·K)'],
  ['_W_m2', 'W/m²'], ['_W_m3', 'W/m³'], ['_J_kg', 'J/kg'], ['_mm', 'mm'], ['_C', '°C'], ['_K', 'K'], ['_s', 's'], ['_W', 'W'],
];
/** Keys whose value is a number or a table [[T_C, value], ...]. */
const TABLE_KEYS = new Set(['k_W_mK', 'cp_J_kgK']);

const unitOfKey = (key: string): string | undefined => UNIT_SUFFIXES.find(([suffix]) => key.endsWith(suffix))?.[1];

/**
 * The unit of the number at a path, read off the nearest key's suffix: `layers[0].thickness_mm` → mm; the first column
 * of a property table is °C (`k_W_mK[2][0]`); a schedule's `value` takes its list's unit (`source_W_m3[0].value`).
 */
export function unitOfPath(path: readonly PropertyKey[]): string | undefined {
  const keys = path.map((p, i) => [p, i] as const).filter(([p]) => typeof p === 'string');
  const last = keys[keys.length - 1];
  if (!last) return undefined;
  const [key, at] = last as [string, number];
  const after = path.slice(at + 1);
  if (TABLE_KEYS.has(key) && after.length === 2 && after[1] === 0) return '°C';
  if (key === 'value' && keys.length > 1) return unitOfKey(keys[keys.length - 2]![0] as string);
  return unitOfKey(key);
}

/** How a value looks in a message. Non-finite numbers come from overflow such as 1e400. */
function describe(input: unknown): string {
  if (input === undefined) return 'nothing';
  if (typeof input === 'number' && !Number.isFinite(input)) return `${input} (not a finite number)`;
  if (typeof input === 'string') return `the text ${quote(input)}`;
  if (Array.isArray(input)) return `a list of ${input.length} entr${input.length === 1 ? 'y' : 'ies'}`;
  if (input === null) return 'null';
  if (typeof input === 'object') return 'an object';
  return JSON.stringify(input);
}

/** What a value of an expected type is called, with its unit when it is a number. */
function expectedKind(expected: string, path: readonly PropertyKey[]): string {
  if (expected === 'number' || expected === 'int') {
    const unit = unitOfPath(path);
    return unit ? `a number in ${unit}` : 'a number';
  }
  const words: Record<string, string> = {
    array: 'a list', object: 'an object', string: 'text in double quotes', boolean: 'true or false', tuple: 'a list',
  };
  return Object.hasOwn(words, expected) ? words[expected]! : expected;
}

function levenshtein(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let diag = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const keep = row[j]!;
      row[j] = Math.min(row[j]! + 1, row[j - 1]! + 1, diag + (a[i - 1] === b[j - 1] ? 0 : 1));
      diag = keep;
    }
  }
  return row[b.length]!;
}

/** The candidate closest to a word (ignoring case), if it is close enough to be a likely typo. */
export function nearestWord(word: string, candidates: Iterable<string>): string | undefined {
  let best: string | undefined;
  // a third of the word may be wrong: "nickle" finds "nickel", but "k0" is no typo of "KCl"
  let bestDistance = Math.max(1, Math.floor(word.length / 3)) + 1;
  const w = word.toLowerCase().slice(0, 200); // no candidate is that long: a longer word is no typo of one
  for (const c of candidates) {
    const d = levenshtein(w, c.toLowerCase());
    if (d < bestDistance) { best = c; bestDistance = d; }
  }
  return best;
}

/** The known key closest to a misspelt one, if it is close enough to be a likely typo. */
export const suggestKey = (key: string): string | undefined => nearestWord(key, knownKeys());

/** One zod issue → one or more field errors (an unknown-keys issue lists each key). */
export function formatZodIssue(issue: core.$ZodIssue): FieldError[] {
  const path = formatPath(issue.path);
  const input = (issue as { input?: unknown }).input;
  switch (issue.code) {
    case 'unrecognized_keys':
      return issue.keys.map((key, i) => {
        // only the first errors are listed (capErrors), so only they need the search for a nearest key
        const hint = i < fieldErrorDefaults.maxMessages ? suggestKey(key) : undefined;
        return {
          path: formatPath([...issue.path, key]),
          message: `unknown key${hint ? ` (did you mean "${hint}"?)` : ''}; misspelt keys are refused, not ignored`,
        };
      });
    case 'invalid_type':
      if (input === undefined) {
        return [{ path, message: `is required (${expectedKind(issue.expected, issue.path)})` }];
      }
      if ((issue as { received?: string }).received === 'Infinity' || (issue as { received?: string }).received === '-Infinity') {
        return [{ path, message: `must be a finite number, got ${(issue as { received?: string }).received} (the number is too large)` }];
      }
      return [{ path, message: `expected ${expectedKind(issue.expected, issue.path)}, got ${describe(input)}` }];
    case 'too_small':
      if (issue.origin === 'array') return [{ path, message: `${issue.message}, got ${Array.isArray(input) ? input.length : 0} entries` }];
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
    case 'too_big':
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
    case 'invalid_union': {
      // a branch that failed only inside the value (a table whose row holds "hot") matched its kind: report its
      // issues where they are, rather than "must be a number or a table" about the whole value
      const inside = issue.errors.find((branch) => branch.length > 0 && branch.every((sub) => sub.path.length > 0));
      if (inside) return inside.flatMap((sub) => formatZodIssue({ ...sub, path: [...issue.path, ...sub.path] } as core.$ZodIssue));
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
    }
    default:
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
  }
}

/**
 * Field errors in one form everywhere (CLI, worker, tests): `path: message, got value`, with the path written the way
 * a person reads the file (`layers[1].thickness_mm`). Zod's issues are translated here; a misspelt key gets the
 * nearest known key as a suggestion.
 */
import type { core } from 'zod';
import { knownKeys } from './known-keys.ts';

export interface FieldError {
  /** Where in the file, e.g. `layers[1].thickness_mm`; `(file)` for the whole file. */
  readonly path: string;
  readonly message: string;
}

export const formatFieldError = (e: FieldError): string => `${e.path}: ${e.message}`;

export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const p of path) {
    if (typeof p === 'number') out += `[${p}]`;
    else out += out === '' ? String(p) : `.${String(p)}`;
  }
  return out === '' ? '(file)' : out;
}

/** How a value looks in a message. Non-finite numbers come from overflow such as 1e400. */
function describe(input: unknown): string {
  if (input === undefined) return 'nothing';
  if (typeof input === 'number' && !Number.isFinite(input)) return `${input} (not a finite number)`;
  if (typeof input === 'string') return `${JSON.stringify(input)} (a string)`;
  if (Array.isArray(input)) return 'a list';
  if (input === null) return 'null';
  if (typeof input === 'object') return 'an object';
  return JSON.stringify(input);
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

/** The known key closest to a misspelt one, if it is close enough to be a likely typo. */
export function suggestKey(key: string): string | undefined {
  let best: string | undefined;
  let bestDistance = Math.max(2, Math.floor(key.length / 4)) + 1;
  for (const k of knownKeys()) {
    const d = levenshtein(key.toLowerCase(), k.toLowerCase());
    if (d < bestDistance) { best = k; bestDistance = d; }
  }
  return best;
}

/** One zod issue → one or more field errors (an unknown-keys issue lists each key). */
export function formatZodIssue(issue: core.$ZodIssue): FieldError[] {
  const path = formatPath(issue.path);
  const input = (issue as { input?: unknown }).input;
  switch (issue.code) {
    case 'unrecognized_keys':
      return issue.keys.map((key) => {
        const hint = suggestKey(key);
        return {
          path: formatPath([...issue.path, key]),
          message: `unknown key${hint ? ` (did you mean "${hint}"?)` : ''}; misspelt keys are refused, not ignored`,
        };
      });
    case 'invalid_type':
      if (input === undefined) {
        const what = issue.expected === 'number' ? 'a number' : issue.expected === 'array' ? 'a list' : issue.expected === 'object' ? 'an object' : issue.expected;
        return [{ path, message: `is required (${what})` }];
      }
      if ((issue as { received?: string }).received === 'Infinity' || (issue as { received?: string }).received === '-Infinity') {
        return [{ path, message: `must be a finite number, got ${(issue as { received?: string }).received} (the number is too large)` }];
      }
      return [{ path, message: `must be ${issue.expected === 'number' ? 'a number' : issue.expected === 'array' ? 'a list' : `of type ${issue.expected}`}, got ${describe(input)}` }];
    case 'too_small':
      if (issue.origin === 'array') return [{ path, message: `${issue.message}, got ${Array.isArray(input) ? input.length : 0} entries` }];
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
    case 'too_big':
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
    default:
      return [{ path, message: `${issue.message}, got ${describe(input)}` }];
  }
}

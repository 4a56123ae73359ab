/**
 * Saving and loading scenario files, and downloading the series as CSV. A loaded file is read by the solver's own
 * strict reader (sim/scenario/json-text.ts), so the view and the CLI refuse the same files in the same words: a key given
 * twice, a syntax error with its line and column; a leading byte-order mark is skipped.
 */
import { capErrors, formatFieldError } from '../sim/index.ts';
import { readJsonText } from '../sim/index.ts';
import { scenarioLimitDefaults } from '../sim/index.ts';
import { isObject, type JsonObject } from './json.ts';

export const filesDefaults = {
  /** Errors named in the one-line status after a failed load; the rest are counted ("and N more"). */
  maxLoadErrors: 3,
} as const;

export function download(filename: string, text: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

/** A file name from the scenario's name: lower case, words joined by hyphens. */
export function fileStem(draft: JsonObject): string {
  const name = typeof draft.name === 'string' ? draft.name : '';
  const stem = name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60);
  return stem || 'scenario';
}

export const scenarioText = (draft: JsonObject): string => `${JSON.stringify(draft, null, 2)}\n`;

export type LoadResult = { ok: true; value: JsonObject } | { ok: false; message: string };

/** The text of a scenario file → its JSON object, or one line saying why not (the file's name first). */
export function scenarioFromText(fileName: string, text: string): LoadResult {
  if (text.trim() === '' && text.length < scenarioLimitDefaults.maxTextChars) return { ok: false, message: `${fileName} is empty` };
  const read = readJsonText(text, { maxChars: scenarioLimitDefaults.maxTextChars, maxDepth: scenarioLimitDefaults.maxNestingDepth });
  if (!read.ok) {
    const [first, ...rest] = capErrors(read.errors, filesDefaults.maxLoadErrors);
    if (first!.path === '(file)' && rest.length === 0) return { ok: false, message: `${fileName} ${first!.message}` };
    return { ok: false, message: `${fileName}: ${[first!, ...rest].map(formatFieldError).join('; ')}` };
  }
  return isObject(read.value) ? { ok: true, value: read.value as JsonObject } : { ok: false, message: `${fileName} must hold a JSON object` };
}

export async function readScenarioFile(file: File): Promise<LoadResult> {
  // a UTF-8 character takes at most 3 bytes per UTF-16 unit, so a file this large is over the limit unread
  if (file.size > 3 * scenarioLimitDefaults.maxTextChars) {
    return { ok: false, message: `${file.name} is too long (${(file.size / 2 ** 20).toFixed(0)} MB); a scenario is at most ${scenarioLimitDefaults.maxTextChars / 2 ** 20} MB of text` };
  }
  return scenarioFromText(file.name, await file.text());
}

/** Saving and loading scenario files, and downloading the series as CSV. */
import { parseJsonObject, type JsonObject } from './json.ts';

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

export async function readScenarioFile(file: File): Promise<{ ok: true; value: JsonObject } | { ok: false; message: string }> {
  const text = await file.text();
  if (text.trim() === '') return { ok: false, message: `${file.name} is empty` };
  const parsed = parseJsonObject(text);
  return parsed.ok ? parsed : { ok: false, message: `${file.name} ${parsed.message}` };
}

/**
 * Keeping the scenario: autosave to localStorage on every edit (a reload loses nothing), and the share link, which
 * carries the scenario in the URL hash as base64url of its JSON (`#scenario=…`).
 */
import { decodeBase64Url, encodeBase64Url } from './base64url.ts';
import { parseJsonObject, type JsonObject } from './json.ts';

const STORAGE_KEY = 'freezeline.scenario.v1';
const HASH_KEY = 'scenario';

export function autosave(draft: JsonObject): void {
  try {
    localStorage.setItem(STORAGE_KEY, JSON.stringify(draft));
  } catch {
    // storage full or disabled: the page still works, only the autosave is lost
  }
}

export function loadAutosaved(): JsonObject | undefined {
  try {
    const text = localStorage.getItem(STORAGE_KEY);
    if (text === null) return undefined;
    const parsed = parseJsonObject(text);
    return parsed.ok ? parsed.value : undefined;
  } catch {
    return undefined;
  }
}

export function forgetAutosaved(): void {
  try { localStorage.removeItem(STORAGE_KEY); } catch { /* nothing to forget */ }
}

export function shareLink(draft: JsonObject, here: Location = location): string {
  return `${here.origin}${here.pathname}${here.search}#${HASH_KEY}=${encodeBase64Url(JSON.stringify(draft))}`;
}

/** The scenario in the URL hash, if there is one; `error` explains a hash that cannot be read. */
export function fromHash(hash: string): { scenario?: JsonObject; error?: string } {
  const params = new URLSearchParams(hash.replace(/^#/, ''));
  const code = params.get(HASH_KEY);
  if (code === null) return {};
  const text = decodeBase64Url(code);
  if (text === undefined) return { error: 'The share link is damaged (not base64url text).' };
  const parsed = parseJsonObject(text);
  return parsed.ok ? { scenario: parsed.value } : { error: `The share link's scenario ${parsed.message}.` };
}

/**
 * The scenario being edited (the draft): plain JSON, changed through paths (a field) or whole operations (adding a
 * layer, loading a file). Listeners hear which: a field edit keeps the editor's DOM, a structural change redraws it.
 */
import { cloneJson, type Json, type JsonObject } from './json.ts';
import { getAt, setAt } from './paths.ts';

export type DraftChange =
  | { readonly kind: 'field'; readonly path: string; readonly source: Element | undefined }
  | { readonly kind: 'structure' }
  | { readonly kind: 'replace'; readonly origin: string };

export interface DraftStore {
  /** The live draft; read it, change it only through this store. */
  readonly current: () => JsonObject;
  readonly get: (path: string) => Json | undefined;
  /** Sets one field (undefined removes the key; `prune` also removes a parent group left empty). */
  readonly setField: (path: string, value: Json | undefined, options?: { prune?: boolean; source?: Element }) => void;
  /** Edits the draft in place as one field edit at `path` (the editor keeps its DOM). */
  readonly editField: (path: string, edit: (draft: JsonObject) => void, source?: Element) => void;
  /** Applies a structural change (layers or rows added, removed, moved). */
  readonly change: (edit: (draft: JsonObject) => void) => void;
  /** Replaces the whole draft (file loaded, share link opened, demo restored). */
  readonly replace: (next: JsonObject, origin: string) => void;
  readonly listen: (listener: (change: DraftChange) => void) => void;
}

export function createDraftStore(initial: JsonObject): DraftStore {
  let draft = cloneJson(initial);
  const listeners: ((change: DraftChange) => void)[] = [];
  const emit = (change: DraftChange) => { for (const l of listeners) l(change); };
  return {
    current: () => draft,
    get: (path) => getAt(draft, path),
    setField(path, value, options = {}) {
      setAt(draft, path, value, options.prune ?? false);
      emit({ kind: 'field', path, source: options.source });
    },
    editField(path, edit, source) {
      edit(draft);
      emit({ kind: 'field', path, source });
    },
    change(edit) {
      edit(draft);
      emit({ kind: 'structure' });
    },
    replace(next, origin) {
      draft = cloneJson(next);
      emit({ kind: 'replace', origin });
    },
    listen: (listener) => { listeners.push(listener); },
  };
}

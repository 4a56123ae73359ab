/**
 * The solver's field errors, shown beside the input they name. `layers[1].thickness_mm` finds the input with that
 * `data-path`; a path with no input of its own goes to the nearest input inside it (a group) or above it (a parent);
 * what finds no input at all (an unknown key in a loaded file) is listed in the general box, path first.
 */
import type { FieldError } from '../sim/index.ts';
import { h } from './dom.ts';
import { formatPath } from '../sim/index.ts';
import { parsePath } from './paths.ts';

const ERROR_CLASS = 'field-error';

/** Inputs bound to `path`: their own (`data-path`), or one they also move (`data-also-paths`, space-separated). */
function inputsAt(root: ParentNode, path: string): Element[] {
  const p = CSS.escape(path);
  return [...root.querySelectorAll(`[data-path="${p}"], [data-also-paths~="${p}"]`)];
}

function inputsFor(root: ParentNode, path: string): Element[] {
  const exact = inputsAt(root, path);
  if (exact.length > 0) return exact;
  const inside = [...root.querySelectorAll('[data-path]')]
    .filter((e) => { const p = e.getAttribute('data-path') ?? ''; return p.startsWith(`${path}.`) || p.startsWith(`${path}[`); });
  if (inside.length > 0) return inside.slice(0, 1);
  const parts = parsePath(path);
  while (parts.length > 1) {
    parts.pop();
    const up = inputsAt(root, formatPath(parts));
    if (up.length > 0) return up;
  }
  return [];
}

export function clearFieldErrors(root: ParentNode, general: HTMLElement): void {
  for (const e of root.querySelectorAll(`.${ERROR_CLASS}`)) e.remove();
  for (const e of root.querySelectorAll('[aria-invalid="true"]')) e.removeAttribute('aria-invalid');
  general.replaceChildren();
  general.hidden = true;
}

/** Shows the errors; returns how many were placed beside an input (the rest are in the general box). */
export function showFieldErrors(root: ParentNode, general: HTMLElement, errors: readonly FieldError[]): number {
  clearFieldErrors(root, general);
  let placed = 0;
  for (const err of errors) {
    const targets = inputsFor(root, err.path);
    const exact = targets.length > 0 && targets[0]!.getAttribute('data-path') === err.path;
    for (const t of targets) {
      t.setAttribute('aria-invalid', 'true');
      const wrapper = t.closest('.field') ?? t.parentElement;
      wrapper?.append(h('span', { class: ERROR_CLASS, 'data-testid': ERROR_CLASS, role: 'alert' },
        exact ? err.message : `${err.path}: ${err.message}`));
    }
    if (targets.length > 0) { placed += 1; continue; }
    general.append(h('li', { class: ERROR_CLASS, 'data-testid': ERROR_CLASS, role: 'alert' }, h('code', {}, err.path), `: ${err.message}`));
  }
  general.hidden = general.childElementCount === 0;
  return placed;
}

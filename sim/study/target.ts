/**
 * A target on a run's verdicts, written as `PATH OP VALUE`: `safe_window_s>=600`, `layers.anode.margin_K>=25`,
 * `separator.half_frozen_at_s<1200`, `safe_window_status==ok`. PATH is a path into the run's summary (the `summary`
 * object of `run --json`), in the notation of scenario-path.ts, plus one shorthand: `margin_K` is the smallest margin
 * of any layer (the binding layer's). OP is one of >=, <=, >, <, ==. VALUE is a number; a verdict given as words
 * (`safe_window_status`, `binding_layer`, `layers.<id>.limit.kind`) takes == and a word.
 *
 * A verdict that does not exist (null: no safe window, never molten, a layer without a limit) fails every target,
 * whatever the operator: a requirement on a quantity that is not there is not met.
 */
import { formatSignificant } from '../observe/format.ts';
import type { Summary } from '../observe/verdict.ts';
import { parsePath, type Outcome, type PathStep } from './scenario-path.ts';

export const OPERATORS = ['>=', '<=', '==', '>', '<'] as const;
export type Operator = (typeof OPERATORS)[number];

export interface Target {
  readonly text: string;
  readonly path: readonly PathStep[];
  readonly pathText: string;
  readonly op: Operator;
  readonly value: number | string;
}

type Leaf = 'number' | 'word';
interface Shape { readonly [key: string]: Leaf | Shape }

const LAYER_SHAPE: Shape = { peak_C: 'number', peak_at_s: 'number', margin_K: 'number', limit: { kind: 'word', at_C: 'number' } };
const SUMMARY_SHAPE: Shape = {
  heat_off_s: 'number', safe_window_s: 'number', safe_window_status: 'word', binding_layer: 'word', margin_K: 'number',
  separator: { molten_at_s: 'number', half_frozen_at_s: 'number', frozen_at_s: 'number' },
  energy: { in_J_m2: 'number', out_J_m2: 'number', stored_J_m2: 'number', imbalance_rel: 'number' },
};

/** Parses `PATH OP VALUE`; the path's layer ids are checked later against a scenario (checkTarget). */
export function parseTarget(text: string): Outcome<Target> {
  const src = text.trim();
  const m = /^(.*?)\s*(>=|<=|==|>|<)\s*(.*)$/.exec(src);
  const form = 'write PATH OP VALUE, e.g. safe_window_s>=600 or layers.anode.margin_K>=25 (OP: >=, <=, >, <, ==)';
  const odd = /!=|=>|=<|(?<![<>=])=(?!=)/.exec(src);
  if (odd) return { ok: false, message: `target ${JSON.stringify(text)}: unknown operator "${odd[0]}"; ${form}` };
  if (!m) return { ok: false, message: `target ${JSON.stringify(text)}: no comparison found; ${form}` };
  const [, left, op, right] = m as unknown as [string, string, Operator, string];
  if (left === '') return { ok: false, message: `target ${JSON.stringify(text)}: nothing before ${op}; ${form}` };
  if (right === '') return { ok: false, message: `target ${JSON.stringify(text)}: nothing after ${op}; ${form}` };
  if (/[<>=]/.test(right)) return { ok: false, message: `target ${JSON.stringify(text)}: more than one comparison; ${form}` };
  const path = parsePath(left);
  if (!path.ok) return { ok: false, message: `target ${JSON.stringify(text)}: ${path.message}` };
  const num = Number(right);
  const isNumber = right !== '' && Number.isFinite(num);
  if (!isNumber && op !== '==') return { ok: false, message: `target ${JSON.stringify(text)}: ${op} needs a number, got "${right}"` };
  return { ok: true, value: { text: src, path: path.value.steps, pathText: left, op, value: isNumber ? num : right.replace(/^"(.*)"$/, '$1') } };
}

/** Checks that a target's path names a verdict of a run with these layer ids, and that its value has the right kind. */
export function checkTarget(target: Target, layerIds: readonly string[]): string | null {
  const steps = target.path;
  const name = (s: PathStep) => (s.kind === 'key' ? s.key : String(s.index));
  let shape: Shape | Leaf = SUMMARY_SHAPE;
  let i = 0;
  if (steps[0]?.kind === 'key' && steps[0].key === 'layers') {
    const id = steps[1];
    if (!id) return `target ${target.text}: layers needs a layer id (${layerIds.join(', ')})`;
    if (!layerIds.includes(name(id))) return `target ${target.text}: no layer with id "${name(id)}" (ids: ${layerIds.join(', ')})`;
    shape = LAYER_SHAPE;
    i = 2;
  }
  for (; i < steps.length; i++) {
    const step = steps[i]!;
    if (typeof shape === 'string') return `target ${target.text}: ${target.pathText} goes past a single verdict at "${name(step)}"`;
    const next: Shape | Leaf | undefined = Object.hasOwn(shape, name(step)) ? shape[name(step)] : undefined;
    if (next === undefined) return `target ${target.text}: no verdict "${name(step)}" here (there are: ${Object.keys(shape).join(', ')}${i === 0 ? ', layers.<id>.…' : ''})`;
    shape = next;
  }
  if (typeof shape !== 'string') return `target ${target.text}: ${target.pathText} is a group of verdicts; name one (${Object.keys(shape).join(', ')})`;
  if (shape === 'word' && typeof target.value === 'number') return `target ${target.text}: ${target.pathText} is given in words; compare it with == and a word`;
  if (shape === 'number' && typeof target.value === 'string') return `target ${target.text}: ${target.pathText} is a number; compare it with a number, got "${target.value}"`;
  return null;
}

/** The value a target reads from a summary: a number, a word, or null when the verdict does not exist. */
export function targetValue(target: Target, summary: Summary): number | string | null {
  const first = target.path[0];
  if (target.path.length === 1 && first?.kind === 'key' && first.key === 'margin_K') {
    const b = summary.binding_layer;
    return b === null ? null : summary.layers[b]?.margin_K ?? null;
  }
  let node: unknown = summary;
  for (const step of target.path) {
    const key = step.kind === 'key' ? step.key : step.index;
    if (typeof node !== 'object' || node === null || !Object.hasOwn(node, key)) return null;
    node = (node as Record<string | number, unknown>)[key];
  }
  return typeof node === 'number' || typeof node === 'string' ? node : null;
}

export interface TargetCheck { readonly met: boolean; readonly value: number | string | null }

/** Whether a summary meets the target; a null verdict fails it. */
export function evaluateTarget(target: Target, summary: Summary): TargetCheck {
  const value = targetValue(target, summary);
  if (value === null) return { met: false, value };
  if (target.op === '==') return { met: value === target.value, value };
  if (typeof value !== 'number' || typeof target.value !== 'number') return { met: false, value };
  const t = target.value;
  const met = target.op === '>=' ? value >= t : target.op === '<=' ? value <= t : target.op === '>' ? value > t : value < t;
  return { met, value };
}

/**
 * How far a value is from meeting a numeric target, in the target's unit: ≤ 0 met, > 0 short by that much. Used by
 * goal seeking to name the best value seen when a target cannot be met; null for words and missing verdicts.
 */
export function shortfall(target: Target, value: number | string | null): number | null {
  if (typeof value !== 'number' || typeof target.value !== 'number') return null;
  if (target.op === '>=' || target.op === '>') return target.value - value;
  if (target.op === '<=' || target.op === '<') return value - target.value;
  return Math.abs(value - target.value);
}

/** A reading as a person reads it: a number at about 6 significant figures, a word as it is, or "none" for null. */
export function readingText(value: number | string | null): string {
  if (value === null) return 'none (the verdict does not exist in this run)';
  return typeof value === 'number' ? formatSignificant(value) : value;
}

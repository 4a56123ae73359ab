/**
 * A parameter sweep: a full grid over one or more inputs of a scenario, one summary-only run per point. Pure: the CLI
 * spreads the points over worker threads and the view over Web Workers, and both call runSweepPoint() here, so a
 * parallel sweep computes exactly what a serial one does.
 *
 * Grid order: the first axis varies slowest, the last fastest (row-major), so point `index` has the inputs
 * values[0][i0], values[1][i1], … with index = ((i0·n1) + i1)·n2 + i2 ….
 * Shards: part K of N (1-based) holds the points whose index ≡ K − 1 (mod N); concatenating every part's rows and
 * sorting them by index gives the whole sweep.
 */
import { formatFieldError } from '../scenario/field-errors.ts';
import type { Problem } from '../physics/problem.ts';
import { assertFinite } from '../observe/result.ts';
import { runProblem, stopSentence } from '../run.ts';
import { parseScenario } from '../scenario/scenario.ts';
import type { Summary } from '../observe/verdict.ts';
import { parsePath, resolveLeaf, setAt, type Outcome, type Resolved } from './scenario-path.ts';

export const sweepDefaults = {
  /** The largest grid a sweep accepts: a typo such as 0:10:100000 should not start hours of work unasked. */
  maxPoints: 1_000_000,
} as const;

export type InputValue = number | string | boolean;

/** One input of the grid: the path as typed, where it leads in the file (one place, or several linked), its values. */
export interface Axis {
  readonly key: string;
  readonly places: readonly Resolved[];
  readonly values: readonly InputValue[];
}

export interface SweepPlan {
  /** The scenario file as parsed JSON, before any change. */
  readonly doc: unknown;
  readonly axes: readonly Axis[];
  /** Number of points in the full grid. */
  readonly count: number;
}

export interface SweepRow {
  readonly index: number;
  readonly inputs: Readonly<Record<string, InputValue>>;
  /** As the `summary` of `run --json`; null when the point failed. */
  readonly summary: (Summary & { readonly warnings: readonly string[] }) | null;
  readonly error: string | null;
}

/** Evenly spaced values FROM…TO, COUNT of them, both ends included (COUNT 1: FROM, which must then equal TO). */
export function linearValues(from: number, to: number, count: number): number[] {
  if (count === 1) return [from];
  return Array.from({ length: count }, (_, i) => (i === count - 1 ? to : from + ((to - from) * i) / (count - 1)));
}

function leaf(doc: unknown, key: string, option: string): Outcome<Resolved> {
  const path = parsePath(key);
  if (!path.ok) return { ok: false, message: `${option} ${path.message}` };
  const r = resolveLeaf(doc, path.value);
  return r.ok ? r : { ok: false, message: `${option} ${r.message}` };
}

/** `KEY=FROM:TO:COUNT` → an axis; refuses a bad path, a non-number, a count that is not a whole number ≥ 1. */
export function parseVary(doc: unknown, text: string): Outcome<Axis> {
  const m = /^([^=]+)=([^:]*):([^:]*):([^:]*)$/.exec(text.trim());
  if (!m) return { ok: false, message: `--vary ${JSON.stringify(text)}: write KEY=FROM:TO:COUNT, e.g. ambient_C=-20:40:7` };
  const [, key, a, b, c] = m as unknown as [string, string, string, string, string];
  const from = Number(a);
  const to = Number(b);
  const count = Number(c);
  const bad = (what: string, got: string, need: string): Outcome<Axis> => ({ ok: false, message: `--vary ${key}: ${what} must be ${need}, got ${JSON.stringify(got)}` });
  if (a.trim() === '' || !Number.isFinite(from)) return bad('FROM', a, 'a number');
  if (b.trim() === '' || !Number.isFinite(to)) return bad('TO', b, 'a number');
  if (!Number.isInteger(count) || count < 1) return bad('COUNT', c, 'a whole number ≥ 1');
  if (count === 1 && from !== to) return { ok: false, message: `--vary ${key}: COUNT 1 takes one value, so FROM must equal TO (got ${a} and ${b}); use --list ${key}=${a} for one value` };
  const place = leaf(doc, key, '--vary');
  if (!place.ok) return place;
  return { ok: true, value: { key, places: [place.value], values: linearValues(from, to, count) } };
}

/** `KEY=a,b,c` → an axis; each value is a number when it reads as one, true/false, or else the text as written. */
export function parseList(doc: unknown, text: string): Outcome<Axis> {
  const eq = text.indexOf('=');
  if (eq <= 0) return { ok: false, message: `--list ${JSON.stringify(text)}: write KEY=a,b,c, e.g. layers.anode.material=magnesium,nickel` };
  const key = text.slice(0, eq).trim();
  const items = text.slice(eq + 1).split(',').map((s) => s.trim());
  if (items.some((s) => s === '')) return { ok: false, message: `--list ${key}: an empty value in ${JSON.stringify(text.slice(eq + 1))}` };
  const place = leaf(doc, key, '--list');
  if (!place.ok) return place;
  const values = items.map((s): InputValue => {
    const v = Number(s);
    return Number.isFinite(v) ? v : s === 'true' ? true : s === 'false' ? false : s;
  });
  return { ok: true, value: { key, places: [place.value], values } };
}

/** A plan from its axes; refuses a repeated key, a grid above the size limit, and a key the format does not know. */
export function planSweep(doc: unknown, axes: readonly Axis[]): Outcome<SweepPlan> {
  if (axes.length === 0) return { ok: false, message: 'nothing to vary: give at least one --vary KEY=FROM:TO:COUNT or --list KEY=a,b,c' };
  const seen = new Set<string>();
  for (const a of axes) {
    for (const p of a.places) {
      if (seen.has(p.concreteText)) return { ok: false, message: `${a.key}: varied twice (it is ${p.concreteText})` };
      seen.add(p.concreteText);
    }
  }
  const count = axes.reduce((n, a) => n * a.values.length, 1);
  if (count > sweepDefaults.maxPoints) return { ok: false, message: `the grid has ${count} points, more than the ${sweepDefaults.maxPoints} a sweep accepts; use fewer values or split it with --shard` };
  const plan: SweepPlan = { doc, axes, count };
  // an absent key the format does not know would fail every point the same way: refuse it now, naming it
  const first = parseScenario(pointScenario(plan, 0));
  if (!first.ok) {
    for (const a of axes) {
      for (const p of a.places) {
        const unknown = first.errors.find((e) => e.path === p.concreteText && e.message.startsWith('unknown key'));
        if (unknown) return { ok: false, message: `${a.key}: ${formatFieldError(unknown)}` };
      }
    }
  }
  return { ok: true, value: plan };
}

/** The grid position of a point: one value index per axis. */
function position(plan: SweepPlan, index: number): number[] {
  const at = new Array<number>(plan.axes.length);
  let rest = index;
  for (let i = plan.axes.length - 1; i >= 0; i--) {
    const n = plan.axes[i]!.values.length;
    at[i] = rest % n;
    rest = Math.floor(rest / n);
  }
  return at;
}

export function pointInputs(plan: SweepPlan, index: number): Record<string, InputValue> {
  const at = position(plan, index);
  return Object.fromEntries(plan.axes.map((a, i) => [a.key, a.values[at[i]!]!]));
}

/** The scenario file of one point: a deep copy of the plan's file with every axis set to its value there. */
export function pointScenario(plan: SweepPlan, index: number): unknown {
  const at = position(plan, index);
  let doc = plan.doc;
  plan.axes.forEach((a, i) => {
    for (const p of a.places) doc = setAt(doc, p, a.values[at[i]!]!);
  });
  return doc;
}

/** A summary-only run of a problem: the verdicts and warnings, or the reason it failed. */
export function runSummary(problem: Problem): { summary: SweepRow['summary']; error: string | null } {
  const out = runProblem(problem, { detail: 'summary' });
  if (out.status === 'ok') {
    const summary = { ...out.summary, warnings: out.record.warnings };
    assertFinite(summary, 'summary'); // JSON would print a NaN as null, a "never" it is not: refuse it (caught as a row error)
    return { summary, error: null };
  }
  if (out.status === 'failed') return { summary: null, error: stopSentence(out) };
  return { summary: null, error: 'the run was cancelled' };
}

/** One point of the sweep, run to its row; an invalid or failed point is a row with its error, never a throw. */
export function runSweepPoint(plan: SweepPlan, index: number): SweepRow {
  const inputs = pointInputs(plan, index);
  try {
    const parsed = parseScenario(pointScenario(plan, index));
    if (!parsed.ok) return { index, inputs, summary: null, error: parsed.errors.map(formatFieldError).join('; ') };
    return { index, inputs, ...runSummary(parsed.problem) };
  } catch (e) {
    return { index, inputs, summary: null, error: `internal error: ${(e as Error).message}` };
  }
}

/** `K/N` → the shard (1 ≤ K ≤ N). */
export function parseShard(text: string): Outcome<{ k: number; n: number }> {
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  const k = Number(m?.[1]);
  const n = Number(m?.[2]);
  if (!m || n < 1 || k < 1 || k > n) return { ok: false, message: `--shard: write K/N with 1 ≤ K ≤ N (part K of N), got ${JSON.stringify(text)}` };
  return { ok: true, value: { k, n } };
}

/** The point indices of part k of n, in increasing order. */
export function shardIndices(count: number, shard: { k: number; n: number } = { k: 1, n: 1 }): number[] {
  const out: number[] = [];
  for (let i = shard.k - 1; i < count; i += shard.n) out.push(i);
  return out;
}

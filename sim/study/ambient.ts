/**
 * The ambient study: the same scenario at a series of ambient temperatures, with the usable window and the binding
 * margin at each, and the stretches of ambient where both pass. A point passes when the run has a usable window of
 * at least `minWindowS` and every layer with a limit keeps at least `marginK` below it (a stack with no limits on
 * file passes the margin check, and says so).
 *
 * The cell starts at the ambient when the file lets it: `initial_C` follows the ambient when it is absent or equal to
 * `ambient_C` in the file; a different `initial_C` is kept (a cell taken out of a store, say). Face fields that name
 * their own `fluid_C` or `surroundings_C` keep them; the rest see the ambient.
 */
import type { Outcome } from './scenario-path.ts';
import { parsePath, resolveLeaf } from './scenario-path.ts';
import { linearValues, planSweep, type SweepPlan, type SweepRow } from './sweep.ts';

export const ambientDefaults = {
  /**
   * −54 °C to +74 °C: the operating range commonly required of military thermal batteries (from memory; check the
   * specification that applies to your cell).
   */
  fromC: -54,
  toC: 74,
  /** 15 points: about 9 K apart over the default range. */
  count: 15,
  /** A margin of a few tens of kelvin is no margin (common practice, no source); 25 K as in the window search. */
  marginK: 25,
  /** Any usable window counts unless a length is asked for. */
  minWindowS: 0,
} as const;

export interface AmbientOptions {
  readonly fromC: number;
  readonly toC: number;
  readonly count: number;
  readonly marginK: number;
  readonly minWindowS: number;
}

export interface AmbientPoint {
  readonly ambient_C: number;
  readonly window_s: number | null;
  readonly window_status: string | null;
  readonly binding_layer: string | null;
  readonly margin_K: number | null;
  readonly pass: boolean;
  readonly error: string | null;
}

export interface AmbientStudy {
  readonly points: readonly AmbientPoint[];
  /** Stretches of consecutive passing points, [first, last] ambient °C; the true edges lie within one spacing. */
  readonly passing: readonly (readonly [number, number])[];
  readonly spacing_K: number;
  /** Whether initial_C followed the ambient. */
  readonly initial_follows: boolean;
}

/** The sweep plan of an ambient study; refuses a range with fewer than one point or a backwards range. */
export function ambientPlan(doc: unknown, opts: AmbientOptions): Outcome<SweepPlan & { initialFollows: boolean }> {
  if (!Number.isInteger(opts.count) || opts.count < 1) return { ok: false, message: `--count: must be a whole number ≥ 1, got ${opts.count}` };
  if (!(opts.fromC <= opts.toC)) return { ok: false, message: `--from/--to: --from must not be above --to, got ${opts.fromC} and ${opts.toC}` };
  if (opts.count === 1 && opts.fromC !== opts.toC) return { ok: false, message: `--count: 1 point needs --from equal to --to, got ${opts.fromC} and ${opts.toC}` };
  const file = doc as { ambient_C?: unknown; initial_C?: unknown };
  const ambient = resolveLeaf(doc, { text: 'ambient_C', steps: [{ kind: 'key', key: 'ambient_C' }] });
  if (!ambient.ok) return ambient;
  const initialFollows = file.initial_C === undefined || file.initial_C === file.ambient_C;
  const places = [ambient.value];
  if (initialFollows && file.initial_C !== undefined) {
    const p = parsePath('initial_C');
    const initial = p.ok ? resolveLeaf(doc, p.value) : p;
    if (!initial.ok) return initial;
    places.push(initial.value);
  }
  const plan = planSweep(doc, [{ key: 'ambient_C', places, values: linearValues(opts.fromC, opts.toC, opts.count) }]);
  return plan.ok ? { ok: true, value: { ...plan.value, initialFollows } } : plan;
}

export function ambientPoint(row: SweepRow, opts: AmbientOptions): AmbientPoint {
  const ambient = row.inputs.ambient_C as number;
  const s = row.summary;
  if (!s) return { ambient_C: ambient, window_s: null, window_status: null, binding_layer: null, margin_K: null, pass: false, error: row.error };
  const margins = Object.values(s.layers).map((l) => l.margin_K).filter((m): m is number => m !== null);
  const margin = margins.length > 0 ? Math.min(...margins) : null;
  const windowOk = s.safe_window_s !== null && s.safe_window_s >= opts.minWindowS;
  const marginOk = margin === null || margin >= opts.marginK;
  return { ambient_C: ambient, window_s: s.safe_window_s, window_status: s.safe_window_status, binding_layer: s.binding_layer, margin_K: margin, pass: windowOk && marginOk, error: row.error };
}

export function ambientStudy(rows: readonly SweepRow[], opts: AmbientOptions, initialFollows: boolean): AmbientStudy {
  const points = [...rows].sort((a, b) => a.index - b.index).map((r) => ambientPoint(r, opts));
  const passing: [number, number][] = [];
  points.forEach((p, i) => {
    if (!p.pass) return;
    if (i > 0 && points[i - 1]!.pass) passing[passing.length - 1]![1] = p.ambient_C;
    else passing.push([p.ambient_C, p.ambient_C]);
  });
  const spacing = opts.count > 1 ? (opts.toC - opts.fromC) / (opts.count - 1) : 0;
  return { points, passing, spacing_K: spacing, initial_follows: initialFollows };
}

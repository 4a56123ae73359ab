/**
 * Messages between the page and the solver worker. Results travel as columnar Float64Arrays, transferred (not
 * copied); the position–time map travels as its flat data plus its shape. `job` ties every reply to its request.
 */
import type { FieldError } from '../sim/index.ts';
import type { RunRecord } from '../sim/index.ts';
import type { Summary } from '../sim/index.ts';

export type ToWorker = { readonly type: 'run'; readonly job: number; readonly scenario: unknown };

export type FromWorker =
  | { readonly type: 'progress'; readonly job: number; readonly t_s: number }
  | {
    readonly type: 'done'; readonly job: number; readonly record: WireRecord; readonly summary: Summary; readonly solveMs: number;
    /** The accuracy the run was solved to, in the terminal table's words (sim/scenario/accuracy.ts accuracyLine). */
    readonly accuracy: string;
  }
  | { readonly type: 'error'; readonly job: number; readonly errors: readonly FieldError[] }
  | {
    readonly type: 'failed'; readonly job: number; readonly message: string;
    /**
     * A run that stopped for a physical reason or at the run-time ceiling: what it recorded up to its last step, the
     * verdicts of that part, and the time it stopped at, s (a numerical stop or an internal error sends none).
     */
    readonly stopped?: { readonly record: WireRecord; readonly summary: Summary; readonly tS: number };
  };

/** A RunRecord with its ndarray map unpacked: `map.data[step * nodes + node]`, °C. */
export interface WireRecord extends Omit<RunRecord, 'map'> {
  readonly map: { readonly data: Float64Array; readonly steps: number; readonly nodes: number };
}

export function toWire(record: RunRecord): { wire: WireRecord; transfer: ArrayBuffer[] } {
  const [steps = 0, nodes = 0] = record.map.shape;
  const data = record.map.data.length === steps * nodes ? record.map.data : Float64Array.from({ length: steps * nodes },
    (_, k) => record.map.get(Math.floor(k / nodes), k % nodes));
  const wire: WireRecord = { ...record, map: { data, steps, nodes } };
  const arrays: Float64Array[] = [wire.tS, wire.bottomC, wire.topC, wire.nodeXMm, data];
  for (const l of wire.layers) arrays.push(l.minC, l.meanC, l.maxC, ...(l.liquidFraction ? [l.liquidFraction] : []));
  if (wire.separator) arrays.push(wire.separator.tS, wire.separator.meltMargin, wire.separator.meanLiquid, wire.separator.freezeMargin);
  const buffers = new Set<ArrayBuffer>();
  for (const a of arrays) if (a.buffer instanceof ArrayBuffer) buffers.add(a.buffer);
  return { wire, transfer: [...buffers] };
}

/** The first non-finite number in the record's series, if any (a guard: the page never draws NaN). */
export function firstNonFinite(record: WireRecord): string | undefined {
  const check = (name: string, a: Float64Array | undefined): string | undefined => {
    if (!a) return undefined;
    for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i]!)) return `${name}[${i}]`;
    return undefined;
  };
  const found = [check('tS', record.tS), check('bottomC', record.bottomC), check('topC', record.topC),
    check('nodeXMm', record.nodeXMm), check('map', record.map.data),
    ...record.layers.flatMap((l) => [check(`${l.id}.min`, l.minC), check(`${l.id}.mean`, l.meanC),
      check(`${l.id}.max`, l.maxC), check(`${l.id}.liquid`, l.liquidFraction)])];
  return found.find((f) => f !== undefined);
}

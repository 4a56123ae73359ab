/**
 * A result on screen: the scenario that produced it (a snapshot, so later edits do not change what the charts mean),
 * the record and summary from the worker, and per layer what the drawing and charts need.
 */
import type { Summary } from '../sim/index.ts';
import { layerColours } from './colours.ts';
import { asList, asNumber, asObject, asString, type JsonObject } from './json.ts';
import { materialInfo, type MaterialInfo } from './materials.ts';
import type { WireRecord } from './protocol.ts';
import { footprintAreaM2 } from './source-units.ts';

export interface LayerView {
  readonly index: number;
  readonly id: string;
  readonly material: MaterialInfo;
  readonly thicknessMm: number;
  readonly bottomMm: number;
  readonly topMm: number;
  readonly separator: boolean;
  readonly colour: string;
}

export interface ShownResult {
  readonly job: number;
  readonly scenario: JsonObject;
  readonly record: WireRecord;
  readonly summary: Summary;
  readonly layers: readonly LayerView[];
  /** Footprint width for the drawing, mm (diameter or width), if given. */
  readonly widthMm: number | undefined;
  readonly areaM2: number | undefined;
  /** The accuracy the run was solved to, in words (the worker's accuracyLine); undefined where none was sent. */
  readonly accuracy?: string;
  /**
   * A run that stopped before its end (a physical reason or the run-time ceiling): when, and the sentence that says
   * why. The record and the verdicts then cover the run up to that time only.
   */
  readonly stopped?: { readonly tS: number; readonly message: string };
}

export function shownResult(job: number, scenario: JsonObject, record: WireRecord, summary: Summary, accuracy?: string,
  stopped?: ShownResult['stopped']): ShownResult {
  let at = 0;
  const idOf = (l: unknown, index: number): string => asString(asObject(l as JsonObject).id) ?? `layer ${index + 1}`;
  const colours = layerColours(asList(scenario.layers).map(idOf));
  const layers = asList(scenario.layers).map((l, index) => {
    const o = asObject(l);
    const thicknessMm = asNumber(o.thickness_mm) ?? 0;
    const id = idOf(l, index);
    const view: LayerView = {
      index, id, material: materialInfo(scenario, asString(o.material) ?? ''),
      thicknessMm, bottomMm: at, topMm: at + thicknessMm, separator: o.separator === true, colour: colours.get(id) ?? '#56616b',
    };
    at += thicknessMm;
    return view;
  });
  const fp = asObject(scenario.footprint);
  return { job, scenario, record, summary, layers, widthMm: asNumber(fp.diameter_mm) ?? asNumber(fp.width_mm), areaM2: footprintAreaM2(scenario),
    ...(accuracy === undefined ? {} : { accuracy }), ...(stopped === undefined ? {} : { stopped }) };
}

/** Index of the recorded step nearest to t (s). */
export function stepNear(tS: Float64Array, t: number): number {
  let best = 0;
  for (let j = 1; j < tS.length; j++) if (Math.abs(tS[j]! - t) < Math.abs(tS[best]! - t)) best = j;
  return best;
}

/** The temperature range of the whole position–time map, °C. */
export function mapRange(record: WireRecord): { lowC: number; highC: number } {
  let lowC = Infinity;
  let highC = -Infinity;
  for (const v of record.map.data) { if (v < lowC) lowC = v; if (v > highC) highC = v; }
  if (!(highC > lowC)) highC = lowC + 1;
  return { lowC, highC };
}

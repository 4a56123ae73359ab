/**
 * A scenario's stated expectations (its `expect` block) held against a run's verdicts, one outcome per statement,
 * each with the value the run gave. The CLI prints them and exits with code 3 when one is not met; the browser view
 * and the HTML report show the same outcomes. Plain data in, plain data out: no printing here.
 *
 * A verdict with no value (null) meets a statement only where the words allow it: "half-frozen after 600 s" is met
 * by a separator that never half-freezes; "molten before 900 s", "half-frozen before", "window at least" and
 * "window at most" are not met by a verdict that has no value (there is nothing to compare).
 */
import { formatMargin, formatTime } from '../observe/format.ts';
import type { ScenarioFile } from './scenario-schema.ts';
import type { Summary } from '../observe/verdict.ts';
import { noValueWords, verdictTerms, windowStatusWords } from '../observe/wording.ts';

export type Expectations = NonNullable<ScenarioFile['expect']>;

export interface ExpectationOutcome {
  /** The key of the `expect` block, with the layer id for a margin ("margin_at_least_K.anode"). */
  readonly key: string;
  /** The statement in words, with its threshold and unit: "separator molten before 900.0 s". */
  readonly statement: string;
  /** What the run gave, in words with its unit: "84.9 s", "never fully molten". */
  readonly actual: string;
  readonly met: boolean;
}

const time = (v: number | null, whenNull: string) => formatTime(v, whenNull);
/** A verdict's term as the subject of a statement: "separator molten" (without its trailing "at"). */
const subject = (term: string): string => term.replace(/ at$/, '');

/** Every statement of the block, in the block's key order; an empty list when there is none. */
export function evaluateExpectations(expect: Expectations | undefined, summary: Summary): ExpectationOutcome[] {
  if (!expect) return [];
  const sep = summary.separator;
  const w = summary.safe_window_s;
  const windowActual = w === null ? windowStatusWords[summary.safe_window_status].label : time(w, '');
  const out: ExpectationOutcome[] = [];
  for (const [key, stated] of Object.entries(expect)) {
    if (stated === undefined) continue;
    switch (key) {
      case 'molten_before_s': {
        const v = sep.molten_at_s;
        out.push({ key, statement: `${subject(verdictTerms.molten_at_s.term)} before ${time(stated as number, '')}`, actual: time(v, noValueWords.molten_at_s), met: v !== null && v < (stated as number) });
        break;
      }
      case 'half_frozen_before_s': {
        const v = sep.half_frozen_at_s;
        out.push({ key, statement: `${subject(verdictTerms.half_frozen_at_s.term)} before ${time(stated as number, '')}`, actual: time(v, noValueWords.half_frozen_at_s), met: v !== null && v < (stated as number) });
        break;
      }
      case 'half_frozen_after_s': {
        const v = sep.half_frozen_at_s;
        out.push({ key, statement: `${subject(verdictTerms.half_frozen_at_s.term)} after ${time(stated as number, '')}`, actual: time(v, noValueWords.half_frozen_at_s), met: v === null || v > (stated as number) });
        break;
      }
      case 'window_at_least_s':
        out.push({ key, statement: `${verdictTerms.safe_window_s.term} at least ${time(stated as number, '')}`, actual: windowActual, met: w !== null && w >= (stated as number) });
        break;
      case 'window_at_most_s':
        out.push({ key, statement: `${verdictTerms.safe_window_s.term} at most ${time(stated as number, '')}`, actual: windowActual, met: w !== null && w <= (stated as number) });
        break;
      case 'window_status': {
        const s = stated as Summary['safe_window_status'];
        out.push({ key, statement: `${verdictTerms.safe_window_s.term} status "${windowStatusWords[s].label}"`, actual: `"${windowStatusWords[summary.safe_window_status].label}"`, met: summary.safe_window_status === s });
        break;
      }
      case 'margin_at_least_K':
        for (const [layer, atLeast] of Object.entries(stated as Record<string, number>)) {
          const found = Object.hasOwn(summary.layers, layer) ? summary.layers[layer] : undefined;
          const m = found ? found.margin_K : null;
          out.push({
            key: `${key}.${layer}`,
            statement: `${layer} ${verdictTerms.margin_K.term} at least ${formatMargin(atLeast, '')}`,
            actual: found ? formatMargin(m, noValueWords.margin_K) : 'no such layer',
            met: m !== null && m >= atLeast,
          });
        }
        break;
      default:
        // a key the schema knows but this module does not: say so rather than pass it silently
        out.push({ key, statement: `${key} = ${JSON.stringify(stated)}`, actual: 'this version cannot evaluate it', met: false });
    }
  }
  return out;
}

/** The outcomes that were not met. */
export const unmet = (outcomes: readonly ExpectationOutcome[]): ExpectationOutcome[] => outcomes.filter((o) => !o.met);

/** How many statements a block makes (each layer of `margin_at_least_K` counts once), without a run. */
export function countExpectations(expect: Expectations | undefined): number {
  if (!expect) return 0;
  return Object.entries(expect).reduce((n, [key, v]) => (v === undefined ? n
    : key === 'margin_at_least_K' ? n + Object.keys(v as Record<string, number>).length : n + 1), 0);
}

/**
 * The cautions that apply to the scenario on screen, beside its verdict: a thin magnesium layer (which can ignite well
 * below the bulk figure the library uses as its limit) and a margin too small to count as one. Pure: takes what a
 * result shows, returns sentences; the verdict view places them.
 */
import type { Summary } from '../sim/index.ts';
import { formatNumber } from './format.ts';
import type { MaterialInfo } from './materials.ts';

export const cautionDefaults = {
  /**
   * A magnesium layer this thin or thinner is treated as "thin" (ribbon, foil, thin sheet), mm. Common practice, no
   * source: ribbon and foil are a few tenths of a millimetre; sheet up to 1 mm heats through like them.
   */
  thinMagnesiumMm: 1,
  /**
   * Ignition of thin magnesium, °C: ribbon/shavings ≈ 510 °C, DOE-HDBK-1081-94 (Primer on Spontaneous Heating and
   * Pyrophoricity), as quoted in the limit note of materials/magnesium.json. Powder ignites lower still.
   */
  thinMagnesiumIgnitionC: 510,
  /**
   * A margin at or below this is "no margin", K. Common practice, no source: library data marked "from memory" are
   * uncertain by 5–20 % and the face correlations are extrapolated for small cells (README, Cautions), which moves
   * a peak of a few hundred °C by tens of kelvin.
   */
  noMarginK: 50,
} as const;

/** What the cautions need to know about a layer. */
export interface CautionLayer {
  readonly id: string;
  readonly thicknessMm: number;
  readonly material: Pick<MaterialInfo, 'name' | 'title'>;
}

export interface Caution {
  /** The layer it is about (its note goes beside that layer's margin), or undefined for the whole scenario. */
  readonly layer: string | undefined;
  readonly kind: 'thin-magnesium' | 'no-margin';
  /** Short, for the note beside the margin. */
  readonly short: string;
  /** The full sentence, for the caution box. */
  readonly sentence: string;
}

/** A magnesium material: the library's `magnesium`, or a file's own material whose name or title says magnesium. */
export const isMagnesium = (m: Pick<MaterialInfo, 'name' | 'title'>): boolean =>
  /magnesium/i.test(m.name) || /magnesium/i.test(m.title);

const kelvin = (k: number): string => `${formatNumber(k, { decimals: 0 })} K`;

export function scenarioCautions(layers: readonly CautionLayer[], summary: Summary): Caution[] {
  const d = cautionDefaults;
  const out: Caution[] = [];
  for (const l of layers) {
    const v = summary.layers[l.id];
    if (isMagnesium(l.material) && l.thicknessMm > 0 && l.thicknessMm <= d.thinMagnesiumMm) {
      const peak = v?.peak_C;
      const left = peak !== undefined && Number.isFinite(peak) ? d.thinMagnesiumIgnitionC - peak : undefined;
      const against = left === undefined ? ''
        : left > 0 ? ` Against ${d.thinMagnesiumIgnitionC} °C its margin is ${kelvin(left)}.`
          : ` Its peak reaches ${d.thinMagnesiumIgnitionC} °C.`;
      out.push({
        layer: l.id, kind: 'thin-magnesium',
        short: `thin magnesium: can ignite near ${d.thinMagnesiumIgnitionC} °C, well below the bulk figure`,
        sentence: `${l.id} is thin magnesium (${formatNumber(l.thicknessMm, { significant: 3 })} mm, at most ${d.thinMagnesiumMm} mm counts as thin: ribbon, foil, `
          + `thin sheet). Thin magnesium can ignite well below the bulk figure of the library: ribbon near `
          + `${d.thinMagnesiumIgnitionC} °C (DOE-HDBK-1081-94), powder lower still.${against}`,
      });
    }
    const m = v?.margin_K;
    if (m !== null && m !== undefined && m > 0 && m <= d.noMarginK && v?.limit) {
      out.push({
        layer: l.id, kind: 'no-margin',
        short: `${kelvin(m)} is no margin (at most ${d.noMarginK} K counts as none)`,
        sentence: `${l.id} comes within ${kelvin(m)} of its ${v.limit.kind} limit (${formatNumber(v.limit.at_C, { decimals: 0 })} °C): treat this as no margin. `
          + `At most ${d.noMarginK} K counts as none (common practice): property data and the face correlations are `
          + 'uncertain by more than that.',
      });
    }
  }
  return out;
}

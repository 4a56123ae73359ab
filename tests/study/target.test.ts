// Target expressions (sim/study/target.ts): parsing, refusal, and how they read a run's summary. The summaries are
// literal objects of the result contract (DESIGN.md, "Result"), so each expected outcome follows from the literal.
import { describe, expect, it } from 'vitest';
import { checkTarget, evaluateTarget, parseTarget, type Target } from '../../sim/study/target.ts';
import type { Summary } from '../../sim/observe/verdict.ts';

const target = (text: string): Target => {
  const t = parseTarget(text);
  if (!t.ok) throw new Error(t.message);
  return t.value;
};

const layer = (peak: number, limitC: number | null) => ({
  peak_C: peak, peak_at_s: 900,
  limit: limitC === null ? null : { kind: 'ignition' as const, at_C: limitC },
  margin_K: limitC === null ? null : limitC - peak,
  limits: [],
});

const summary = (window: number | null): Summary => ({
  heat_off_s: 900,
  separator: { molten_at_s: 85, half_frozen_at_s: window === null ? null : 900 + window, frozen_at_s: null },
  layers: { collector: layer(430, 1455), separator: layer(428, null), anode: layer(393, 650) },
  safe_window_s: window,
  safe_window_status: window === null ? 'still-molten-at-end' : 'ok',
  binding_layer: 'anode',
  energy: { in_J_m2: 1, out_J_m2: 1, stored_J_m2: 0, imbalance_rel: 0 },
} as Summary);

describe('parseTarget()', () => {
  it('reads each operator with spaces or without', () => {
    for (const op of ['>=', '<=', '>', '<', '==']) {
      const t = target(`safe_window_s ${op} 600`);
      expect([t.op, t.value, t.pathText]).toEqual([op, 600, 'safe_window_s']);
    }
    expect(target('layers.anode.margin_K>=25').path).toEqual([{ kind: 'key', key: 'layers' }, { kind: 'key', key: 'anode' }, { kind: 'key', key: 'margin_K' }]);
  });

  it('refuses an expression without a comparison, without a side, with a reversed operator or a word after >=', () => {
    const refusals: [string, string][] = [
      ['safe_window_s', 'no comparison found'],
      ['>=600', 'nothing before >='],
      ['safe_window_s>=', 'nothing after >='],
      ['safe_window_s=>600', 'unknown operator "=>"'],
      ['safe_window_s!=600', 'unknown operator "!="'],
      ['safe_window_s=600', 'unknown operator "="'],
      ['safe_window_s>=long', '>= needs a number, got "long"'],
      ['a>=1>=2', 'more than one comparison'],
    ];
    for (const [text, words] of refusals) {
      const t = parseTarget(text);
      expect(t.ok, text).toBe(false);
      if (!t.ok) expect(t.message).toContain(words);
    }
  });
});

describe('checkTarget()', () => {
  const ids = ['collector', 'separator', 'anode'];
  it('accepts the verdicts of the result contract and the margin_K shorthand', () => {
    for (const t of ['safe_window_s>=600', 'separator.half_frozen_at_s<1200', 'layers.anode.margin_K>=25', 'margin_K>=25', 'layers.anode.limit.at_C>600', 'safe_window_status==ok']) {
      expect(checkTarget(target(t), ids), t).toBeNull();
    }
  });

  it('refuses an unknown verdict, an unknown layer, a group and a word compared with a number', () => {
    expect(checkTarget(target('safe_window>=600'), ids)).toContain('no verdict "safe_window" here (there are: heat_off_s, safe_window_s');
    expect(checkTarget(target('layers.cathode.margin_K>=25'), ids)).toContain('no layer with id "cathode" (ids: collector, separator, anode)');
    expect(checkTarget(target('separator>=1'), ids)).toContain('is a group of verdicts');
    expect(checkTarget(target('safe_window_status>=1'), ids)).toContain('is given in words');
    expect(checkTarget(target('safe_window_s==ok'), ids)).toContain('is a number');
  });
});

describe('evaluateTarget()', () => {
  it('compares the value read from the summary with each operator', () => {
    const s = summary(59.3);
    expect(evaluateTarget(target('safe_window_s>=59.3'), s)).toEqual({ met: true, value: 59.3 });
    expect(evaluateTarget(target('safe_window_s>59.3'), s).met).toBe(false);
    expect(evaluateTarget(target('safe_window_s<=59.3'), s).met).toBe(true);
    expect(evaluateTarget(target('safe_window_s<60'), s).met).toBe(true);
    expect(evaluateTarget(target('safe_window_s==59.3'), s).met).toBe(true);
    expect(evaluateTarget(target('layers.anode.margin_K>=257'), s)).toEqual({ met: true, value: 257 });
    expect(evaluateTarget(target('safe_window_status==ok'), s).met).toBe(true);
  });

  it('reads margin_K as the binding layer\'s margin (650 − 393 = 257 K here)', () => {
    expect(evaluateTarget(target('margin_K>=25'), summary(59.3))).toEqual({ met: true, value: 257 });
  });

  it('fails every comparison on a verdict that does not exist (null), whatever the operator', () => {
    const s = summary(null);
    for (const t of ['safe_window_s>=0', 'safe_window_s<=1e9', 'safe_window_s<1e9', 'layers.separator.margin_K>=-1e9', 'separator.half_frozen_at_s>0']) {
      expect(evaluateTarget(target(t), s), t).toEqual({ met: false, value: null });
    }
  });
});

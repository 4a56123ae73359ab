import { describe, expect, it } from 'vitest';
import { labelDepths, stackProbes } from '../../sim/grid/probes.ts';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';
import { depthListText, parseDepthList } from '../../ui/probes-field.ts';
import demo from '../../examples/bench-coupon.json' with { type: 'json' };

const layers = [{ id: 'collector', thickness_mm: 1 }, { id: 'separator', thickness_mm: 1.5 }, { id: 'anode', thickness_mm: 2 }];

describe('probes', () => {
  it('stackProbes() marks the bottom face, each mid-plane, each interface and the top face', () => {
    // positions by hand: mid-planes at 0.5, 1 + 0.75, 2.5 + 1; interfaces at 1 and 2.5; top at 4.5
    expect(stackProbes(layers)).toEqual([
      { xMm: 0, label: 'bottom face' },
      { xMm: 0.5, label: 'collector mid-plane' },
      { xMm: 1, label: 'collector | separator' },
      { xMm: 1.75, label: 'separator mid-plane' },
      { xMm: 2.5, label: 'separator | anode' },
      { xMm: 3.5, label: 'anode mid-plane' },
      { xMm: 4.5, label: 'top face' },
    ]);
  });

  it('labelDepths() names the layer or face a chosen depth falls on', () => {
    expect(labelDepths([0, 1, 2, 4.5], layers).map((p) => p.label)).toEqual(['bottom face', 'collector | separator', 'in separator', 'top face']);
  });

  it('parseScenarioText() gives the demo, and a thinner copy of it, probes that stay inside the stack', () => {
    for (const anodeMm of [2, 1, 0.2]) {
      const s = structuredClone(demo) as { layers: { thickness_mm: number }[]; output?: { probes_mm?: number[] } };
      s.layers[2]!.thickness_mm = anodeMm;
      expect(s.output?.probes_mm).toBeUndefined();
      const parsed = parseScenarioText(JSON.stringify(s));
      if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
      const top = 1 + 1.5 + anodeMm;
      expect(Math.max(...parsed.problem.probesM) * 1000).toBeCloseTo(top, 12);
      expect(parsed.problem.probeLabels).toHaveLength(parsed.problem.probesM.length);
    }
  });

  it('a probe depth the user set outside the stack is refused by name', () => {
    const s = structuredClone(demo) as { output: { probes_mm?: number[] } };
    s.output.probes_mm = [0, 9];
    const parsed = parseScenarioText(JSON.stringify(s));
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.errors.map((e) => e.path)).toEqual(['output.probes_mm[1]']);
  });

  it('parseDepthList() reads a typed list, keeps a non-number as typed, and empty means "follow the layers"', () => {
    expect(parseDepthList('0, 1.5; 3  4')).toEqual([0, 1.5, 3, 4]);
    expect(parseDepthList('0, deep')).toEqual([0, 'deep']);
    expect(parseDepthList('  ')).toBeUndefined();
    expect(depthListText([0, 1.5, 'deep'])).toBe('0, 1.5, deep');
  });
});

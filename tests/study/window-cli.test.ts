// `freezeline window` from the outside: the JSON answers with their keys, the operating chart as CSV (one row per
// run, RFC 4180), and bad flags refused with exit code 2 and a message naming the flag and the value.

import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { freezeline } from '../support/cli.ts';
import { demoOnPlate } from '../support/scenarios.ts';

describe('freezeline window', () => {
  const dir = mkdtempSync(join(tmpdir(), 'freezeline-window-'));
  const hot = join(dir, 'hot.json');
  writeFileSync(hot, JSON.stringify(demoOnPlate(800)));

  it('window --json gives the longest and shortest hold, the window, the binding constraint and the solve count', () => {
    const csv = join(dir, 'chart.csv');
    const r = freezeline('window', hot, '--json', '--csv', csv);
    expect(r.code, r.err).toBe(0);
    const doc = JSON.parse(r.out) as Record<string, unknown> & { binding: { layer: string; kind: string; at_s: number }; points: unknown[] };
    for (const key of ['longest_hold_s', 'shortest_hold_s', 'window_s', 'binding', 'solves', 'safe_intervals', 'points']) expect(doc).toHaveProperty(key);
    expect(doc.binding.layer).toBe('anode');
    expect(doc.binding.kind).toBe('ignition');
    expect(doc.longest_hold_s as number).toBeGreaterThan(doc.shortest_hold_s as number);
    // the CSV has a header and one row per run, and the rows are the JSON's points in the same order
    const lines = readFileSync(csv, 'utf8').trimEnd().split('\r\n');
    expect(lines[0]).toMatch(/^hold_s,smallest_margin_K,binding_layer,binding_limit,/);
    expect(lines).toHaveLength(1 + doc.points.length);
    expect(lines.join('\n')).not.toMatch(/NaN|Infinity/);
    const firstHold = Number(lines[1]!.split(',')[0]);
    assertClose(firstHold, 0, { abs: 0 }, 'first row: the shortest hold of the range, s');
  });

  it('window refuses a bad --margin-K, --until-liquid or --vary with exit code 2, naming the flag and the value', () => {
    const cases: [string[], RegExp][] = [
      [['--margin-K', '-3'], /--margin-K: must be a number ≥ 0, got "-3"/],
      [['--until-liquid', '1.5'], /--until-liquid: must be a liquid fraction between 0 and 1 \(exclusive\), got "1.5"/],
      [['--vary', 'colour'], /--vary: must be time or power, got "colour"/],
      [['--hold', '99999'], /outside the range of bottom\[1\]\.from_s/],
    ];
    for (const [flags, message] of cases) {
      const r = freezeline('window', hot, ...flags);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(message);
    }
  });
});

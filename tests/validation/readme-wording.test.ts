// The README's verdict tables are the wording table (sim/observe/wording.ts) written out: every key, term, definition and
// no-value wording appears there exactly once and the same, so the page a reader opens first says what the CLI, the
// report and the view say. The README is parsed as Markdown table rows, independently of how it was written.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { scenarioSchema } from '../../sim/scenario/scenario-schema.ts';
import { noValueWords, verdictTerms, windowStatusWords } from '../../sim/observe/wording.ts';

const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');

/** Rows of every Markdown table whose first cell is a `code` key: key → the other cells. */
function tableRows(text: string): Map<string, string[]> {
  const rows = new Map<string, string[]>();
  for (const line of text.split('\n')) {
    const m = /^\| `([A-Za-z_-]+)` \|(.*)\|$/.exec(line);
    if (!m) continue;
    rows.set(m[1]!, m[2]!.split(' | ').map((c) => c.trim()));
  }
  return rows;
}

describe('README.md verdict tables', () => {
  const rows = tableRows(readme);

  it('list every verdict of sim/observe/wording.ts with its term, definition and no-value words', () => {
    const nv = noValueWords as Readonly<Record<string, string>>;
    for (const [key, t] of Object.entries(verdictTerms)) {
      const row = rows.get(key);
      expect(row, `README row for ${key}`).toBeDefined();
      expect(row![0]).toBe(t.term);
      expect(row![1]).toBe(t.definition);
      if (nv[key] !== undefined) expect(row![2]).toBe(nv[key]);
    }
  });

  it('list every usable-window status the scenario format knows, in the words of sim/observe/wording.ts', () => {
    const statuses = scenarioSchema.shape.expect.unwrap().shape.window_status.unwrap().options;
    expect(Object.keys(windowStatusWords).sort()).toEqual([...statuses].sort());
    for (const [status, w] of Object.entries(windowStatusWords)) {
      expect(rows.get(status), `README row for ${status}`).toEqual([w.label, w.sentence]);
    }
  });

  it('use only the chosen terms, not the words they replaced', () => {
    // the choices recorded at the top of sim/observe/wording.ts
    const section = readme.slice(readme.indexOf('## What the verdicts mean'), readme.indexOf('## Cautions'));
    expect(section).not.toMatch(/heater removed|safe window|\bnodes?\b|never s\b|undetermined/);
  });
});

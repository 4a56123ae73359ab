// The strict JSON reader (sim/scenario/json-text.ts) against the platform's own JSON.parse (ECMA-262 §25.5.1, the reference
// implementation of RFC 8259 at hand): the same value for every valid text, a refusal for every text JSON.parse
// refuses. Beyond JSON.parse: keys given twice, line and column of a syntax error, a leading byte-order mark.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lineColumn, readJsonText } from '../../sim/scenario/json-text.ts';

/** Generous limits: the grammar tests must not meet them. */
const WIDE = { maxChars: 1e8, maxDepth: 1000 };

function jsonParseOk(text: string): boolean {
  try { JSON.parse(text); return true; } catch { return false; }
}

describe('readJsonText()', () => {
  it('readJsonText() gives the value JSON.parse gives, for random JSON text compact and indented', () => {
    fc.assert(fc.property(fc.jsonValue(), fc.constantFrom(undefined, 2, '\t'), (value, indent) => {
      const text = JSON.stringify(value, null, indent);
      const read = readJsonText(text, WIDE);
      expect(read.ok).toBe(true);
      // toStrictEqual tells -0 from 0 and an own "__proto__" key from a prototype
      if (read.ok) expect(read.value).toStrictEqual(JSON.parse(text));
    }), { numRuns: 300, seed: 20261202 });
  });

  it('readJsonText() refuses exactly the texts JSON.parse refuses, on valid JSON with one character cut or inserted', () => {
    const mutated = fc.tuple(fc.json(), fc.nat(), fc.constantFrom('', ',', '}', ']', '"', ':', '\\', '0', '-', '.', 'e', ' ', '\n', '\u0001'))
      .map(([text, at, insert]) => {
        const i = at % (text.length + 1);
        return insert === '' ? text.slice(0, i) + text.slice(i + 1) : text.slice(0, i) + insert + text.slice(i);
      });
    fc.assert(fc.property(mutated, (text) => {
      const read = readJsonText(text, WIDE);
      // a cut can leave two sibling keys equal: JSON.parse keeps the last one, this reader refuses the file
      const duplicateOnly = !read.ok && read.errors.every((e) => e.path !== '(file)');
      expect(read.ok || duplicateOnly, `${JSON.stringify(text)}: ${JSON.stringify(read)}`).toBe(jsonParseOk(text));
    }), { numRuns: 2000, seed: 7 });
  });

  it('readJsonText() names the line and column of a syntax error, counted by hand', () => {
    // line 3 is `  "b": 2 x`; the stray x is its 10th character
    const read = readJsonText('{\n  "a": 1,\n  "b": 2 x\n}', WIDE);
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.errors).toHaveLength(1);
      expect(read.errors[0]!.path).toBe('(file)');
      expect(read.errors[0]!.message).toContain('line 3, column 10');
      expect(read.errors[0]!.message).toContain('got "x"');
    }
    expect(lineColumn('ab\ncd\nef', 7)).toEqual({ line: 3, column: 2 });
  });

  it('readJsonText() says in words what a trailing comma, a comment, single quotes and an unclosed text are', () => {
    const says = (text: string) => { const r = readJsonText(text, WIDE); return r.ok ? '' : r.errors[0]!.message; };
    expect(says('{"a": 1,}')).toContain('comma after the last entry');
    expect(says('[1, 2,]')).toContain('comma after the last entry');
    expect(says('{"a": 1 // note\n}')).toContain('no comments');
    expect(says("{'a': 1}")).toContain('double quotes');
    expect(says('{"a": "open')).toContain('never closed');
    expect(says('{"a": 1}\u00a0')).toContain('U+00A0');
    // UTF-16LE bytes of `{"a"` read as UTF-8, and a Latin-1 "°" (0xB0) decoded by TextDecoder as U+FFFD
    expect(says(Buffer.from('{"a": 1}', 'utf16le').toString('utf8'))).toContain('saved as UTF-16');
    expect(says(new TextDecoder().decode(Uint8Array.of(0x7b, 0x22, 0x61, 0x22, 0x3a, 0xb0, 0x7d)))).toContain('not UTF-8');
  });

  it('readJsonText() refuses a key given twice in one object, naming its path and both lines', () => {
    const text = '{\n  "layers": [\n    { "id": "a",\n      "id": "b" }\n  ],\n  "duration_s": -5,\n  "duration_s": 1200\n}';
    const read = readJsonText(text, WIDE);
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.errors.map((e) => e.path)).toEqual(['layers[0].id', 'duration_s']);
      expect(read.errors[0]!.message).toContain('lines 3 and 4');
      expect(read.errors[1]!.message).toContain('lines 6 and 7');
    }
    // the same key in two different objects is no duplicate
    expect(readJsonText('[{"a": 1}, {"a": 2}]', WIDE).ok).toBe(true);
  });

  it('readJsonText() skips a leading UTF-8 byte-order mark (RFC 8259 §8.1) and names one met elsewhere', () => {
    const plain = '{"a": [1, 2]}';
    const read = readJsonText(`\uFEFF${plain}`, WIDE);
    expect(read).toEqual({ ok: true, value: JSON.parse(plain) });
    const inside = readJsonText(`{\uFEFF"a": 1}`, WIDE);
    expect(inside.ok).toBe(false);
    if (!inside.ok) expect(inside.errors[0]!.message).toMatch(/column 2: .*U\+FEFF \(a byte-order mark/);
    // columns on the first line are counted as an editor shows them, without the hidden mark
    const late = readJsonText('\uFEFF{"a" 1}', WIDE);
    if (!late.ok) expect(late.errors[0]!.message).toContain('line 1, column 6');
    expect(late.ok).toBe(false);
  });

  it('readJsonText() makes "__proto__" an own key, as JSON.parse does, and leaves Object.prototype alone', () => {
    const read = readJsonText('{"__proto__": {"polluted": 1}}', WIDE);
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(Object.hasOwn(read.value as object, '__proto__')).toBe(true);
      expect(Object.getPrototypeOf(read.value)).toBe(Object.prototype);
    }
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('readJsonText() refuses nesting past its limit and text past its length, in one message each, without a stack overflow', () => {
    const deep = readJsonText('['.repeat(100_000) + ']'.repeat(100_000), { maxChars: 1e6, maxDepth: 32 });
    expect(deep.ok).toBe(false);
    if (!deep.ok) expect(deep.errors[0]!.message).toContain('deeper than 32 levels');
    const long = readJsonText(`"${'x'.repeat(3 * 2 ** 20)}"`, { maxChars: 2 ** 20, maxDepth: 32 });
    expect(long.ok).toBe(false);
    if (!long.ok) expect(long.errors[0]!.message).toBe('is too long: at most 1.00 MB of text, got 3.00 MB');
  });
});

/**
 * Reading JSON text strictly, for people: the grammar of RFC 8259 (ECMA-404), plus three things `JSON.parse` does not
 * do. A key given twice in one object is refused (RFC 8259 §4 leaves its meaning open: the file is ambiguous), naming
 * the key's path and both lines. A syntax error says its line and column and what was found, in words. A UTF-8
 * byte-order mark at the start is accepted and skipped (RFC 8259 §8.1 lets a parser ignore it).
 *
 * A hand-written recursive-descent scanner rather than a library: the maintained JSON parsers with positions build
 * objects by assignment, so a key `__proto__` would set the object's prototype instead of becoming a key (as it does
 * with `JSON.parse`, which this reader matches value for value: tests/unit/json-text.test.ts).
 */
import { formatPath, type FieldError } from './field-errors.ts';

export interface JsonTextLimits {
  /** Longest text read, in UTF-16 code units. */
  readonly maxChars: number;
  /** Deepest nesting of objects and lists. */
  readonly maxDepth: number;
}

export type JsonTextResult = { readonly ok: true; readonly value: unknown } | { readonly ok: false; readonly errors: FieldError[] };

const BOM = 0xfeff;

/** A syntax error: where, and the words for it. Thrown inside the scanner only, caught by readJsonText. */
class Stop {
  constructor(readonly at: number, readonly message: string) {}
}

/** How a character looks in a message: printable ones quoted, invisible ones by their code point. */
function showChar(text: string, at: number): string {
  if (at >= text.length) return 'the end of the text';
  const code = text.codePointAt(at)!;
  const hex = `U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
  if (code === BOM) return `${hex} (a byte-order mark, invisible in most editors)`;
  // what a UTF-16 file or a file in a legacy code page looks like once decoded as UTF-8
  if (code === 0) return `${hex} (a zero byte: is the file saved as UTF-16? save it as UTF-8)`;
  if (code === 0xfffd) return `${hex} (bytes that are not UTF-8: save the file as UTF-8)`;
  if (code < 0x20 || (code >= 0x7f && code < 0xa0) || code === 0x2028 || code === 0x2029) return `${hex} (an invisible control character)`;
  if (code === 0xa0 || code === 0x200b) return `${hex} (an invisible space)`;
  const ch = String.fromCodePoint(code);
  if (ch === "'") return `"'" (JSON text is written in double quotes)`;
  if (ch === '"') return 'a double quote';
  if (ch === '/') return '"/" (JSON allows no comments)';
  return JSON.stringify(ch);
}

/** 1-based line and column (in characters) of an offset. */
export function lineColumn(text: string, at: number): { line: number; column: number } {
  let line = 1;
  let start = 0;
  for (let i = text.indexOf('\n'); i !== -1 && i < at; i = text.indexOf('\n', i + 1)) {
    line++;
    start = i + 1;
  }
  return { line, column: at - start + 1 };
}

/** Lines of many offsets at once: one pass over the text, then a binary search per offset. */
function lineFinder(text: string): (at: number) => number {
  let starts: number[] | undefined;
  return (at) => {
    if (!starts) {
      starts = [0];
      for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) starts.push(i + 1);
    }
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid]! <= at) lo = mid; else hi = mid - 1;
    }
    return lo + 1;
  };
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const PLAIN_STRING = /[^"\\\u0000-\u001f]*/y;
const ESCAPE = /\\(?:["\\/bfnrt]|u[0-9a-fA-F]{4})/y;

function scan(text: string, start: number, limits: JsonTextLimits): { value: unknown; duplicates: { path: string; first: number; again: number }[] } {
  let i = start;
  const path: (string | number)[] = [];
  const duplicates: { path: string; first: number; again: number }[] = [];

  const space = (): void => {
    for (let c = text.charCodeAt(i); c === 0x20 || c === 0x0a || c === 0x0d || c === 0x09; c = text.charCodeAt(++i));
  };

  const string = (): string => {
    const open = i++;
    let out = '';
    for (;;) {
      PLAIN_STRING.lastIndex = i;
      PLAIN_STRING.test(text);
      out += text.slice(i, PLAIN_STRING.lastIndex);
      i = PLAIN_STRING.lastIndex;
      const c = text.charCodeAt(i);
      if (c === 0x22) { i++; return out; }
      if (i >= text.length) throw new Stop(open, 'this text in double quotes is never closed');
      if (c !== 0x5c) throw new Stop(i, `a line break or control character must be escaped inside text in double quotes, got ${showChar(text, i)}`);
      ESCAPE.lastIndex = i;
      if (!ESCAPE.test(text)) throw new Stop(i, `unknown escape after "\\", got ${showChar(text, i + 1)} (known: \\" \\\\ \\/ \\b \\f \\n \\r \\t \\uXXXX)`);
      out += JSON.parse(`"${text.slice(i, ESCAPE.lastIndex)}"`) as string;
      i = ESCAPE.lastIndex;
    }
  };

  const value = (): unknown => {
    space();
    const c = text[i];
    if (c === '{' || c === '[') {
      if (path.length >= limits.maxDepth) throw new Stop(i, `nested deeper than ${limits.maxDepth} levels (a scenario needs fewer than 10)`);
      return c === '{' ? object() : list();
    }
    if (c === '"') return string();
    NUMBER.lastIndex = i;
    if (NUMBER.test(text)) {
      const n = Number(text.slice(i, NUMBER.lastIndex));
      i = NUMBER.lastIndex;
      return n;
    }
    for (const [word, v] of [['true', true], ['false', false], ['null', null]] as const) {
      if (text.startsWith(word, i)) { i += word.length; return v; }
    }
    throw new Stop(i, `expected a value (a number, text in double quotes, true, false, null, an object or a list), got ${showChar(text, i)}`);
  };

  const object = (): Record<string, unknown> => {
    i++;
    const out: Record<string, unknown> = {};
    const seen = new Map<string, number>();
    space();
    if (text[i] === '}') { i++; return out; }
    for (;;) {
      space();
      if (text[i] !== '"') {
        const trailing = text[i] === '}' ? ' (a comma after the last entry is not allowed in JSON)' : '';
        throw new Stop(i, `expected a key in double quotes, got ${showChar(text, i)}${trailing}`);
      }
      const keyAt = i;
      const key = string();
      space();
      if (text[i] !== ':') throw new Stop(i, `expected ":" after the key ${JSON.stringify(key)}, got ${showChar(text, i)}`);
      i++;
      path.push(key);
      const first = seen.get(key);
      if (first !== undefined) duplicates.push({ path: formatPath(path), first, again: keyAt });
      else seen.set(key, keyAt);
      // own property, as JSON.parse makes it: plain assignment of `__proto__` would set the prototype instead
      Object.defineProperty(out, key, { value: value(), enumerable: true, writable: true, configurable: true });
      path.pop();
      space();
      if (text[i] === ',') { i++; continue; }
      if (text[i] === '}') { i++; return out; }
      const missing = text[i] === '"' ? ' (is a comma missing before the next key?)' : '';
      throw new Stop(i, `expected "," or "}" after the value of ${JSON.stringify(key)}, got ${showChar(text, i)}${missing}`);
    }
  };

  const list = (): unknown[] => {
    i++;
    const out: unknown[] = [];
    space();
    if (text[i] === ']') { i++; return out; }
    for (;;) {
      path.push(out.length);
      space();
      if (text[i] === ']') throw new Stop(i, 'expected a value, got "]" (a comma after the last entry is not allowed in JSON)');
      out.push(value());
      path.pop();
      space();
      if (text[i] === ',') { i++; continue; }
      if (text[i] === ']') { i++; return out; }
      throw new Stop(i, `expected "," or "]" after an entry of a list, got ${showChar(text, i)}`);
    }
  };

  const v = value();
  space();
  if (i < text.length) throw new Stop(i, `expected the end of the text after the value, got ${showChar(text, i)}`);
  return { value: v, duplicates };
}

/**
 * Reads JSON text: the value exactly as `JSON.parse` gives it, or errors. A syntax error is one `(file)` error with
 * its line and column; every key given twice is one error at that key's path, with both lines.
 */
export function readJsonText(text: string, limits: JsonTextLimits): JsonTextResult {
  if (text.length > limits.maxChars) {
    const mb = (n: number) => `${(n / 2 ** 20).toPrecision(3)} MB`;
    return { ok: false, errors: [{ path: '(file)', message: `is too long: at most ${mb(limits.maxChars)} of text, got ${mb(text.length)}` }] };
  }
  const start = text.charCodeAt(0) === BOM ? 1 : 0;
  try {
    const { value, duplicates } = scan(text, start, limits);
    if (duplicates.length === 0) return { ok: true, value };
    const lineOf = lineFinder(text);
    return {
      ok: false,
      errors: duplicates.map((d) => ({
        path: d.path,
        message: `this key is given twice in the same object (lines ${lineOf(d.first)} and ${lineOf(d.again)}); the file is ambiguous, keep one`,
      })),
    };
  } catch (e) {
    if (!(e instanceof Stop)) throw e;
    const { line, column } = lineColumn(text, e.at);
    // columns are counted as an editor shows them: the byte-order mark it hides is not one
    return { ok: false, errors: [{ path: '(file)', message: `is not valid JSON: line ${line}, column ${line === 1 ? column - start : column}: ${e.message}` }] };
  }
}

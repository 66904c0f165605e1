/**
 * A strict, iterative check of JSON text before `JSON.parse` turns it into values. It gives what `JSON.parse`
 * does not: the line and column of a syntax error in words a user can act on, a clear "the file ends early"
 * for truncated files, and refusals of what is legal JSON but unsafe or ambiguous for a design file: nesting
 * deeper than the limit, overlong lists, duplicate keys (JSON.parse silently keeps the last one), `__proto__`
 * keys and `constructor.prototype` (prototype pollution when records are copied), and numbers too large to be
 * finite (`1e309` parses to Infinity). Being iterative, it cannot overflow the stack on deep input.
 *
 * Grammar: ECMA-404 / RFC 8259.
 */
import { DESIGN_LIMITS } from './limits.ts';

export interface ScanProblem {
  /** 0-based offset into the text. */
  offset: number;
  line: number;
  column: number;
  expected: string;
  found: string;
  /** True when the text ended before the JSON was complete. */
  truncated: boolean;
}

interface Frame { kind: 'object' | 'array'; keys: Set<string> | null; count: number; key: string | null }

const WS = new Set([0x20, 0x09, 0x0a, 0x0d]);

export function scanJson(text: string, limits: { depth: number; listItems: number } = DESIGN_LIMITS): ScanProblem | null {
  const n = text.length;
  let i = 0;
  const stack: Frame[] = [];
  // What the scanner wants next.
  type Want = 'value' | 'key-or-end' | 'key' | 'colon' | 'comma-or-end' | 'done';
  let want: Want = 'value' as Want;
  let lastKey: string | null = null;

  const fail = (offset: number, expected: string, foundText?: string): ScanProblem => {
    let line = 1, col = 1;
    for (let k = 0; k < offset && k < n; k++) { if (text.charCodeAt(k) === 0x0a) { line++; col = 1; } else col++; }
    const truncated = offset >= n;
    return { offset, line, column: col, expected, truncated, found: foundText ?? (truncated ? 'the end of the file' : describeChar(text, offset)) };
  };

  const skipWs = () => { while (i < n && WS.has(text.charCodeAt(i))) i++; };

  /** Scans a string starting at the opening quote; returns the end offset (after the closing quote) or a problem. */
  const scanString = (): number | ScanProblem => {
    let k = i + 1;
    while (k < n) {
      const c = text.charCodeAt(k);
      if (c === 0x22) return k + 1;
      if (c === 0x5c) {
        const e = text[k + 1];
        if (e === undefined) return fail(n, 'the rest of a text value');
        if (e === 'u') {
          const hex = text.slice(k + 2, k + 6);
          if (hex.length < 4) return fail(n, 'the rest of a text value');
          if (!/^[0-9a-fA-F]{4}$/.test(hex)) return fail(k, 'a \\u escape with four hex digits', JSON.stringify(text.slice(k, k + 6)));
          k += 6; continue;
        }
        if (!'"\\/bfnrt'.includes(e)) return fail(k, 'a valid escape (\\" \\\\ \\/ \\b \\f \\n \\r \\t \\uXXXX)', JSON.stringify(text.slice(k, k + 2)));
        k += 2; continue;
      }
      if (c < 0x20) return fail(k, 'no raw control characters inside a text value (write them as escapes)', describeChar(text, k));
      k++;
    }
    return fail(n, 'a closing quote of a text value');
  };

  const scanNumber = (): number | ScanProblem => {
    const m = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
    m.lastIndex = i;
    const r = m.exec(text);
    if (!r || r[0].length === 0 || r[0] === '-') return fail(i, 'a value (an object, list, text, number, true, false or null)');
    const end = i + r[0].length;
    // A number cut short by the end of the file ("1." or "1e") is a truncation.
    const next = text[end];
    if (next === '.' || next === 'e' || next === 'E') {
      return end + 1 >= n ? fail(n, 'the rest of a number') : fail(end, 'digits in a number');
    }
    if (!Number.isFinite(Number(r[0]))) return fail(i, 'a number that fits a double (magnitude below 1.8e308)', r[0].length > 24 ? r[0].slice(0, 21) + '...' : r[0]);
    return end;
  };

  const valueDone = () => {
    if (stack.length === 0) want = 'done';
    else want = 'comma-or-end';
  };

  while (true) {
    skipWs();
    if (want === 'done') {
      if (i < n) return fail(i, 'the end of the file after the design object');
      return null;
    }
    if (i >= n) {
      const top = stack[stack.length - 1];
      const expected = want === 'value' && stack.length === 0 ? 'a JSON value' : top?.kind === 'object' ? 'the rest of an object' : 'the rest of a list';
      return fail(n, expected);
    }
    const c = text[i]!;
    switch (want) {
      case 'value': {
        if (c === '{' || c === '[') {
          if (stack.length >= limits.depth) return fail(i, `nesting at most ${limits.depth} levels deep`, `a deeper ${c === '{' ? 'object' : 'list'}`);
          const parent = stack[stack.length - 1];
          const key = parent?.kind === 'object' ? lastKey : null;
          stack.push({ kind: c === '{' ? 'object' : 'array', keys: c === '{' ? new Set() : null, count: 0, key });
          i++;
          want = c === '{' ? 'key-or-end' : 'value';
          if (c === '[') {
            // An empty list closes at once.
            skipWs();
            if (text[i] === ']') { stack.pop(); i++; valueDone(); }
          }
          continue;
        }
        const top = stack[stack.length - 1];
        if (top?.kind === 'array' && ++top.count > limits.listItems) return fail(i, `at most ${limits.listItems} items in one list`, 'more');
        if (c === '"') { const r = scanString(); if (typeof r !== 'number') return r; i = r; valueDone(); continue; }
        if (c === '-' || (c >= '0' && c <= '9')) { const r = scanNumber(); if (typeof r !== 'number') return r; i = r; valueDone(); continue; }
        let lit = false;
        for (const word of ['true', 'false', 'null']) {
          if (text.startsWith(word, i)) { i += word.length; lit = true; break; }
          if (n - i < word.length && word.startsWith(text.slice(i))) return fail(n, `the rest of ${word}`);
        }
        if (lit) { valueDone(); continue; }
        if (c === 'N' && text.startsWith('NaN', i)) return fail(i, 'a number (JSON has no NaN)', 'NaN');
        if (c === 'I' && text.startsWith('Infinity', i)) return fail(i, 'a finite number (JSON has no Infinity)', 'Infinity');
        if (c === "'") return fail(i, 'a value; text is written in double quotes in JSON');
        return fail(i, stack.length === 0 ? 'a JSON value: a design file starts with {' : 'a value (an object, list, text, number, true, false or null)');
      }
      case 'key-or-end':
      case 'key': {
        if (c === '}' && want === 'key-or-end') { stack.pop(); i++; valueDone(); continue; }
        if (c !== '"') return fail(i, want === 'key' ? 'a field name in double quotes (no comma before a closing brace)' : 'a field name in double quotes or }');
        const r = scanString(); if (typeof r !== 'number') return r;
        const key = JSON.parse(text.slice(i, r)) as string;
        const top = stack[stack.length - 1]!;
        if (key === '__proto__') return fail(i, 'no field named __proto__ (refused: it could alter objects when the file is loaded)', '"__proto__"');
        if (key === 'prototype' && top.key === 'constructor') return fail(i, 'no constructor.prototype field (refused: it could alter objects when the file is loaded)', '"prototype"');
        if (top.keys!.has(key)) return fail(i, `each field once per object; "${key.length > 40 ? key.slice(0, 37) + '...' : key}" appears twice`, 'a duplicate field name');
        if (top.keys!.size >= limits.listItems) return fail(i, `at most ${limits.listItems} fields in one object`, 'more');
        top.keys!.add(key);
        lastKey = key;
        i = r;
        want = 'colon';
        continue;
      }
      case 'colon':
        if (c !== ':') return fail(i, 'a colon after the field name');
        i++; want = 'value'; continue;
      case 'comma-or-end': {
        const top = stack[stack.length - 1]!;
        const close = top.kind === 'object' ? '}' : ']';
        if (c === ',') { i++; want = top.kind === 'object' ? 'key' : 'value'; if (top.kind === 'array') { skipWs(); if (text[i] === ']') return fail(i, 'a value after the comma (no comma before a closing bracket)'); } continue; }
        if (c === close) { stack.pop(); i++; valueDone(); continue; }
        return fail(i, `a comma or ${close}`);
      }
    }
  }
}

function describeChar(text: string, offset: number): string {
  const c = text.charCodeAt(offset);
  if (c === 0) return 'a NUL byte';
  if (c < 0x20) return `control character U+${c.toString(16).padStart(4, '0').toUpperCase()}`;
  return JSON.stringify(text.slice(offset, offset + 12)) + (text.length > offset + 12 ? '...' : '');
}

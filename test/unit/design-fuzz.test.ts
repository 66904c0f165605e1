/**
 * Property tests of the loader (the project's own rule, fast-check): whatever the text, parseDesign returns a result,
 * never throws and never falls into its internal-error net; what it accepts saves and loads back identically.
 * The seed is fixed so a failure replays; FC_SEED overrides it for a random run.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, serializeDesign } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const FILES = readdirSync(EX).filter((f) => f.endsWith('.json')).map((f) => readFileSync(join(EX, f), 'utf8'));
const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : 20261201;

function clean(text: string): void {
  const r = parseDesign(text);
  if (r.ok) {
    const out = serializeDesign(r.doc);
    const again = parseDesign(out);
    expect(again.ok).toBe(true);
    if (again.ok) expect(serializeDesign(again.doc)).toBe(out);
  } else {
    expect(r.errors.length).toBeGreaterThan(0);
    for (const e of r.errors) {
      expect(e.message).not.toMatch(/internal error/);
      expect(e.message.length).toBeGreaterThan(10);
      expect(typeof e.path).toBe('string');
    }
  }
}

type Edit = { at: number; del: number; ins: string };
const edit = fc.record({ at: fc.nat(), del: fc.nat({ max: 8 }), ins: fc.string({ maxLength: 6, unit: fc.constantFrom(...'{}[]",:0123456789.-eE tnfrul\\\u0000\uFFFDµ'.split('')) }) });

function mutate(text: string, edits: Edit[]): string {
  let t = text;
  for (const e of edits) {
    const at = e.at % (t.length + 1);
    t = t.slice(0, at) + e.ins + t.slice(at + e.del);
  }
  return t;
}

describe('loader never crashes', () => {
  it('random byte edits of valid example files', () => {
    fc.assert(fc.property(fc.nat({ max: FILES.length - 1 }), fc.array(edit, { minLength: 1, maxLength: 4 }), (k, edits) => clean(mutate(FILES[k]!, edits))), { seed: SEED, numRuns: 400 });
  });
  it('random values put at random places of a valid design', () => {
    const paths = (v: unknown, p: (string | number)[] = [], out: (string | number)[][] = []) => {
      out.push(p);
      if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) paths(x, [...p, Array.isArray(v) ? Number(k) : k], out);
      return out;
    };
    fc.assert(fc.property(fc.nat({ max: FILES.length - 1 }), fc.nat(), fc.jsonValue({ maxDepth: 3 }), (k, pick, value) => {
      const doc = JSON.parse(FILES[k]!);
      const all = paths(doc).filter((p) => p.length > 0);
      const path = all[pick % all.length]!;
      let o = doc;
      for (const key of path.slice(0, -1)) o = o[key];
      o[path.at(-1)!] = value;
      clean(JSON.stringify(doc));
    }), { seed: SEED, numRuns: 400 });
  });
  it('arbitrary strings and arbitrary JSON', () => {
    fc.assert(fc.property(fc.string({ maxLength: 200 }), (s) => clean(s)), { seed: SEED, numRuns: 500 });
    fc.assert(fc.property(fc.json({ maxDepth: 6 }), (s) => clean(s)), { seed: SEED, numRuns: 500 });
    fc.assert(fc.property(fc.json(), (s) => clean(`{"format":"stripwright-design","version":2,"x":${s}}`)), { seed: SEED, numRuns: 300 });
  });
});

/**
 * Generated bad design files for the core fuzz runs, from the example designs (assets/examples) with a fixed seed so
 * every run sees the same inputs (FC_SEED overrides it for a random run). Loader inputs break the text or the
 * record structure; pipeline inputs stay mostly loadable but put odd values where the physics and the geometry
 * have to cope (extreme frequencies, widths, lengths, processes, kinds, unfinished networks).
 */
import fc from 'fast-check';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { PROCESS_LIMITS } from '../../core/index.ts';
import type { FuzzCase } from './core-worker.ts';

export const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : 20261205;

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
export const EXAMPLES: string[] = readdirSync(EX).filter((f) => f.endsWith('.json')).sort().map((f) => readFileSync(join(EX, f), 'utf8'));
// The pipeline runs on the smaller examples (the corporate-size ones only make each case slower, not harder).
const SMALL = EXAMPLES.filter((t) => t.length < 20_000);

type Json = Record<string, unknown>;
type Key = string | number;

/** Every path in a JSON value (the root excluded). */
function paths(v: unknown, p: Key[] = [], out: Key[][] = []): Key[][] {
  if (p.length) out.push(p);
  if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) paths(x, [...p, Array.isArray(v) ? Number(k) : k], out);
  return out;
}
function setAt(doc: unknown, path: Key[], value: unknown): void {
  let o = doc as Record<Key, unknown>;
  for (const k of path.slice(0, -1)) o = o[k] as Record<Key, unknown>;
  const last = path.at(-1)!;
  if (value === DELETE) { if (Array.isArray(o)) o.splice(Number(last), 1); else delete o[last]; } else o[last] = value;
}
const DELETE = Symbol('delete');

const edit = fc.record({ at: fc.nat(), del: fc.nat({ max: 8 }), ins: fc.string({ maxLength: 6, unit: fc.constantFrom(...'{}[]",:0123456789.-eE tnfrul\\\u0000\uFFFDµ'.split('')) }) });
function mutateText(text: string, edits: { at: number; del: number; ins: string }[]): string {
  let t = text;
  for (const e of edits) { const at = e.at % (t.length + 1); t = t.slice(0, at) + e.ins + t.slice(at + e.del); }
  return t;
}

/** Bad values put in place of a field: missing, wrong type, out of range, wrong names. */
const BAD_VALUES: unknown[] = [DELETE, null, 'x', -1, 0, 1e300, -1e-300, true, {}, [], { kind: 'zzz' }, { by: 'q' }, [1, 2], '5e-3', 1.5, 1e9];

/** About `n` inputs for the loader alone. */
export function loaderCases(n: number, firstId = 0): FuzzCase[] {
  const texts: string[] = [];
  const q = Math.floor(n / 4);
  // 1. Text edits of valid files (syntax, truncation, control characters, stray bytes).
  for (const [k, edits] of fc.sample(fc.tuple(fc.nat({ max: EXAMPLES.length - 1 }), fc.array(edit, { minLength: 1, maxLength: 4 })), { seed: SEED, numRuns: q })) {
    texts.push(mutateText(EXAMPLES[k]!, edits));
  }
  // 2. Random JSON values at random places.
  for (const [k, pick, value] of fc.sample(fc.tuple(fc.nat({ max: EXAMPLES.length - 1 }), fc.nat(), fc.jsonValue({ maxDepth: 3 })), { seed: SEED + 1, numRuns: q })) {
    const doc = JSON.parse(EXAMPLES[k]!) as Json;
    const all = paths(doc);
    setAt(doc, all[pick % all.length]!, value);
    texts.push(JSON.stringify(doc));
  }
  // 3. Systematic: every field of every example, missing or with a bad value (in turn), until the quarter is used.
  const systematic: string[] = [];
  let turn = 0;
  outer: for (const ex of EXAMPLES) {
    const base = JSON.parse(ex) as Json;
    for (const p of paths(base)) {
      const doc = structuredClone(base);
      setAt(doc, p, BAD_VALUES[turn++ % BAD_VALUES.length]);
      systematic.push(JSON.stringify(doc));
      if (systematic.length >= q) break outer;
    }
  }
  texts.push(...systematic);
  // 4. Arbitrary text, arbitrary JSON, the envelope with anything inside, and format-1 files with odd fields.
  const rest = n - texts.length;
  const r4 = Math.floor(rest / 4);
  for (const s of fc.sample(fc.string({ maxLength: 200 }), { seed: SEED + 2, numRuns: r4 })) texts.push(s);
  for (const s of fc.sample(fc.json({ maxDepth: 6 }), { seed: SEED + 3, numRuns: r4 })) texts.push(s);
  for (const s of fc.sample(fc.json(), { seed: SEED + 4, numRuns: r4 })) texts.push(`{"format":"stripwright-design","version":2,"name":"x","nodes":${s}}`);
  for (const s of fc.sample(fc.dictionary(fc.constantFrom('name', 'substrate', 'frequency', 'process', 'nodes', 'segments', 'board', 'areas', 'phaseGroups'), fc.jsonValue({ maxDepth: 2 })), { seed: SEED + 5, numRuns: rest - 3 * r4 })) {
    texts.push(JSON.stringify({ format: 'stripwright-design', version: 1, ...s }));
  }
  return texts.map((text, i) => ({ id: firstId + i, kind: 'load' as const, text }));
}

const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log(lo), max: Math.log(hi), noNaN: true }).map(Math.exp);
const L = PROCESS_LIMITS;
const processArb = fc.oneof(
  fc.record({ kind: fc.constant('v-bit'), tipWidth: fc.constantFrom(0, 0.05e-3, L.vBitTipMax), angleDeg: fc.constantFrom(L.vBitAngleDegMin, 30, 90, L.vBitAngleDegMax), depth: fc.constantFrom(10e-6, 0.05e-3, L.vBitDepthMax) }),
  fc.record({ kind: fc.constant('end-mill'), toolDiameter: fc.constantFrom(L.endMillDiameterMin, 0.4e-3, 3e-3, L.endMillDiameterMax), depth: fc.constantFrom(0.1e-3, L.endMillDepthMax) }),
  fc.record({ kind: fc.constant('etch'), edgeBias: fc.constantFrom(-L.etchBiasMax, -35e-6, 0, 35e-6, L.etchBiasMax), minFeature: fc.constantFrom(L.etchMinFeatureMin, 0.2e-3, L.etchMinFeatureMax) }),
);

/** One change that keeps the file mostly loadable but moves a value to where sizing and geometry must cope. */
const change = fc.oneof(
  fc.record({ t: fc.constant('scale'), pick: fc.nat(), factor: fc.constantFrom(0, -1, 1e-9, 1e-3, 0.1, 0.5, 0.999, 1.001, 2, 10, 1e3, 1e6) }),
  fc.record({ t: fc.constant('f0'), f0: logUniform(1e6, 300e9), span: fc.constantFrom(0, 0.01, 0.5, 1.9) }),
  fc.record({ t: fc.constant('process'), p: processArb }),
  fc.record({ t: fc.constant('width'), pick: fc.nat(), spec: fc.oneof(fc.record({ by: fc.constant('z0'), z0: logUniform(1, 10_000) }), fc.record({ by: fc.constant('width'), width: logUniform(1e-6, 0.1) })) }),
  fc.record({ t: fc.constant('length'), pick: fc.nat(), spec: fc.oneof(fc.record({ by: fc.constant('degrees'), deg: logUniform(0.01, 3600) }), fc.record({ by: fc.constant('length'), length: logUniform(1e-6, 10) }), fc.constant({ by: 'drawn' })) }),
  fc.record({ t: fc.constant('bend'), pick: fc.nat(), bend: fc.constantFrom({ style: 'square' }, { style: 'miter-optimal' }, { style: 'miter', fraction: 0.95 }, { style: 'arc', radius: 1e-6 }, { style: 'arc', radius: 0.05 }, { style: 'arc', radius: 1 }) }),
  fc.record({ t: fc.constant('lumped'), pick: fc.nat(), size: fc.constantFrom('0402', '0603', '0805', '1206'), part: fc.constantFrom('resistor', 'capacitor', 'inductor'), value: logUniform(1e-15, 1e12) }),
  fc.record({ t: fc.constant('taper'), pick: fc.nat(), z: logUniform(5, 300), profile: fc.constantFrom('linear', 'klopfenstein') }),
  fc.record({ t: fc.constant('move'), pick: fc.nat(), dx: fc.double({ min: -0.05, max: 0.05, noNaN: true }), dy: fc.double({ min: -0.05, max: 0.05, noNaN: true }) }),
  fc.record({ t: fc.constant('drop'), pick: fc.nat() }),
  fc.record({ t: fc.constant('ground'), clearance: fc.constantFrom(0, 1e-5, 1e-3, 0.05) }),
  fc.record({ t: fc.constant('substrate'), er: fc.constantFrom(1, 1.0001, 2.2, 10.2, 100), h: fc.constantFrom(10e-6, 0.1e-3, 1.6e-3, 50e-3), copper: fc.constantFrom(0, 35e-6, 1e-3) }),
);
type Change = typeof change extends fc.Arbitrary<infer T> ? T : never;

function apply(doc: Json, c: Change): void {
  const segs = doc.segments as Json[], nodes = doc.nodes as Json[];
  const pick = <T>(list: T[], k: number): T | undefined => (list.length ? list[k % list.length] : undefined);
  switch (c.t) {
    case 'scale': {
      const nums = paths(doc).filter((p) => { let o: unknown = doc; for (const k of p) o = (o as Record<Key, unknown>)[k]; return typeof o === 'number' && p[0] !== 'version'; });
      const p = pick(nums, c.pick);
      if (p) { let o: unknown = doc; for (const k of p) o = (o as Record<Key, unknown>)[k]; setAt(doc, p, (o as number) * c.factor); }
      break;
    }
    case 'f0': doc.frequency = { f0: c.f0, band: { start: Math.max(1e6, c.f0 * (1 - c.span / 2)), stop: Math.min(300e9, c.f0 * (1 + c.span / 2) + 1) } }; break;
    case 'process': doc.process = c.p; break;
    case 'width': { const s = pick(segs, c.pick); if (s && 'width' in s) s.width = c.spec; break; }
    case 'length': { const s = pick(segs.filter((x) => x.kind === 'line' || x.kind === 'taper'), c.pick); if (s) s.length = c.spec; break; }
    case 'bend': { const n = pick(nodes.filter((x) => x.kind === 'vertex'), c.pick); if (n) n.bend = c.bend; break; }
    case 'lumped': { const i = segs.length ? c.pick % segs.length : -1; const s = segs[i]; if (s) segs[i] = { id: s.id, kind: 'lumped', a: s.a, b: s.b, part: c.part, value: c.value, size: c.size, width: s.width ?? { by: 'z0', z0: 50 } }; break; }
    case 'taper': { const i = segs.length ? c.pick % segs.length : -1; const s = segs[i]; if (s && s.kind === 'line') segs[i] = { id: s.id, kind: 'taper', a: s.a, b: s.b, profile: c.profile, from: s.width, to: { by: 'z0', z0: c.z }, length: s.length }; break; }
    case 'move': { const n = pick(nodes, c.pick) as { at: { x: number; y: number } } | undefined; if (n) n.at = { x: n.at.x + c.dx, y: n.at.y + c.dy }; break; }
    case 'drop': { if (segs.length) segs.splice(c.pick % segs.length, 1); break; }
    case 'ground': {
      const xs = nodes.map((n) => (n.at as { x: number }).x), ys = nodes.map((n) => (n.at as { y: number }).y);
      const [x0, x1, y0, y1] = [Math.min(...xs) - 0.01, Math.max(...xs) + 0.01, Math.min(...ys) - 0.01, Math.max(...ys) + 0.01];
      (doc.areas as Json[]).push({ id: 'fuzz-ground', kind: 'ground-copper', polygon: [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }], clearance: c.clearance });
      break;
    }
    case 'substrate': doc.substrate = { ...(doc.substrate as Json), er: c.er, h: c.h, t: c.copper }; break;
  }
}

/** `n` generated designs for the whole pipeline. */
export function pipelineCases(n: number, firstId = 0): FuzzCase[] {
  const arb = fc.tuple(fc.nat({ max: SMALL.length - 1 }), fc.array(change, { minLength: 1, maxLength: 3 }));
  return fc.sample(arb, { seed: SEED + 10, numRuns: n }).map(([k, changes], i) => {
    const doc = JSON.parse(SMALL[k]!) as Json;
    for (const c of changes) apply(doc, c);
    return { id: firstId + i, kind: 'pipeline' as const, text: JSON.stringify(doc) };
  });
}

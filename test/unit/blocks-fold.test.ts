/**
 * Blocks in a footprint (core/blocks/fold.ts): a row too long for the area folds into mitered U-turns, the copper
 * (united by the board geometry) lies inside the footprint, the shop check finds nothing, and the electrical length
 * from port to port is kept: the path report's degrees (core/layout/paths.ts) and the phase of S21 of a lossless
 * sweep (the sweep's own bend models: Douville and James 1978 mitered bends, sized with compensation) each within 0.5°
 * of the unfolded block's. What does not fit, and cannot fold, is refused naming the footprint it needs (branched
 * blocks folded: test/unit/blocks-fold-branched.test.ts).
 * Footprints and specs are scenarios of our own.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import {
  makeBlockDesign, sizeDesign, tracePaths, netlistFromSized, solveNetwork, checkBoard, initPolygons, InputError, type DesignDoc, type SubstrateSpec,
} from '../../core/index.ts';

const FR4: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const F0 = 2.45e9;
// Plain microstrip sizing, said explicitly: the fold is what is tested here, on lines the
// default V-bit's side copper would not reach (91.7 Ω).
const make = (kind: string, raw: Record<string, unknown>) => makeBlockDesign(kind, raw, { f0: F0, substrate: FR4, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });

beforeAll(async () => { await initPolygons(); });

function portsOf(doc: DesignDoc): [string, string] {
  const p = doc.nodes.filter((n) => n.kind === 'port').map((n) => n.id);
  return [p[0]!, p[1]!];
}
/** Path degrees at f0 (path report) and the phase (deg) and |S11| (dB) of the lossless sweep at f0. */
function electrical(doc: DesignDoc): { pathDeg: number; s21Deg: number; s11Db: number } {
  const sized = sizeDesign(doc);
  expect(sized.problems).toEqual([]);
  const [a, b] = portsOf(doc);
  const pathDeg = tracePaths(sized, a, [b], { sensitivities: false }).paths[0]!.degAtF0;
  const r = solveNetwork(netlistFromSized(sized, { lossless: true }), [F0]);
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === `b1.${b}` || p.name === b), j = r.ports.findIndex((p) => p.name === `b1.${a}` || p.name === a);
  const t = 2 * (i * P + j), u = 2 * (j * P + j);
  return { pathDeg, s21Deg: (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI, s11Db: 20 * Math.log10(Math.hypot(r.s[u]!, r.s[u + 1]!)) };
}
const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

describe('a block folded to fit its footprint', () => {
  for (const [what, raw, fp] of [
    ['3-section transformer 50 → 100 Ω in 30 × 40 mm', { z1: '50', z2: '100' }, [30e-3, 40e-3]],
    ['6-section equal-ripple transformer 50 → 25 Ω in 60 × 30 mm', { z1: '50', z2: '25', sections: '6', response: 'chebyshev', ripple: '0.02' }, [60e-3, 30e-3]],
  ] as const) {
    it(`${what}: folds, its copper inside, the shop check clean, its electrical length kept within 0.5°`, () => {
      const flat = make('transformer', raw);
      const doc = make('transformer', { ...raw, footprint: fp.map((x) => `${x * 1e3}mm`).join(',') });
      // It did fold: more bends than the straight row, and a note says so.
      expect(doc.nodes.filter((n) => n.kind === 'vertex' && n.bend?.style === 'miter-optimal').length).toBeGreaterThanOrEqual(2);
      expect(String(doc.notes ?? '')).toMatch(/Folded into \d+ rows/);
      const { geometry, findings } = checkBoard(sizeDesign(doc));
      const e = geometry!.copper.flatMap((r) => r.outer);
      const w = Math.max(...e.map((p) => p.x)) - Math.min(...e.map((p) => p.x)), h = Math.max(...e.map((p) => p.y)) - Math.min(...e.map((p) => p.y));
      expect(w).toBeLessThanOrEqual(fp[0] + 1e-9);
      expect(h).toBeLessThanOrEqual(fp[1] + 1e-9);
      expect(findings.filter((f) => f.severity !== 'info'), JSON.stringify(findings)).toEqual([]);
      const a = electrical(flat), b = electrical(doc);
      expect(Math.abs(b.pathDeg - a.pathDeg)).toBeLessThan(0.5);
      expect(Math.abs(wrap(b.s21Deg - a.s21Deg))).toBeLessThan(0.5);
      // Still the transformer it was: matched at f0 (Pozar §5.6–5.7; the project's −25 dB figure).
      expect(b.s11Db).toBeLessThan(-25);
    });
  }
  it('a block that fits a quarter turn is turned, not folded', () => {
    const doc = make('launch', { footprint: '6mm,20mm' }); // 8 mm long (pad and port line), about 2.3 mm wide
    expect(String(doc.notes ?? '')).toMatch(/quarter turn/);
    expect(doc.nodes.some((n) => n.kind === 'vertex' && n.id.includes('.turn'))).toBe(false);
  });
  it('a block with branches that does not fit is refused, naming the footprint it needs', () => {
    let err: unknown;
    try { make('corporate', { outputs: '4', footprint: '20mm,20mm' }); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('corporate.footprint');
    expect((err as InputError).expected).toMatch(/at least \d+\.\d mm × \d+\.\d mm/);
  });
  it('a feed whose row of outputs is wider than the footprint is refused saying the pitch sets it, and the pitch it names does fit', () => {
    let err: unknown;
    try { make('corporate', { outputs: '4', footprint: '150mm,80mm' }); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    const hint = (err as InputError).hint ?? '';
    expect(hint).toMatch(/4 outputs are \d+\.\d mm apart end to end on their row, set by the pitch; folding lines cannot bring them closer/);
    const pitch = /a pitch of at most (\d+\.\d) mm/.exec(hint)?.[1];
    expect(pitch).toBeDefined();
    const doc = make('corporate', { outputs: '4', pitch: `${pitch}mm`, footprint: '150mm,80mm' });
    expect(doc.blocks?.[0]?.kind).toBe('corporate');
  });
  it('a branched block that even folded does not fit is refused, naming the footprint it needs as laid out and as folded, and why', () => {
    let err: unknown;
    try { make('stub-match', { load: '30-20j', footprint: '10mm,10mm' }); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).expected).toMatch(/^a footprint of at least \d+\.\d mm × \d+\.\d mm \(its copper as laid out\)(, or folded, at least \d+\.\d mm × \d+\.\d mm)?$/);
    expect((err as InputError).hint).toMatch(/fold into U-turns of mitered bends, keeping 3 substrate heights between runs, but not enough for this footprint/);
  });
  it('a footprint that is not two lengths is refused in words', () => {
    expect(() => make('transformer', { footprint: '30mm' })).toThrow(/width,height/);
  });
});

/**
 * Equalizing a phase group with meanders (core/network/equalize). The checks are outside the tool's own report:
 * the ledger of the result is traced afresh (core/layout paths.ts), the response is solved afresh (nodal solve) and
 * the shop check runs on the result's copper. Designs: the demo feed with one quarter-wave drawn long (our own
 * detuning), and the generated 64-way corporate feed with one output run 3 mm long.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  parseDesign, sizeDesign, tracePaths, equalizeGroup, corporateFeed, netlistFromSized, solveNetwork, sweepFrequencies,
  checkBoard, History, InputError, serializeDesign, analyzeCoupled, type DesignDoc,
} from '../../core/index.ts';
import { initPolygons } from '../../core/geometry/polygons.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const load = (name: string): DesignDoc => {
  const r = parseDesign(readFileSync(join(EX, name), 'utf8'));
  if (!r.ok) throw new Error(`${name} refused`);
  return r.doc;
};

/** The demo with its left riser 2 mm longer than drawn (the left half moves up): out1 and out2 lag out3 and out4. */
function unevenDemo(): DesignDoc {
  const d = load('demo.json');
  return { ...d, segments: d.segments.map((s) => (s.id === 'risel' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: 10e-3 } } : s)) };
}

/** Largest minus smallest ∠S(out, in) across the band, after taking out the first output's phase, degrees. */
function sweepPhaseSpread(doc: DesignDoc, from: string, to: string[]): number {
  const sized = sizeDesign(doc);
  const r = solveNetwork(netlistFromSized(sized, { line: sized.lineOptions }), sweepFrequencies({ start: doc.frequency.band.start, stop: doc.frequency.band.stop, points: 21 }));
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === from);
  let worst = 0;
  for (let k = 0; k < r.freqs.length; k++) {
    const ph = to.map((t) => { const j = r.ports.findIndex((p) => p.name === t); const x = 2 * ((k * P + j) * P + i); return Math.atan2(r.s[x + 1]!, r.s[x]!) * 180 / Math.PI; });
    const rel = ph.map((p) => ((p - ph[0]! + 540) % 360) - 180);
    worst = Math.max(worst, Math.max(...rel) - Math.min(...rel));
  }
  return worst;
}

beforeAll(async () => { await initPolygons(); });

describe('equalize a phase group', () => {
  const doc = unevenDemo();
  const res = equalizeGroup(doc, { group: 'outputs' });

  it('starts far apart (the detuning is real)', () => {
    const before = tracePaths(sizeDesign(doc), 'in', ['out1', 'out2', 'out3', 'out4'], { sensitivities: false });
    expect(before.spreadDeg).toBeGreaterThan(20);
  });
  it('lengthens one branch only, the sibling of the long one (a tree: as few pieces as will do)', () => {
    expect(res.meanders.map((m) => m.piece)).toEqual(['armr']);
    expect(res.meanders[0]!.addedDeg).toBeGreaterThan(20);
  });
  it('ledger spread at f0 ≤ 0.5° on the result, traced afresh (issue 18 acceptance)', () => {
    const after = tracePaths(sizeDesign(res.doc), 'in', ['out1', 'out2', 'out3', 'out4'], { sensitivities: false });
    expect(after.spreadDeg).toBeLessThanOrEqual(0.5);
    // Across the band too (equal lengths of equal lines match at every frequency).
    for (const p of after.paths) for (const d of p.phaseDiffBandDeg) expect(Math.abs(d)).toBeLessThanOrEqual(0.5);
  });
  it('the sweep\'s S21 phase spread is ≤ 1° across the band (nodal solve of the result)', () => {
    expect(sweepPhaseSpread(doc, 'in', ['out1', 'out2', 'out3', 'out4'])).toBeGreaterThan(15);
    expect(sweepPhaseSpread(res.doc, 'in', ['out1', 'out2', 'out3', 'out4'])).toBeLessThanOrEqual(1);
  });
  it('the shop check of the result is clean (no errors or warnings it did not have before)', () => {
    const sev = (d: DesignDoc) => checkBoard(sizeDesign(d)).findings.filter((f) => f.severity !== 'info');
    const before = new Set(sev(doc).map((f) => f.code));
    const after = sev(res.doc);
    expect(after.filter((f) => f.severity === 'error')).toEqual([]);
    expect(after.filter((f) => !before.has(f.code))).toEqual([]);
  });
  it('ports and pieces not chosen do not move', () => {
    const s0 = sizeDesign(doc), s1 = sizeDesign(res.doc);
    for (const n of s0.nodes) {
      const m = s1.nodes.find((x) => x.id === n.id)!;
      expect(Math.hypot(m.pos.x - n.pos.x, m.pos.y - n.pos.y)).toBeLessThan(1e-9);
    }
    for (const s of doc.segments) if (s.id !== res.meanders[0]!.piece) expect(res.doc.segments).toContainEqual(s);
  });
  it('every meander corner is a mitered vertex, compensated in sizing (Douville & James 1978 miters)', () => {
    const s1 = sizeDesign(res.doc);
    const corners = s1.nodes.filter((n) => res.meanders[0]!.nodes.includes(n.id));
    expect(corners.length).toBeGreaterThan(0);
    for (const c of corners) expect(c.bend?.style.style).toBe('miter-optimal');
    const comp = s1.pieces.filter((p) => res.meanders[0]!.segments.includes(p.id)).flatMap((p) => p.compensations.filter((c) => c.model === 'miter-bend' && c.applied));
    expect(comp.length).toBeGreaterThan(0);
  });
  it('is one undo step in the history', () => {
    const h = new History(doc);
    h.apply('network.equalize', { nodes: res.doc.nodes, segments: res.doc.segments });
    h.mark();
    expect(serializeDesign(h.doc)).toBe(serializeDesign(res.doc));
    expect(h.undo()).toBe(true);
    expect(serializeDesign(h.doc)).toBe(serializeDesign(doc));
  });
  it('refuses when the chosen pieces have no room, saying how much is missing', () => {
    try {
      equalizeGroup(doc, { group: 'outputs', pieces: ['riser'] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).got).toMatch(/is [\d.]+° \([\d.]+ mm of line\) short; .* so (all )?[\d.]+ mm is missing \(riser: .*dogleg does not fit: /);
    }
  });
  it('a serpentine-only equalize of a need smaller than the smallest serpentine says so in mm, names the runs and what to try', () => {
    // Our rule: a leg is at least two strip widths and longer than its two right-angle miter cuts (Douville & James
    // 1978 optimal miter, the cut sizing takes): two bumps of four such legs add more than this path needs.
    const six: DesignDoc = { ...doc, segments: doc.segments.map((s) => (s.id === 'risel' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: 14e-3 } } : s)) };
    let err: InputError | null = null;
    try { equalizeGroup(six, { group: 'outputs', style: 'serpentine' }); } catch (e) { err = e as InputError; }
    expect(err).toBeInstanceOf(InputError);
    expect(err!.got).toMatch(/is [\d.]+° \(([\d.]+) mm of line\) short, but the smallest serpentine \(two bumps or more\) on its runs \(armr[^)]*\) adds ([\d.]+) mm/);
    const [, need, least] = /\(([\d.]+) mm of line\).*adds ([\d.]+) mm/.exec(err!.got)!;
    expect(Number(least)).toBeGreaterThan(Number(need));
    expect(err!.hint).toMatch(/style auto .* or trombone/);
    // What it suggests works: a trombone there fits, and its legs size without problems.
    const t = equalizeGroup(six, { group: 'outputs', style: 'trombone' });
    expect(sizeDesign(t.doc).problems).toEqual([]);
    expect(t.ledgerSpreadDeg).toBeLessThanOrEqual(0.5);
  });
  it('names the groups when the group is unknown', () => {
    expect(() => equalizeGroup(doc, { group: 'nope' })).toThrow(/outputs \(Patch feeds in phase\)/);
  });
});

describe('legs spaced by a coupling limit', () => {
  it('a −40 dB limit widens the gap past 3h, and the legs of the meander keep it (Kirschning–Jansen 1984 modes)', () => {
    const feed = corporateFeed({ outputs: 4, f0: 5.8e9, pitch: 30e-3, substrate: { h: 0.5e-3 } });
    const long: DesignDoc = { ...feed, segments: feed.segments.map((s) => (s.id === 'run1' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: 14e-3 } } : s)) };
    const plain = equalizeGroup(long, { group: 'outputs', style: 'trombone' });
    const limited = equalizeGroup(long, { group: 'outputs', style: 'trombone', couplingLimitDb: -40 });
    const gapOf = (m: (typeof plain.meanders)[number]) => (m.shape.kind === 'serpentine' ? m.shape.pitch : 0) - sizeDesign(long).pieces.find((p) => p.id === m.piece)!.width;
    expect(plain.meanders.length).toBeGreaterThan(0);
    expect(limited.meanders.length).toBeGreaterThan(0);
    for (const m of plain.meanders) expect(gapOf(m)).toBeCloseTo(3 * 0.5e-3, 9);
    // The gap is set for the design's widest line (wider strips couple more at one gap), so every leg keeps the limit.
    const widest = Math.max(...sizeDesign(long).pieces.filter((p) => p.kind === 'line').map((p) => p.width));
    for (const m of limited.meanders) {
      const w = sizeDesign(long).pieces.find((p) => p.id === m.piece)!.width;
      expect(gapOf(m)).toBeGreaterThan(3 * 0.5e-3);
      expect(analyzeCoupled(long.substrate, widest, gapOf(m) * 0.999, long.frequency.f0).couplingDb).toBeLessThan(40 + 0.2);
      expect(analyzeCoupled(long.substrate, widest, gapOf(m), long.frequency.f0).couplingDb).toBeGreaterThanOrEqual(40 - 1e-6);
      expect(analyzeCoupled(long.substrate, w, gapOf(m), long.frequency.f0).couplingDb).toBeGreaterThanOrEqual(40 - 1e-6);
    }
    expect(limited.spreadDeg).toBeLessThanOrEqual(0.5);
  });
});

describe('equalize the 64-way feed with one long output run', () => {
  const feed = corporateFeed({ outputs: 64, f0: 5.8e9, pitch: 15e-3, substrate: { h: 0.5e-3 } });
  const g = feed.phaseGroups[0]!;
  /** The feed with output run run5 (8 mm as generated) `extra` m longer: the other 63 paths fall behind. */
  const longBy = (extra: number): DesignDoc => ({ ...feed, segments: feed.segments.map((s) => (s.id === 'run5' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: 8e-3 + extra } } : s)) });
  const sev = (d: DesignDoc) => checkBoard(sizeDesign(d)).findings.filter((f) => f.severity !== 'info');
  const newFindings = (before: DesignDoc, after: DesignDoc) => {
    const had = new Set(sev(before).map((f) => f.code));
    return sev(after).filter((f) => f.severity === 'error' || !had.has(f.code));
  };

  it('with the meanders kept on the 100 Ω arms (sweep limit raised), the ledger matches but the sweep does not (3 mm long)', () => {
    // The check below has something to see: a meander on an arm between a tee and a quarter-wave transformer also
    // moves the phase of what those two reflect, which no length ledger follows.
    const long = longBy(3e-3);
    const arms = equalizeGroup(long, { group: 'outputs', sweepLimitDeg: 100 });
    expect(arms.meanders).toHaveLength(6);
    expect(arms.meanders.filter((m) => m.piece.startsWith('arm')).length).toBeGreaterThan(0);
    expect(tracePaths(sizeDesign(arms.doc), g.from, g.to, { sensitivities: false }).spreadDeg).toBeLessThanOrEqual(0.5);
    // The meanders do couple, and the ledger counts it.
    expect(Math.max(...arms.meanders.map((m) => Math.abs(m.couplingDeg[1])))).toBeGreaterThan(0.05);
    expect(sweepPhaseSpread(arms.doc, g.from, g.to)).toBeGreaterThan(1);
    // The same pieces picked by the user: kept (they were chosen), with the sweep's spread reported and a warning.
    const picked = equalizeGroup(long, { group: 'outputs', pieces: arms.meanders.map((m) => m.piece) });
    expect(picked.meanders.map((m) => m.piece)).toEqual(arms.meanders.map((m) => m.piece));
    expect(Math.max(...picked.sweepSpreadDeg!)).toBeGreaterThan(1);
    expect(picked.warnings.map((w) => w.message).join(' ')).toMatch(/not matched at both ends.*choose pieces on lines matched to their ports/);
  });

  for (const mm of [3, 6]) {
    describe(`run5 ${mm} mm long`, () => {
      const long = longBy(mm * 1e-3);
      const res = equalizeGroup(long, { group: 'outputs' });
      it('moves the meanders to the matched 50 Ω port leads, saying why', () => {
        // A line ended in its own impedance shows that impedance at its input at every length (Pozar, Microwave
        // Engineering, 4th ed., eq. 2.44 with ZL = Z0), so lengthening it adds only its own phase.
        const s = sizeDesign(long);
        expect(res.meanders).toHaveLength(63);
        for (const m of res.meanders) {
          const piece = s.pieces.find((p) => p.id === m.piece)!;
          const port = s.nodes.find((n) => n.id === piece.b && n.kind === 'port');
          expect(port?.port?.zRef).toBe(50);
          expect(Math.abs(piece.z0 - 50)).toBeLessThan(1.5);
        }
        expect(res.warnings.map((w) => w.message).join(' ')).toMatch(/port leads \(matched lines\)/);
      });
      it('ledger spread ≤ 0.5° at f0 and the sweep\'s S21 phase spread ≤ 1° across the band (issue 18 acceptance)', () => {
        expect(sweepPhaseSpread(long, g.from, g.to)).toBeGreaterThan(30);
        expect(tracePaths(sizeDesign(res.doc), g.from, g.to, { sensitivities: false }).spreadDeg).toBeLessThanOrEqual(0.5);
        expect(sweepPhaseSpread(res.doc, g.from, g.to)).toBeLessThanOrEqual(1);
        expect(Math.max(...res.sweepSpreadDeg!)).toBeLessThanOrEqual(1);
      });
      it('the shop check of the result is clean (no errors, no warnings it did not have before)', () => {
        expect(newFindings(long, res.doc)).toEqual([]);
      });
    });
  }

  it('run5 1 mm long: the six sibling arms do (as few pieces as will do), the sweep confirming ≤ 1° across the band', () => {
    const one = longBy(1e-3);
    const eq = equalizeGroup(one, { group: 'outputs' });
    expect(eq.meanders).toHaveLength(6);
    expect(sweepPhaseSpread(one, g.from, g.to)).toBeGreaterThan(10);
    expect(tracePaths(sizeDesign(eq.doc), g.from, g.to, { sensitivities: false }).spreadDeg).toBeLessThanOrEqual(0.5);
    expect(sweepPhaseSpread(eq.doc, g.from, g.to)).toBeLessThanOrEqual(1);
    expect(newFindings(one, eq.doc)).toEqual([]);
  });
});

describe('equalize a group with offsets (a progressive phase for a tilted beam)', () => {
  const d = load('demo.json');
  const offsets = [0, 30, 60, 90];
  const doc: DesignDoc = { ...d, phaseGroups: d.phaseGroups.map((g) => ({ ...g, offsetsDeg: offsets })) };
  const res = equalizeGroup(doc, { group: 'outputs' });
  it('each path ends its offset behind the first at f0, within 0.5°, on the ledger traced afresh', () => {
    const g = doc.phaseGroups[0]!;
    const after = tracePaths(sizeDesign(res.doc), g.from, g.to, { sensitivities: false });
    const level = after.paths.map((p, i) => p.degAtF0 - offsets[i]!);
    expect(Math.max(...level) - Math.min(...level)).toBeLessThanOrEqual(0.5);
    expect(res.spreadDeg).toBeLessThanOrEqual(0.5);
  });
  it('reports the band-edge error the length offsets imply (they match at f0 only)', () => {
    // A 90° offset made of line is 90°·f/f0 at f: at the band edges the error is about 90°·|f − f0|/f0 (dispersion aside).
    const f0 = doc.frequency.f0, edge = (doc.frequency.band.stop - f0) / f0;
    expect(res.bandSpreadDeg[1]).toBeGreaterThan(0.5 * 90 * edge);
    expect(res.bandSpreadDeg[1]).toBeLessThan(2 * 90 * edge + 0.5);
  });
});

describe('equalize on the examples, each with one output lead drawn longer (our own detuning)', () => {
  /** The example with one path's last piece (its port lead; default the last path's) `extra` m longer than sized. */
  const detuned = (name: string, extra: number, path = -1): DesignDoc => {
    const d = load(name);
    const g = d.phaseGroups[0]!;
    const s = sizeDesign(d);
    const id = tracePaths(s, g.from, g.to, { sensitivities: false }).paths.at(path)!.pieces.at(-1)!;
    const nominal = s.pieces.find((p) => p.id === id)!.nominalLength;
    return { ...d, segments: d.segments.map((x) => (x.id === id && x.kind === 'line' ? { ...x, length: { by: 'length' as const, length: nominal + extra } } : x)) };
  };
  /** Findings (errors and warnings) of the result whose kind the detuned design did not have. */
  const newFindings = (before: DesignDoc, after: DesignDoc) => {
    const sev = (d: DesignDoc) => checkBoard(sizeDesign(d)).findings.filter((f) => f.severity !== 'info');
    const had = new Set(sev(before).map((f) => `${f.severity}:${f.code}`));
    return sev(after).filter((f) => !had.has(`${f.severity}:${f.code}`));
  };
  it('demo (equal phase): ledger ≤ 0.5° at f0, sweep ≤ 1° across the band, shop check clean', () => {
    const doc = detuned('demo.json', 1e-3);
    const g = doc.phaseGroups[0]!;
    const res = equalizeGroup(doc, { group: g.id });
    expect(res.meanders.length).toBeGreaterThan(0);
    expect(tracePaths(sizeDesign(res.doc), g.from, g.to, { sensitivities: false }).spreadDeg).toBeLessThanOrEqual(0.5);
    expect(sweepPhaseSpread(doc, g.from, g.to)).toBeGreaterThan(5);
    expect(sweepPhaseSpread(res.doc, g.from, g.to)).toBeLessThanOrEqual(1);
    expect(newFindings(doc, res.doc)).toEqual([]);
    expect(checkBoard(sizeDesign(res.doc)).findings.filter((f) => f.severity === 'error')).toEqual([]);
  });
  it('branch-line (a 0°/90° group): each path its offset behind the first within 0.5° on the ledger, nothing new in the shop check', () => {
    // The coupled path's lead 6 mm longer: it then runs off the board (an error of the detuned design, kept, not added).
    const doc = detuned('branchline-10g4.json', 6e-3);
    const g = doc.phaseGroups[0]!;
    const res = equalizeGroup(doc, { group: g.id });
    const after = tracePaths(sizeDesign(res.doc), g.from, g.to, { sensitivities: false });
    const level = after.paths.map((p, i) => p.degAtF0 - (g.offsetsDeg?.[i] ?? 0));
    expect(Math.max(...level) - Math.min(...level)).toBeLessThanOrEqual(0.5);
    expect(newFindings(doc, res.doc)).toEqual([]);
  });
  it('Wilkinson: refuses a lengthening smaller than the smallest meander its wide output runs can take, saying so', () => {
    expect(() => equalizeGroup(detuned('wilkinson-2g45.json', 6e-3), { group: 'outputs' })).toThrow(/less than the smallest meander that fits its runs/);
  });
});

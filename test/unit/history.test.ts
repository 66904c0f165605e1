/**
 * Undo by diffs (design/history.ts, design/diff.ts): every command undoes to the identical design and redoes to
 * the identical result; a drag is one step; a new edit clears redo; the cap holds. fast-check properties: random
 * command sequences undone in full give the starting design back, redone in full give the end design.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  History, InputError, applyDiff, blockPlacement, withBlock, copySelection, diffDesigns, invertDiff, newDesign, parseDesign, runCommand, serializeDesign, validateDesign, type DesignDoc,
} from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const load = (name: string): DesignDoc => { const r = parseDesign(readFileSync(join(EX, name), 'utf8')); if (!r.ok) throw new Error('bad example'); return r.doc; };
const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : 20261201;

/** One valid call of every command on the demo design. */
function everyCommand(d: DesignDoc): [string, Record<string, unknown>][] {
  const sq = [{ x: -0.06, y: 0.06 }, { x: -0.05, y: 0.06 }, { x: -0.05, y: 0.07 }, { x: -0.06, y: 0.07 }];
  return [
    ['node.add', { at: { x: 0.05, y: 0.002 }, spec: { kind: 'port' } }],
    ['node.move', { id: 'bl', at: { x: -0.0362, y: 0.015 } }],
    ['node.setSpec', { id: 'bl', spec: { bend: { style: 'miter', fraction: 0.6 } }, label: 'left bend' }],
    ['segment.add', { a: 'tl', b: 'tr', spec: { kind: 'line', width: { by: 'z0', z0: 100 }, length: { by: 'drawn' } } }],
    ['segment.setSpec', { id: 'feed', spec: { width: { by: 'width', width: 3e-3 } } }],
    ['selection.delete', { ids: ['out4', 'gnd'] }],
    ['selection.translate', { ids: ['qwl', 'gnd'], by: { x: 0.001, y: 0 } }],
    ['selection.rotate', { ids: ['out1', 'c1'], about: { x: -0.0543, y: 0.03 }, angleDeg: 10 }],
    ['selection.mirror', { ids: ['gnd'], axis: 'horizontal', about: { x: 0, y: 0.02 } }],
    ['selection.paste', { clipboard: copySelection(d, ['up1']), offset: { x: 0, y: 0.02 } }],
    ['design.setSubstrate', { substrate: { er: 4.3 } }],
    ['design.setFrequency', { f0: 5.85e9 }],
    ['design.setProcess', { process: { kind: 'etch', edgeBias: 35e-6, minFeature: 0.2e-3 } }],
    ['design.setJunctions', { junctions: 'ideal' }],
    ['design.setAsMade', { asMade: { sizing: 'as-made', sideCopper: 'floating', fencePitch: 2e-3 } }],
    ['design.setInfo', { name: 'Renamed', notes: null }],
    ['run.extend', { from: 't0', to: { x: 0, y: 0.03 } }],
    ['segment.split', { id: 'feed', at: { x: 0, y: 0.007 }, branchTo: { x: 0.01, y: 0.007 } }],
    ['area.add', { kind: 'keep-out', polygon: sq }],
    ['area.set', { id: 'gnd', clearance: 3e-3 }],
    ['board.setOutline', { outline: null }],
    ['phaseGroup.set', { id: 'outputs', toleranceDeg: 3 }],
    ['view.set', { grid: 2.54e-4 }],
    ['phaseGroup.delete', { id: 'outputs' }],
    ['run.route', { from: 'c1', points: [{ x: -0.07, y: 0.0305 }, { x: -0.07, y: 0.02 }] }],
    ['run.tee', { segment: 'feed', at: { x: 0, y: 0.007 }, points: [{ x: 0.01, y: 0.007 }] }],
    ['run.stub', { segment: 'feed', at: { x: 0, y: 0.007 }, side: 1, end: 'short' }],
    ['run.insert', { segment: 'feed', at: { x: 0, y: 0.007 }, kind: 'part' }],
    ['design.setTargets', { targets: [{ id: 'match', figure: 'return-loss', ports: ['in'], band: { start: 5.7e9, stop: 5.9e9 }, limit: { min: 12 } }] }],
    ['design.setSweep', { sweep: { start: 5e9, stop: 6.5e9, points: 401, spacing: 'linear' } }],
    ['design.setProximityLimit', { limit: { by: 'heights', heights: 5 } }],
    ['design.setTolerances', { tolerances: [{ quantity: 'er', distribution: 'normal', spread: 0.05, scope: 'board' }] }],
    ['network.equalize', { nodes: [...d.nodes, { id: 'm1', kind: 'vertex', bend: { style: 'miter-optimal' }, at: { x: -0.0543, y: 0.04 } }], segments: d.segments.map((s) => (s.id === 'up1' ? { ...s, b: 'm1' } : s)).concat([{ id: 'up1-s1', a: 'm1', b: 'out1', kind: 'line', width: { by: 'z0', z0: 100 }, length: { by: 'drawn' } }]) }],
    ['network.tune', { nodes: d.nodes, segments: d.segments.map((s) => (s.id === 'qwl' && s.kind === 'line' ? { ...s, length: { by: 'degrees', deg: 91 } } : s)) }],
    ['block.put', { ...wilkinsonHere(d) }],
    // Detach needs a placed block: it runs on the demo with one placed (startOf below).
    ['block.detach', { id: 'b1' }],
    // A coupled-line block pasted with its band (wider than the demo's) and tolerances the demo does not take (it has pieces).
    ['block.paste', { clipboard: copySelection(d, ['up1']), offset: { x: 0, y: 0.03 }, band: { start: 1e9, stop: 9e9 }, tolerances: [{ quantity: 'h', distribution: 'normal', spread: 5e-5, scope: 'board' }] }],
    ['design.setMeasured', { measured: [{ id: 'm1', name: 'board.s1p', touchstone: '# GHz S RI R 50\n1 0.1 0\n', ports: ['in'] }] }],
  ];
}

/** A transformer block placed beside the demo's drawing (core/blocks), as the block.put command takes it. */
function wilkinsonHere(d: DesignDoc) {
  const pl = blockPlacement(d, 'transformer', {}, { x: 0.1, y: 0 });
  return { record: pl.record, nodes: pl.nodes, segments: pl.segments, phaseGroups: pl.phaseGroups, targets: pl.targets, band: pl.band };
}
/** The design each command's undo check starts from. */
function startOf(id: string, demo: DesignDoc): DesignDoc { return id === 'block.detach' ? withBlock(demo, wilkinsonHere(demo)) : demo; }

describe('History', () => {
  const demo = load('demo.json');
  it('covers every registered command', async () => {
    const { DESIGN_COMMANDS } = await import('../../core/index.ts');
    expect(everyCommand(demo).map(([id]) => id).sort()).toEqual([...DESIGN_COMMANDS.keys()].sort());
  });
  for (const [id, args] of everyCommand(demo)) {
    it(`${id}: undo gives the identical design back, redo the identical result`, () => {
      const start = startOf(id, demo);
      const h = new History(start);
      h.apply(id, args);
      h.mark();
      const after = h.doc;
      expect(serializeDesign(after)).not.toBe(serializeDesign(start));
      expect(after).toEqual(runCommand(start, id, args));
      expect(h.undo()).toBe(true);
      expect(h.doc).toEqual(start);
      expect(serializeDesign(h.doc)).toBe(serializeDesign(start));
      expect(h.redo()).toBe(true);
      expect(serializeDesign(h.doc)).toBe(serializeDesign(after));
    });
  }
  it('a drag is one undo step; cancelling it restores the start', () => {
    const h = new History(demo);
    const r0 = h.revision;
    h.beginLive('Move node');
    for (let k = 1; k <= 20; k++) h.apply('node.move', { id: 'bl', at: { x: -0.0362 + k * 1e-4, y: 0.014 } });
    expect(h.revision).toBe(r0 + 20);
    expect(h.commitLive()).not.toBeNull();
    expect(h.undoLabels).toEqual(['Move node']);
    h.undo();
    expect(h.doc).toEqual(demo);
    expect(h.canUndo).toBe(false);
    h.beginLive();
    h.apply('node.move', { id: 'bl', at: { x: -0.03, y: 0.014 } });
    h.cancelLive();
    expect(h.doc).toEqual(demo);
    expect(h.canRedo).toBe(true); // cancelling a drag keeps the redo list
  });
  it('a new edit clears redo', () => {
    const h = new History(demo);
    h.apply('design.setSubstrate', { substrate: { er: 4.2 } }); h.mark();
    h.undo();
    expect(h.canRedo).toBe(true);
    h.apply('design.setSubstrate', { substrate: { er: 4.5 } });
    expect(h.canRedo).toBe(false);
    expect(h.redo()).toBe(false);
  });
  it('edits between marks form one step; a refused edit changes nothing', () => {
    const h = new History(demo);
    h.apply('design.setSubstrate', { substrate: { er: 4.2 } });
    h.apply('design.setFrequency', { f0: 5.7e9 });
    h.mark();
    h.apply('view.set', { grid: 1e-3 });
    h.mark();
    const rev = h.revision;
    expect(() => h.apply('node.move', { id: 'nope', at: { x: 0, y: 0 } })).toThrow(InputError);
    expect(h.revision).toBe(rev);
    h.undo();
    expect(h.doc.substrate.er).toBe(4.2);
    h.undo();
    expect(h.doc).toEqual(demo);
  });
  it('keeps at most `limit` steps', () => {
    const h = new History(newDesign(), { limit: 3 });
    for (let k = 1; k <= 5; k++) { h.apply('design.setSubstrate', { substrate: { er: 2 + k } }); h.mark(); }
    let n = 0;
    while (h.undo()) n++;
    expect(n).toBe(3);
    expect(h.doc.substrate.er).toBe(4);
    expect(() => new History(newDesign(), { limit: 0 })).toThrow('limit: expected a whole number of undo steps, at least 1, got 0');
  });
  it('tells subscribers of every change with the revision', () => {
    const h = new History(newDesign());
    const seen: number[] = [];
    const stop = h.subscribe((_d, rev) => seen.push(rev));
    h.apply('view.set', { grid: 1e-4 }); h.undo(); h.redo();
    stop();
    h.undo();
    expect(seen).toEqual([1, 2, 3]);
    expect(h.revision).toBe(4);
  });
  it('applyDiff refuses a diff that does not belong to the design', () => {
    const a = load('demo.json');
    const b = runCommand(a, 'node.move', { id: 'bl', at: { x: -0.03, y: 0.014 } });
    const d = diffDesigns(a, b);
    const other = runCommand(a, 'selection.delete', { ids: ['out1'] });
    expect(applyDiff(a, d)).toEqual(b);
    expect(applyDiff(b, invertDiff(d))).toEqual(a);
    const gone = runCommand(a, 'selection.delete', { ids: ['bl'] });
    expect(() => applyDiff(gone, d)).toThrow('nodes: expected a record "bl" to change, got none (the history does not match the document)');
    expect(applyDiff(other, diffDesigns(other, other))).toEqual(other);
  });
});

// ---- properties ------------------------------------------------------------------------------------------------

type Op = [kind: number, i: number, a: number, b: number];
const op = fc.tuple(fc.nat({ max: 11 }), fc.nat(), fc.double({ min: -0.01, max: 0.01, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }));

/** Turns an abstract op into a command call against the current design. */
function call(d: DesignDoc, [kind, i, a, b]: Op): [string, Record<string, unknown>] {
  const node = d.nodes.length ? d.nodes[i % d.nodes.length]! : undefined;
  const seg = d.segments.length ? d.segments[i % d.segments.length]! : undefined;
  const at = node ? { x: node.at.x + a, y: node.at.y + a / 2 } : { x: a, y: a };
  switch (kind) {
    case 0: return ['node.move', { id: node?.id ?? 'none', at }];
    case 1: return ['run.extend', { from: node?.id ?? 'none', to: at }];
    case 2: {
      if (!seg) return ['node.add', { at }];
      const pa = d.nodes.find((n) => n.id === seg.a)!.at, pb = d.nodes.find((n) => n.id === seg.b)!.at;
      const p = { x: pa.x + b * (pb.x - pa.x), y: pa.y + b * (pb.y - pa.y) };
      return ['segment.split', { id: seg.id, at: p, ...(i % 2 ? { branchTo: { x: p.x + a, y: p.y - a } } : {}) }];
    }
    case 3: return ['selection.delete', { ids: [(i % 2 ? seg?.id : node?.id) ?? 'none'] }];
    case 4: return ['selection.rotate', { ids: d.nodes.slice(0, 1 + (i % 4)).map((n) => n.id), about: { x: 0, y: 0 }, angleDeg: a * 9000 }];
    case 5: return ['selection.mirror', { ids: [node?.id ?? 'none'], axis: i % 2 ? 'vertical' : 'horizontal', about: { x: a, y: a } }];
    case 6: return ['selection.translate', { ids: [seg?.id ?? node?.id ?? 'none'], by: { x: a, y: -a } }];
    case 7: return ['selection.paste', { clipboard: copySelection(d, seg ? [seg.id] : []), offset: { x: a, y: b / 10 } }];
    case 8: return ['design.setSubstrate', { substrate: { er: 1 + b * 10 } }];
    case 9: return ['segment.setSpec', { id: seg?.id ?? 'none', spec: i % 2 ? { width: { by: 'z0', z0: 20 + b * 100 } } : { length: { by: 'degrees', deg: b * 180 } } }];
    case 10: return ['node.add', { at, spec: { kind: (['port', 'open', 'vertex', 'junction', 'short'] as const)[i % 5] } }];
    default: return ['node.setSpec', { id: node?.id ?? 'none', spec: { kind: (['port', 'open', 'vertex', 'junction', 'short'] as const)[i % 5] } }];
  }
}

describe('properties', () => {
  const starts = ['demo.json', 'wilkinson-2g45.json', 'branchline-10g4.json', 'shorted-stub-match.json'].map(load);
  it('random command sequences: every result is valid; undo all → the start; redo all → the end', () => {
    fc.assert(fc.property(fc.nat({ max: starts.length - 1 }), fc.array(op, { minLength: 1, maxLength: 25 }), fc.boolean(), (k, ops, marks) => {
      const start = starts[k]!;
      const h = new History(start);
      let steps = 0;
      for (const o of ops) {
        const [id, args] = call(h.doc, o);
        try { h.apply(id, args); } catch (e) { if (!(e instanceof InputError)) throw e; continue; }
        const v = validateDesign(h.doc);
        if (!v.ok) throw new Error(`${id} left an invalid design: ${v.errors[0]!.message}`);
        if (marks) { h.mark(); steps++; }
      }
      const end = h.doc;
      while (h.undo()) { /* all the way back */ }
      expect(serializeDesign(h.doc)).toBe(serializeDesign(start));
      expect(h.doc).toEqual(start);
      while (h.redo()) { /* all the way forward */ }
      expect(serializeDesign(h.doc)).toBe(serializeDesign(end));
      return steps >= 0;
    }), { seed: SEED, numRuns: 150 });
  });
  it('diff then inverse is the identity for any pair of designs reached by commands', () => {
    fc.assert(fc.property(fc.array(op, { minLength: 1, maxLength: 10 }), (ops) => {
      const a = starts[0]!;
      let b = a;
      for (const o of ops) { const [id, args] = call(b, o); try { b = runCommand(b, id, args); } catch (e) { if (!(e instanceof InputError)) throw e; } }
      const d = diffDesigns(a, b);
      expect(applyDiff(a, d)).toEqual(b);
      expect(applyDiff(b, invertDiff(d))).toEqual(a);
    }), { seed: SEED, numRuns: 150 });
  });
});

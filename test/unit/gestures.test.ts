/**
 * The drawing gestures as design commands (core/design/gestures.ts): route, tee, stub and insert, each one command
 * (one undo step) that the app, generators and the CLI share. What is checked are the project's own drawing rules
 * (where a run may start and end, which side a width step changes) and one fact of the layout: a part inserted into
 * a drawn line takes its pad pitch from the line, so no other node is placed anywhere else afterwards.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { History, InputError, newDesign, parseDesign, runCommand, sizeDesign, smdFootprint, type DesignDoc } from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const load = (name: string): DesignDoc => { const r = parseDesign(readFileSync(join(EX, name), 'utf8')); if (!r.ok) throw new Error('bad example'); return r.doc; };
const node = (d: DesignDoc, id: string) => d.nodes.find((n) => n.id === id)!;
const degree = (d: DesignDoc, id: string) => d.segments.filter((s) => s.a === id || s.b === id).length;
const refusal = (fn: () => unknown): InputError => { try { fn(); } catch (e) { if (e instanceof InputError) return e; throw e; } throw new Error('not refused'); };

/** A port at the origin with one 20 mm line along +x ending open at n1. */
function oneLine(): DesignDoc {
  let d = runCommand(newDesign(), 'node.add', { id: 'p', at: { x: 0, y: 0 }, spec: { kind: 'port' } });
  d = runCommand(d, 'run.route', { from: 'p', points: [{ x: 0.02, y: 0 }] });
  return d;
}

describe('run.route', () => {
  it('draws a run from a port through corners; corners are bends, the last point an open end, one undo step', () => {
    const h = new History(runCommand(newDesign(), 'node.add', { id: 'p', at: { x: 0, y: 0 }, spec: { kind: 'port' } }));
    h.apply('run.route', { from: 'p', points: [{ x: 0.01, y: 0 }, { x: 0.01, y: 0.01 }, { x: 0.02, y: 0.01 }] });
    h.mark();
    const d = h.doc;
    expect(d.segments).toHaveLength(3);
    expect(d.nodes.map((n) => n.kind)).toEqual(['port', 'vertex', 'vertex', 'open']);
    h.undo();
    expect(h.doc.segments).toHaveLength(0);
  });
  it('starts at a corner (which becomes a tee), at an open end (which becomes a corner) and at a dangling corner', () => {
    const demo = load('demo.json');
    const fromCorner = runCommand(demo, 'run.route', { from: 'c1', points: [{ x: -0.07, y: 0.0305 }] });
    expect(node(fromCorner, 'c1').kind).toBe('junction');
    expect(degree(fromCorner, 'c1')).toBe(3);
    // The new line takes the width of a line already there (100 Ω at c1).
    expect(fromCorner.segments.at(-1)).toMatchObject({ kind: 'line', width: { by: 'z0', z0: 100 } });
    const d = oneLine();
    const end = d.nodes.find((n) => n.kind === 'open')!.id;
    const on = runCommand(d, 'run.route', { from: end, points: [{ x: 0.02, y: 0.01 }] });
    expect(node(on, end).kind).toBe('vertex');
    // A corner left with one line (as an older app left it after a delete) can be routed from too.
    const dangling = runCommand(d, 'node.setSpec', { id: end, spec: { kind: 'vertex' } });
    expect(degree(runCommand(dangling, 'run.route', { from: end, points: [{ x: 0.03, y: 0.01 }] }), end)).toBe(2);
  });
  it('ends on an existing line by making a tee there', () => {
    const d = oneLine();
    let e = runCommand(d, 'node.add', { id: 'q', at: { x: 0.01, y: 0.02 }, spec: { kind: 'port' } });
    e = runCommand(e, 'run.route', { from: 'q', points: [{ x: 0.01, y: 0 }], onto: { segment: 's1' } });
    const tee = e.nodes.find((n) => n.kind === 'junction')!;
    expect(tee.at).toEqual({ x: 0.01, y: 0 });
    expect(degree(e, tee.id)).toBe(3);
    expect(e.segments).toHaveLength(3);
    // Ending on a node with room joins it (an open end becomes a corner).
    const end = d.nodes.find((n) => n.kind === 'open')!.id;
    let f = runCommand(d, 'node.add', { id: 'q', at: { x: 0.02, y: 0.02 }, spec: { kind: 'port' } });
    f = runCommand(f, 'run.route', { from: 'q', points: [{ x: 0.02, y: 0 }], onto: { node: end } });
    expect(node(f, end).kind).toBe('vertex');
  });
  it('refuses a port that already has its line, saying where to start instead, and changes nothing', () => {
    const d = oneLine();
    const err = refusal(() => runCommand(d, 'run.route', { from: 'p', points: [{ x: 0, y: 0.01 }] }));
    expect(err.field).toBe('args.from');
    expect(err.got).toContain('start from the open end or a corner');
  });
});

describe('run.tee and run.stub', () => {
  it('run.tee splits a line with a tee and draws its branch', () => {
    const d = runCommand(oneLine(), 'run.tee', { segment: 's1', at: { x: 0.008, y: 0 }, points: [{ x: 0.008, y: 0.01 }, { x: 0.015, y: 0.01 }] });
    const tee = d.nodes.find((n) => n.kind === 'junction')!;
    expect(tee.at).toEqual({ x: 0.008, y: 0 });
    expect(degree(d, tee.id)).toBe(3);
    expect(d.nodes.filter((n) => n.kind === 'open')).toHaveLength(2);
  });
  it('run.stub hangs a 90° stub at right angles on the side asked for, shorted through a via', () => {
    const d = runCommand(oneLine(), 'run.stub', { segment: 's1', at: { x: 0.01, y: 0 }, side: -1, end: 'short' });
    const tip = d.nodes.find((n) => n.kind === 'short')!;
    expect(tip.at.x).toBeCloseTo(0.01, 12);
    expect(tip.at.y).toBeLessThan(0);
    expect(d.segments.at(-1)).toMatchObject({ length: { by: 'degrees', deg: 90 } });
  });
});

describe('run.insert', () => {
  it('a width step changes the side whose end is nearer the click, or the side asked for', () => {
    const d = oneLine();
    const near = runCommand(d, 'run.insert', { segment: 's1', at: { x: 0.015, y: 0 }, kind: 'step' });
    // The click at 15 of 20 mm is nearer the far end: the piece from the step to that end changes.
    const far = near.segments.find((s) => s.id !== 's1')!;
    expect(far).toMatchObject({ width: { by: 'z0', z0: 70.7 } });
    expect(near.segments.find((s) => s.id === 's1')).toMatchObject({ width: { by: 'z0', z0: 50 } });
    const asked = runCommand(d, 'run.insert', { segment: 's1', at: { x: 0.015, y: 0 }, kind: 'step', side: 'a', width: { by: 'z0', z0: 35 } });
    expect(asked.segments.find((s) => s.id === 's1')).toMatchObject({ width: { by: 'z0', z0: 35 } });
  });
  it('a part takes its pad pitch from the line and nothing else on the board moves', () => {
    const demo = load('demo.json');
    const before = sizeDesign(demo);
    // The 50 Ω feed (drawn, 14 mm along +y) gets a 0805 capacitor 6 mm up.
    const d = runCommand(demo, 'run.insert', { segment: 'feed', at: { x: 0, y: 0.006 }, kind: 'part', part: 'capacitor', size: '0805', value: 10e-12 });
    const part = d.segments.find((s) => s.kind === 'lumped')!;
    const span = Math.hypot(node(d, part.b).at.x - node(d, part.a).at.x, node(d, part.b).at.y - node(d, part.a).at.y);
    expect(span).toBeCloseTo(smdFootprint('0805').pitch, 9);
    const after = sizeDesign(d);
    for (const n of before.nodes) {
      const p = after.nodes.find((x) => x.id === n.id)!;
      expect(Math.hypot(p.pos.x - n.pos.x, p.pos.y - n.pos.y), n.id).toBeLessThan(1e-9);
    }
  });
  it('refuses a part that does not fit in what is left of the line', () => {
    const err = refusal(() => runCommand(oneLine(), 'run.insert', { segment: 's1', at: { x: 0.0195, y: 0 }, kind: 'part', size: '1206' }));
    expect(err.field).toBe('args.at');
  });
});

describe('the input port the user chose', () => {
  it('the network takes the first phase group\'s input as its input (the ledger\'s choice), else the anchor port', async () => {
    const { netlistFromSized } = await import('../../core/index.ts');
    const demo = load('demo.json');
    const netIn = (d: DesignDoc) => { const n = netlistFromSized(sizeDesign(d)); return n.ports[n.input]!.node; };
    expect(netIn(demo)).toBe('in');
    expect(netIn(runCommand(demo, 'phaseGroup.set', { id: 'outputs', from: 'out2', to: ['in', 'out1', 'out3', 'out4'] }))).toBe('out2');
    expect(netIn(runCommand(demo, 'phaseGroup.delete', { id: 'outputs' }))).toBe('in');
  });
  it('S-parameters number from the chosen input: it becomes port 1, the others keep their drawn order', async () => {
    const { netlistFromSized } = await import('../../core/index.ts');
    const demo = load('demo.json');
    const order = (d: DesignDoc) => netlistFromSized(sizeDesign(d)).ports.map((p) => p.node);
    expect(order(demo)).toEqual(['in', 'out1', 'out2', 'out3', 'out4']);
    const moved = runCommand(demo, 'phaseGroup.set', { id: 'outputs', from: 'out2', to: ['in', 'out1', 'out3', 'out4'] });
    expect(order(moved)).toEqual(['out2', 'in', 'out1', 'out3', 'out4']);
    expect(netlistFromSized(sizeDesign(moved)).input).toBe(0);
  });
});

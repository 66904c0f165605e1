/**
 * Design commands: each is pure (the input design is deep-frozen, so any mutation throws), checks its arguments
 * (InputError naming the argument), and leaves a design the loader accepts. Geometry checks use plain rotation and
 * reflection maths; "common practice" marks the defaults taken from the trade.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  DESIGN_COMMANDS, InputError, copySelection, newDesign, parseDesign, runCommand, serializeDesign, validateDesign, type DesignDoc,
} from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const load = (name: string): DesignDoc => { const r = parseDesign(readFileSync(join(EX, name), 'utf8')); if (!r.ok) throw new Error('bad example'); return r.doc; };

function deepFreeze<T>(o: T): T {
  if (o && typeof o === 'object' && !Object.isFrozen(o)) { Object.freeze(o); for (const v of Object.values(o)) deepFreeze(v); }
  return o;
}
/** Runs a command on a frozen copy and checks the result is a valid design and the input was left alone. */
function run(doc: DesignDoc, id: string, args: unknown): DesignDoc {
  const before = serializeDesign(doc);
  const frozen = deepFreeze(structuredClone(doc));
  const out = runCommand(frozen, id, args);
  expect(serializeDesign(frozen)).toBe(before);
  const v = validateDesign(out);
  if (!v.ok) throw new Error(v.errors.map((e) => e.message).join('\n'));
  return out;
}
function refusal(fn: () => unknown): { field: string; message: string } {
  try { fn(); } catch (e) { if (e instanceof InputError) return { field: e.field, message: e.message }; throw e; }
  throw new Error('expected an InputError');
}

/** A port, a bend and an open end: p —s1— v —s2— e. */
function small(): DesignDoc {
  let d = newDesign({ name: 'small' });
  d = runCommand(d, 'node.add', { id: 'p', at: { x: 0, y: 0 }, spec: { kind: 'port' } });
  d = runCommand(d, 'run.extend', { from: 'p', to: { x: 0.01, y: 0 } });
  d = runCommand(d, 'run.extend', { from: 'n1', to: { x: 0.01, y: 0.01 } });
  return d;
}

describe('registry', () => {
  it('every command has a unique id of the form area.verb and a label', () => {
    for (const [id, c] of DESIGN_COMMANDS) {
      expect(c.id).toBe(id);
      expect(id).toMatch(/^[a-z][A-Za-z]*\.[a-z][A-Za-z]*$/);
      expect(c.label.length).toBeGreaterThan(2);
    }
  });
  it('an unknown command id and non-object args are refused', () => {
    expect(refusal(() => runCommand(newDesign(), 'node.teleport', {})).field).toBe('command');
    expect(refusal(() => runCommand(newDesign(), 'node.add', 5)).message).toBe('node.add args: expected an object of named arguments, got 5');
  });
});

describe('nodes and segments', () => {
  it('node.add places a node with kind defaults (a port is 50 Ω, common practice) and fresh ids', () => {
    const d = run(newDesign(), 'node.add', { at: { x: 0.001, y: 0.002 }, spec: { kind: 'port' } });
    expect(d.nodes).toEqual([{ id: 'n1', at: { x: 0.001, y: 0.002 }, kind: 'port', zRef: 50, heading: 0 }]);
    const d2 = run(d, 'node.add', { at: { x: 0, y: 0 }, spec: { kind: 'short' } });
    expect(d2.nodes[1]).toMatchObject({ id: 'n2', kind: 'short', via: { drill: 0.8e-3, pad: 1.4e-3, count: 1 } });
  });
  it('node.add refuses bad positions, kinds, specs and taken ids', () => {
    expect(refusal(() => runCommand(newDesign(), 'node.add', { at: { x: 'a', y: 0 } })).message).toBe('args.at.x: expected a coordinate in metres within ±10 m, got "a"');
    expect(refusal(() => runCommand(newDesign(), 'node.add', { at: { x: 0, y: 0 }, spec: { kind: 'hole' } })).field).toBe('args.spec.kind');
    expect(refusal(() => runCommand(newDesign(), 'node.add', { at: { x: 0, y: 0 }, spec: { kind: 'port', zRef: -50 } })).message).toBe('args.spec.zRef: expected an impedance in ohms above 0, got -50');
    expect(refusal(() => runCommand(small(), 'node.add', { id: 'p', at: { x: 0, y: 0 } })).message).toBe('args.id: expected an id not used in the design, got "p"');
  });
  it('node.move moves only that node and refuses to put both ends of a segment on one spot', () => {
    const d = small();
    const m = run(d, 'node.move', { id: 'n2', at: { x: 0.02, y: 0.01 } });
    expect(m.nodes.find((n) => n.id === 'n2')!.at).toEqual({ x: 0.02, y: 0.01 });
    expect(m.nodes.filter((n) => n.id !== 'n2')).toEqual(d.nodes.filter((n) => n.id !== 'n2'));
    expect(runCommand(d, 'node.move', { id: 'n2', at: { x: 0.02, y: 0.01 } }).nodes[0]).toBe(d.nodes[0]); // untouched records keep their identity (cheap diffs)
    expect(refusal(() => runCommand(d, 'node.move', { id: 'n2', at: { x: 0.01, y: 0 } })).message).toBe('segments[1]: expected ends at two different places (the drawing gives each piece its direction), got both ends at (0.01, 0) m after node.move (the edit was not made)');
    expect(refusal(() => runCommand(d, 'node.move', { id: 'zz', at: { x: 0, y: 0 } })).message).toBe('args.id: expected the id of a node in the design, got "zz"');
  });
  it('node.setSpec changes fields, and a kind change drops the old kind\'s fields', () => {
    const d = small();
    const a = run(d, 'node.setSpec', { id: 'p', spec: { zRef: 75 }, label: 'in' });
    expect(a.nodes[0]).toMatchObject({ kind: 'port', zRef: 75, label: 'in' });
    const b = run(d, 'node.setSpec', { id: 'n2', spec: { kind: 'short' } });
    expect(b.nodes[2]).toEqual({ id: 'n2', at: { x: 0.01, y: 0.01 }, kind: 'short', via: { drill: 0.8e-3, pad: 1.4e-3, count: 1 } });
    // A vertex carries two segments; it cannot become a port (one segment).
    expect(refusal(() => runCommand(d, 'node.setSpec', { id: 'n1', spec: { kind: 'port' } })).message).toBe('nodes[1]: expected one segment at a port, got 2 segments meeting at port "n1" after node.setSpec (the edit was not made)');
    expect(refusal(() => runCommand(d, 'node.setSpec', { id: 'p', spec: { id: 'q' } })).field).toBe('args.spec.id');
  });
  it('segment.add joins two nodes with a 50 Ω drawn line by default, and respects node degree', () => {
    let d = newDesign();
    d = runCommand(d, 'node.add', { id: 'a', at: { x: 0, y: 0 }, spec: { kind: 'port' } });
    d = runCommand(d, 'node.add', { id: 'b', at: { x: 0.01, y: 0 }, spec: { kind: 'open' } });
    const s = run(d, 'segment.add', { a: 'a', b: 'b' });
    expect(s.segments).toEqual([{ id: 's1', a: 'a', b: 'b', kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } }]);
    expect(refusal(() => runCommand(s, 'segment.add', { a: 'a', b: 'b' })).message).toBe('args.a: expected a node with room for another segment (one segment at a port), got "a", a port with 1 already');
    expect(refusal(() => runCommand(d, 'segment.add', { a: 'a', b: 'a' })).message).toBe('args.b: expected a node other than a, got "a"');
    expect(refusal(() => runCommand(d, 'segment.add', { a: 'a', b: 'b', spec: { kind: 'line', width: { by: 'z0', z0: 0 }, length: { by: 'drawn' } } })).message).toBe('args.spec.width.z0: expected an impedance in ohms above 0, got 0');
  });
  it('segment.setSpec changes a segment and refuses bad specs', () => {
    const d = small();
    const a = run(d, 'segment.setSpec', { id: 's1', spec: { length: { by: 'degrees', deg: 90 } } });
    expect(a.segments[0]).toMatchObject({ id: 's1', length: { by: 'degrees', deg: 90 }, width: { by: 'z0', z0: 50 } });
    const b = run(d, 'segment.setSpec', { id: 's1', spec: { kind: 'lumped', part: 'resistor', value: 100, size: '0603', width: { by: 'width', width: 0.8e-3 } } });
    expect(b.segments[0]).toEqual({ id: 's1', a: 'p', b: 'n1', kind: 'lumped', part: 'resistor', value: 100, size: '0603', width: { by: 'width', width: 0.8e-3 } });
    expect(refusal(() => runCommand(d, 'segment.setSpec', { id: 's1', spec: { length: { by: 'degrees', deg: -5 } } })).message).toBe('args.spec.length.deg: expected an electrical length in degrees above 0 and at most 3600, got -5');
  });
});

describe('runs and tees', () => {
  it('run.extend from a port adds an open end; from an open end turns it into a bend', () => {
    const d = small();
    expect(d.nodes.map((n) => [n.id, n.kind])).toEqual([['p', 'port'], ['n1', 'vertex'], ['n2', 'open']]);
    expect(d.segments.map((s) => [s.id, s.a, s.b])).toEqual([['s1', 'p', 'n1'], ['s2', 'n1', 'n2']]);
    const e = run(d, 'run.extend', { from: 'n2', to: { x: 0.02, y: 0.01 }, end: 'short' });
    expect(e.nodes.find((n) => n.id === 'n2')!.kind).toBe('vertex');
    expect(e.nodes.at(-1)).toMatchObject({ id: 'n3', kind: 'short' });
    expect(refusal(() => runCommand(d, 'run.extend', { from: 'n1', to: { x: 0, y: 0.02 } })).message).toBe('args.from: expected a node with room for another segment (two segments at a vertex), got "n1", a vertex with 2 already');
    expect(refusal(() => runCommand(d, 'run.extend', { from: 'p', to: { x: 0, y: 0.02 } })).field).toBe('args.from');
  });
  it('run.extend carries the width of the run it continues', () => {
    let d = small();
    d = runCommand(d, 'segment.setSpec', { id: 's2', spec: { width: { by: 'z0', z0: 70.7 }, length: { by: 'degrees', deg: 90 } } });
    const e = run(d, 'run.extend', { from: 'n2', to: { x: 0.02, y: 0.01 } });
    expect(e.segments.at(-1)).toMatchObject({ kind: 'line', width: { by: 'z0', z0: 70.7 }, length: { by: 'drawn' } });
  });
  it('segment.split adds a tee at the nearest point of the segment and a branch; fixed lengths split in proportion', () => {
    let d = small();
    d = runCommand(d, 'segment.setSpec', { id: 's1', spec: { length: { by: 'degrees', deg: 90 } } });
    const t = run(d, 'segment.split', { id: 's1', at: { x: 0.0025, y: 0.0004 }, branchTo: { x: 0.0025, y: -0.005 } });
    const j = t.nodes.find((n) => n.kind === 'junction')!;
    expect(j.at).toEqual({ x: 0.0025, y: 0 }); // projection onto the segment
    const [first, second] = t.segments.filter((s) => s.a === j.id || s.b === j.id).filter((s) => s.kind === 'line' && s.length.by === 'degrees');
    expect(first).toMatchObject({ id: 's1', a: 'p', b: j.id, length: { by: 'degrees', deg: 22.5 } });
    expect(second).toMatchObject({ a: j.id, b: 'n1', length: { by: 'degrees', deg: 67.5 } });
    expect(t.segments.indexOf(second!)).toBe(1); // kept in place, after the first half
    expect(t.nodes.at(-1)).toMatchObject({ kind: 'open', at: { x: 0.0025, y: -0.005 } });
    expect(refusal(() => runCommand(d, 'segment.split', { id: 's1', at: { x: 0, y: 0 } })).message).toBe('args.at: expected a point along the segment, away from its ends, got a point 0.0 % of the way along');
    const noBranch = run(d, 'segment.split', { id: 's2', at: { x: 0.01, y: 0.005 } });
    expect(noBranch.nodes.at(-1)).toMatchObject({ kind: 'vertex', at: { x: 0.01, y: 0.005 } });
  });
  it('segment.split refuses parts and tapers', () => {
    const d = runCommand(small(), 'segment.setSpec', { id: 's1', spec: { kind: 'lumped', part: 'capacitor', value: 1e-12, size: '0402', width: { by: 'z0', z0: 50 } } });
    expect(refusal(() => runCommand(d, 'segment.split', { id: 's1', at: { x: 0.005, y: 0 } })).message).toBe('args.id: expected a line segment (tapers, parts and measured blocks are single pieces), got a lumped segment');
  });
});

describe('selections', () => {
  it('selection.delete: a deleted port leaves an open end on its line; ends left alone settle; phase groups are pruned', () => {
    const d = load('demo.json');
    const del = run(d, 'selection.delete', { ids: ['out1'] });
    // The port's line stays and ends open there, so it can be routed on or made a port again.
    expect(del.nodes.find((n) => n.id === 'out1')).toMatchObject({ kind: 'open', at: d.nodes.find((n) => n.id === 'out1')!.at });
    expect(del.segments.some((s) => s.id === 'up1')).toBe(true);
    expect(del.phaseGroups[0]!.to).toEqual(['out2', 'out3', 'out4']);
    // A port with its line both selected goes with the line; the corner left with one line becomes an open end.
    const both = run(d, 'selection.delete', { ids: ['out1', 'up1'] });
    expect(both.nodes.some((n) => n.id === 'out1')).toBe(false);
    expect(both.nodes.find((n) => n.id === 'c1')!.kind).toBe('open');
    // A tee that loses a line becomes a corner.
    expect(run(d, 'selection.delete', { ids: ['br1'] }).nodes.find((n) => n.id === 'tl')!.kind).toBe('vertex');
    const segOnly = run(small(), 'selection.delete', { ids: ['s2'] });
    // n2 (an open end) had only s2: it goes; n1 (the bend) keeps s1 and becomes an open end.
    expect(segOnly.nodes.map((n) => [n.id, n.kind])).toEqual([['p', 'port'], ['n1', 'open']]);
    expect(refusal(() => runCommand(d, 'selection.delete', { ids: ['nope'] })).message).toBe('args.ids[0]: expected the id of a record in the design, got "nope"');
    expect(refusal(() => runCommand(d, 'selection.delete', { ids: [] })).message).toBe('args.ids: expected a non-empty list of record ids, got a list of 0');
  });
  it('selection.translate moves selected nodes, the ends of selected segments and areas', () => {
    const d = small();
    const t = run(d, 'selection.translate', { ids: ['s2'], by: { x: 0.001, y: -0.002 } });
    expect(t.nodes.map((n) => n.at)).toEqual([{ x: 0, y: 0 }, { x: 0.011, y: -0.002 }, { x: 0.011, y: 0.008 }]);
  });
  it('selection.rotate by 90° about a point maps (x, y) → (−y, x) exactly and turns port headings', () => {
    const d = small();
    const r = run(d, 'selection.rotate', { ids: ['p', 'n1', 'n2'], about: { x: 0, y: 0 }, angleDeg: 90 });
    expect(r.nodes.map((n) => n.at)).toEqual([{ x: 0, y: 0 }, { x: 0, y: 0.01 }, { x: -0.01, y: 0.01 }]);
    expect(r.nodes[0]).toMatchObject({ heading: Math.PI / 2 });
    const r30 = run(d, 'selection.rotate', { ids: ['n2'], about: { x: 0.01, y: 0 }, angleDeg: 30 });
    // rotation matrix [cos −sin; sin cos] on (0, 0.01): (−0.005, 0.00866) about (0.01, 0), on the 1 nm grid
    expect(r30.nodes[2]!.at).toEqual({ x: 0.005, y: 0.008660254 });
    expect(refusal(() => runCommand(d, 'selection.rotate', { ids: ['p'], about: { x: 0, y: 0 }, angleDeg: 720 })).field).toBe('args.angleDeg');
  });
  it('selection.mirror reflects positions and port headings; twice gives the original back', () => {
    const d = small();
    const m = run(d, 'selection.mirror', { ids: ['p', 'n1', 'n2'], axis: 'vertical', about: { x: 0.005, y: 0 } });
    expect(m.nodes.map((n) => n.at)).toEqual([{ x: 0.01, y: 0 }, { x: 0, y: 0 }, { x: 0, y: 0.01 }]);
    expect(m.nodes[0]).toMatchObject({ heading: Math.PI }); // a port facing +x now faces −x
    const back = run(m, 'selection.mirror', { ids: ['p', 'n1', 'n2'], axis: 'vertical', about: { x: 0.005, y: 0 } });
    expect(back.nodes.map((n) => n.at)).toEqual(d.nodes.map((n) => n.at));
    expect(refusal(() => runCommand(d, 'selection.mirror', { ids: ['p'], axis: 'diagonal', about: { x: 0, y: 0 } })).field).toBe('args.axis');
  });
  it('copy and paste: fresh ids, links remapped, offset applied, the original untouched', () => {
    const d = small();
    const clip = copySelection(d, ['s2']);
    const p = run(d, 'selection.paste', { clipboard: clip, offset: { x: 0, y: 0.02 } });
    expect(p.nodes.slice(3)).toEqual([
      { id: 'n3', at: { x: 0.01, y: 0.02 }, kind: 'vertex', bend: { style: 'miter-optimal' } },
      { id: 'n4', at: { x: 0.01, y: 0.03 }, kind: 'open' },
    ]);
    expect(p.segments.slice(2)).toEqual([{ id: 's3', a: 'n3', b: 'n4', kind: 'line', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } }]);
    const ids = [...p.nodes, ...p.segments].map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
    // Pasting twice gives new ids again.
    const p2 = run(p, 'selection.paste', { clipboard: clip, offset: { x: 0, y: 0.04 } });
    expect(p2.nodes.slice(5).map((n) => n.id)).toEqual(['n5', 'n6']);
    expect(refusal(() => runCommand(d, 'selection.paste', { clipboard: '{"format":"other"}' })).field).toBe('clipboard.format');
    expect(refusal(() => runCommand(d, 'selection.paste', { clipboard: '{"format":' })).field).toBe('clipboard');
  });
});

describe('design settings, board, areas, phase groups', () => {
  it('design.setSubstrate merges and checks', () => {
    const d = run(newDesign(), 'design.setSubstrate', { substrate: { er: 3.66, h: 0.508e-3 } });
    expect(d.substrate).toMatchObject({ er: 3.66, h: 0.508e-3, t: 35e-6 });
    expect(refusal(() => runCommand(d, 'design.setSubstrate', { substrate: { h: 1.6 } })).message).toBe('args.substrate.h: expected a dielectric height in metres from 10 µm to 50 mm (1.6 mm is 0.0016), got 1.6');
  });
  it('design.setFrequency checks f0 and the band order', () => {
    const d = run(newDesign(), 'design.setFrequency', { f0: 5.8e9, band: { start: 5.725e9, stop: 5.875e9 } });
    expect(d.frequency).toEqual({ f0: 5.8e9, band: { start: 5.725e9, stop: 5.875e9 } });
    expect(refusal(() => runCommand(d, 'design.setFrequency', { band: { start: 6e9, stop: 5e9 } })).message).toBe('args.band.stop: expected a band stop above its start (6000000000 Hz), got 5000000000');
    expect(refusal(() => runCommand(d, 'design.setFrequency', { f0: 0 })).field).toBe('args.f0');
  });
  it('design.setProcess, design.setInfo, view.set', () => {
    const d = run(newDesign(), 'design.setProcess', { process: { kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.08e-3 } });
    expect(d.process).toEqual({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.08e-3 });
    expect(refusal(() => runCommand(d, 'design.setProcess', { process: { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 180, depth: 1e-4 } })).field).toBe('args.process.angleDeg');
    const i = run(d, 'design.setInfo', { name: 'Renamed', notes: 'n' });
    expect([i.name, i.notes]).toEqual(['Renamed', 'n']);
    expect('notes' in run(i, 'design.setInfo', { notes: null })).toBe(false);
    expect(run(d, 'view.set', { grid: 0.000254 }).view).toEqual({ grid: 0.000254 });
    // Display units are the app's view setting (format 7): the design refuses them.
    expect(refusal(() => runCommand(d, 'view.set', { units: 'mil' })).field).toBe('args.units');
  });
  it('board.setOutline and area.add / area.set check the polygon', () => {
    const sq = [{ x: 0, y: 0 }, { x: 0.02, y: 0 }, { x: 0.02, y: 0.02 }, { x: 0, y: 0.02 }];
    const b = run(newDesign(), 'board.setOutline', { outline: sq });
    expect(b.board).toEqual({ outline: sq });
    expect(run(b, 'board.setOutline', { outline: null }).board).toBeNull();
    expect(refusal(() => runCommand(b, 'board.setOutline', { outline: [sq[0], sq[2], sq[1], sq[3]] })).message).toBe('board.outline: expected an outline that does not cross itself, got edges 0–1 and 2–3 crossing after board.setOutline (the edit was not made)');
    const a = run(b, 'area.add', { kind: 'keep-out', polygon: sq, clearance: 1e-3 });
    expect(a.areas).toEqual([{ id: 'area1', kind: 'keep-out', polygon: sq, clearance: 1e-3 }]);
    expect(run(a, 'area.set', { id: 'area1', kind: 'ground-copper' }).areas[0]!.kind).toBe('ground-copper');
    expect(refusal(() => runCommand(b, 'area.add', { kind: 'moat', polygon: sq })).field).toBe('args.kind');
  });
  it('phaseGroup.set adds or replaces a group and checks its ports', () => {
    const d = load('wilkinson-2g45.json');
    const g = run(d, 'phaseGroup.set', { id: 'outputs', toleranceDeg: 1 });
    expect(g.phaseGroups).toEqual([{ ...d.phaseGroups[0], toleranceDeg: 1 }]);
    const n = run(d, 'phaseGroup.set', { name: 'pair', from: 'o1', to: ['o2'] });
    expect(n.phaseGroups[1]).toEqual({ id: 'pg1', name: 'pair', from: 'o1', to: ['o2'], toleranceDeg: 5 });
    expect(refusal(() => runCommand(d, 'phaseGroup.set', { name: 'x', from: 'j', to: ['o1'] })).message).toBe('phaseGroups[1].from: expected the id of a port node, got "j" after phaseGroup.set (the edit was not made)');
  });
});

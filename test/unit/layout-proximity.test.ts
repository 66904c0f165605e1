/**
 * Proximity in the shop check (core/layout/proximity.ts via checkFabrication). The estimate is the backward coupling
 * of a matched coupled section (D. M. Pozar, Microwave Engineering, 4th ed., §7.6); here it is checked against the
 * nodal solution of the same two runs drawn as one coupled pair, and the rule is run on every example design.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import {
  newDesign, sizeDesign, buildBoardGeometry, checkFabrication, initPolygons, parseDesign, netlistFromSized, solveNetwork, magnitudeDb, portIndex,
  type DesignDoc, type DesignNode, type DesignSegment,
} from '../../core/index.ts';

beforeAll(async () => { await initPolygons(); });

const SUB = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };
const W = 3e-3, L = 15e-3;

/** Two straight 50 Ω-ish runs of width W, `gap` apart edge to edge, each between two ports: two separate paths. */
function twoRuns(gap: number): DesignDoc {
  const doc = newDesign({ name: 'two runs', substrate: SUB, f0: 2.45e9, process: { kind: 'etch', edgeBias: 0, minFeature: 0.1e-3 } });
  const y2 = -(W + gap);
  const port = (id: string, x: number, y: number, heading: number): DesignNode => ({ id, kind: 'port', zRef: 50, heading, at: { x, y } });
  doc.nodes = [port('a1', 0, 0, 0), port('a2', L, 0, Math.PI), port('b1', 0, y2, 0), port('b2', L, y2, Math.PI)];
  const seg = (id: string, a: string, b: string): DesignSegment => ({ id, kind: 'line', a, b, width: { by: 'width', width: W }, length: { by: 'length', length: L } });
  doc.segments = [seg('run-a', 'a1', 'a2'), seg('run-b', 'b1', 'b2')];
  return doc;
}

describe('proximity findings', () => {
  it('names two runs closer than 3h, marks where, and estimates the coupling as a coupled pair solved by the network does (within 0.5 dB)', () => {
    const gap = 0.8e-3;
    const sized = sizeDesign(twoRuns(gap));
    const f = checkFabrication(sized, buildBoardGeometry(sized)).filter((x) => x.code === 'proximity');
    expect(f).toHaveLength(1);
    expect(f[0]!.subjects.sort()).toEqual(['run-a', 'run-b']);
    expect(f[0]!.at!.x).toBeCloseTo(L / 2, 6);
    const est = Number(/about (-?\d+\.\d) dB/.exec(f[0]!.message)![1]);
    // The same runs as one coupled pair (format 3), ports at its four ends, solved by the nodal solver.
    const doc = twoRuns(gap);
    doc.segments = [{ id: 'pair', kind: 'coupled', a: 'a1', b: 'a2', c: 'b1', d: 'b2', pair: { by: 'geometry', width: W, gap }, length: { by: 'length', length: L } }];
    const r = solveNetwork(netlistFromSized(sizeDesign(doc)), [2.45e9]);
    const s31 = magnitudeDb(r, portIndex(r, 'b1'), portIndex(r, 'a1'))[0]!;
    expect(Math.abs(est - s31)).toBeLessThan(0.5);
  });
  it('is quiet beyond the limit, and the limit can be set', () => {
    const sized = sizeDesign(twoRuns(6e-3)); // 3.75 h
    const g = buildBoardGeometry(sized);
    expect(checkFabrication(sized, g).filter((x) => x.code === 'proximity')).toEqual([]);
    expect(checkFabrication(sized, g, { proximityLimit: 8e-3 }).filter((x) => x.code === 'proximity')).toHaveLength(1);
  });
  it('runs on every example design without error, naming only pieces that exist', () => {
    const dir = join(import.meta.dirname, '..', '..', 'assets', 'examples');
    const seen: string[] = [];
    for (const f of readdirSync(dir).filter((x) => x.endsWith('.json'))) {
      const p = parseDesign(readFileSync(join(dir, f), 'utf8'));
      if (!p.ok) throw new Error(f);
      const sized = sizeDesign(p.doc);
      const ids = new Set(sized.pieces.map((x) => x.id));
      const found = checkFabrication(sized, buildBoardGeometry(sized), { proximityLimit: 10 * p.doc.substrate.h }).filter((y) => y.code === 'proximity');
      seen.push(...found.map((x) => `${f}:${[...x.subjects].sort().join('/')}`));
      for (const x of found) {
        expect(x.subjects.every((s) => ids.has(s))).toBe(true);
        expect(x.message).toMatch(/dB couples/);
      }
    }
    // Runs of the examples that lie 6–10 h apart (measured on their drawings): the neighbour search must find them,
    // and corners that merely pass each other (the Wilkinson's arm ends beside its outputs) are not runs side by side.
    expect(seen).toEqual(expect.arrayContaining(['branchline-10g4.json:shunt1/shunt2', 'branchline-10g4.json:thru1/thru2', 'demo.json:arml/br2']));
    expect(seen.filter((x) => /wilkinson-2g45\.json:(arma1\/outa1|armb1\/outb1)$/.test(x))).toEqual([]);
  });
  it('reads the design\'s own limit (format 11) when no override is given; an override wins, 0 switches it off', async () => {
    const { proximityLimitFor, proximityLimitSettingFrom, proximityLimitText } = await import('../../core/index.ts');
    const doc = twoRuns(6e-3); // 3.75 h: outside the default 3 h
    const near = (d: DesignDoc, opts: { proximityLimit?: number } = {}) => { const s = sizeDesign(d); return checkFabrication(s, buildBoardGeometry(s), opts).filter((x) => x.code === 'proximity').length; };
    expect(near(doc)).toBe(0);
    const wide = { ...doc, proximityLimit: proximityLimitSettingFrom('4h') };
    expect(near(wide)).toBe(1);
    expect(near({ ...doc, proximityLimit: proximityLimitSettingFrom('6.5 mm') })).toBe(1);
    expect(near(wide, { proximityLimit: proximityLimitFor(wide, '3h') })).toBe(0);
    expect(near({ ...wide, proximityLimit: proximityLimitSettingFrom('0') })).toBe(0);
    expect(proximityLimitFor(wide)).toBeCloseTo(4 * SUB.h, 15);
    expect(proximityLimitFor(wide, '1mm')).toBeCloseTo(1e-3, 15);
    // The text a face shows reads back to the same setting.
    for (const t of ['3h', '2.5h', '1.2 mm', '40 mil', '0']) expect(proximityLimitSettingFrom(proximityLimitText(proximityLimitSettingFrom(t), /mil/.test(t) ? 'mil' : 'mm'))).toEqual(proximityLimitSettingFrom(t));
  });
});

describe('the user\'s proximity limit (one parser for app and CLI)', () => {
  it('reads heights and lengths, refuses nonsense in the user\'s words', async () => {
    const { proximityLimitFrom, InputError } = await import('../../core/index.ts');
    expect(proximityLimitFrom('2.5h', 1.6e-3)).toBeCloseTo(4e-3, 12);
    expect(proximityLimitFrom('1mm', 1.6e-3)).toBeCloseTo(1e-3, 12);
    expect(proximityLimitFrom('0', 1.6e-3)).toBe(0);
    expect(() => proximityLimitFrom('-1h', 1.6e-3)).toThrow(InputError);
    expect(() => proximityLimitFrom('3 furlongs', 1.6e-3)).toThrow(InputError);
    expect(() => proximityLimitFrom('100h', 1.6e-3)).toThrow(/at most 50h/);
  });
  it('a gap of 0.8 mm is flagged with the default 3h (4.8 mm) and with 1h, not with 0.3h or 0', async () => {
    const { proximityLimitFrom } = await import('../../core/index.ts');
    const sized = sizeDesign(twoRuns(0.8e-3));
    const count = (text?: string) => checkFabrication(sized, buildBoardGeometry(sized), text === undefined ? {} : { proximityLimit: proximityLimitFrom(text, SUB.h) })
      .filter((x) => x.code === 'proximity').length;
    expect(count()).toBe(1);
    expect(count('1h')).toBe(1);
    expect(count('0.3h')).toBe(0);
    expect(count('0.5mm')).toBe(0);
    expect(count('0')).toBe(0);
  });
});

/**
 * What the branched blocks can make, on a representative subset of the matrix of test/blocks-matrix/matrix.ts (the
 * whole matrix: `npm run bench -- blocks-matrix`). Each case is made by `makeBlockDesign` on a board, frequency and
 * process a user would try and is either copper with a clean shop check that meets the blocks issue's figures
 * against the textbook values (Pozar, Microwave Engineering, 4th ed., 2012: §7.2 for the feeds' shares, §7.3 the
 * Wilkinson incl. unequal, §7.5 the branch-line, §7.8 the rat-race; with losses, the ideal less each path's line
 * loss, or for the hybrids the textbook ring with its arms' losses; see matrix.ts), or refused naming the nearest
 * spec, and then that nearest spec is made and meets them. The cases are the faults the matrix found (the corporate
 * feed's runs beside its resistors, the Wilkinson's outputs meeting at the axis, unequal arms that could not reach
 * the resistor) and one of each kind of refusal.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { InputError, initPolygons, makeBlockDesign } from '../../core/index.ts';
import { BOARDS, PROCESSES, runCase, type BlockSpec, type Board, type Process } from '../blocks-matrix/matrix.ts';

beforeAll(async () => { await initPolygons(); });

const board = (id: string): Board => BOARDS.find((b) => b.id === id)!;
const proc = (id: string): Process => PROCESSES.find((p) => p.id === id)!;
const spec = (kind: BlockSpec['kind'], raw: Record<string, string> = {}): BlockSpec => ({ kind, label: kind, raw });

function made(s: BlockSpec, b: Board, f0: number, p: Process): void {
  const r = runCase(s, b, f0, p);
  expect(r.verdict, r.detail).toBe('made');
}

/** The refusal's words (an InputError naming the field, a value to use, and how to fix it). */
function refusal(s: BlockSpec, b: Board, f0: number, p: Process): InputError {
  const r = runCase(s, b, f0, p);
  expect(r.verdict, r.detail).toBe('refused');
  try { makeBlockDesign(s.kind, s.raw, { f0, substrate: b.substrate, process: p.process }); } catch (e) { return e as InputError; }
  throw new Error('not refused');
}

describe('made: clean shop check, the textbook figures met', () => {
  for (const p of ['etch', 'end-mill', 'v-bit']) {
    it(`4-output Wilkinson feed, 0.8 mm FR-4, 2.45 GHz, ${p} (its runs kept the cut apart beside the resistors)`, () => {
      made(spec('corporate', { outputs: '4', split: 'wilkinson' }), board('fr4-0.8'), 2.45e9, proc(p));
    });
  }
  it('equal Wilkinson, 1.6 mm FR-4, 2.45 GHz, V-bit sized as made (its outputs no longer meet at the axis)', () => {
    made(spec('wilkinson', { ratioDb: '0' }), board('fr4-1.6'), 2.45e9, proc('v-bit'));
  });
  it('3 dB Wilkinson, 1.6 mm FR-4, 1 GHz, end mill (unequal arms end side by side across the resistor)', () => {
    made(spec('wilkinson', { ratioDb: '3' }), board('fr4-1.6'), 1e9, proc('end-mill'));
  });
  it('5-output tapered Wilkinson feed, 0.508 mm low-loss laminate, 2.45 GHz, etched', () => {
    made(spec('corporate', { outputs: '5', split: 'wilkinson', amplitudesDb: '-2.4,-0.6,0,-0.6,-2.4' }), board('ll-0.508'), 2.45e9, proc('etch'));
  });
  it('3 dB branch-line, 0.508 mm low-loss laminate, 5.8 GHz, etched; rat-race, 0.8 mm FR-4, 2.45 GHz, V-bit (lossy rings)', () => {
    made(spec('branchline', { ratioDb: '3' }), board('ll-0.508'), 5.8e9, proc('etch'));
    made(spec('ratrace'), board('fr4-0.8'), 2.45e9, proc('v-bit'));
  });
});

describe('refused, naming the nearest spec, which is then made', () => {
  it('a 6 dB Wilkinson on 0.8 mm FR-4 etched names the largest split it makes', () => {
    const e = refusal(spec('wilkinson', { ratioDb: '6' }), board('fr4-0.8'), 2.45e9, proc('etch'));
    expect(e.field).toBe('wilkinson.ratioDb');
    const best = /--ratio-db ([\d.]+)/.exec(e.hint ?? '')![1]!;
    expect(Number(best)).toBeGreaterThan(0);
    expect(Number(best)).toBeLessThan(6);
    made(spec('wilkinson', { ratioDb: best }), board('fr4-0.8'), 2.45e9, proc('etch'));
  });
  it('a 6 dB branch-line beside a 0.4 mm end mill on 0.8 mm FR-4 names the largest split it makes', () => {
    const e = refusal(spec('branchline', { ratioDb: '6' }), board('fr4-0.8'), 2.45e9, proc('end-mill'));
    const best = /--ratio-db ([\d.]+)/.exec(e.hint ?? '')![1]!;
    made(spec('branchline', { ratioDb: best }), board('fr4-0.8'), 2.45e9, proc('end-mill'));
  });
  it('a 3-output −6 dB edge taper of Wilkinson splits on 0.8 mm FR-4 etched names the same taper, shallower', () => {
    const e = refusal(spec('corporate', { outputs: '3', split: 'wilkinson', amplitudesDb: '-6,0,-6' }), board('fr4-0.8'), 2.45e9, proc('etch'));
    expect(e.field).toBe('corporate.amplitudesDb');
    const near = /--amplitudes-db ([-\d.,]*\d)/.exec(e.hint ?? '')![1]!;
    expect(near.split(',').map(Number)[0]).toBeGreaterThan(-6);
    made(spec('corporate', { outputs: '3', split: 'wilkinson', amplitudesDb: near }), board('fr4-0.8'), 2.45e9, proc('etch'));
  });
  it('a rat-race on 1.6 mm FR-4 at 5.8 GHz (its junctions too large for the ring) names the thinner sheet', () => {
    const e = refusal(spec('ratrace'), board('fr4-1.6'), 5.8e9, proc('etch'));
    expect(e.field).toBe('substrate.h');
    const h = Number(/on a ([\d.]+) mm sheet/.exec(e.expected)![1]) * 1e-3;
    expect(h).toBeLessThan(1.6e-3);
    made(spec('ratrace'), { ...board('fr4-1.6'), substrate: { ...board('fr4-1.6').substrate, h } }, 5.8e9, proc('etch'));
  });
  it('an 8-output feed at 1 GHz, its row longer than the largest board, names the widest pitch', () => {
    const e = refusal(spec('corporate', { outputs: '8' }), board('fr4-1.6'), 1e9, proc('v-bit'));
    expect(e.field).toBe('corporate.pitch');
    const pitch = /--pitch ([\d.]+)mm/.exec(e.hint ?? '')![1]!;
    made(spec('corporate', { outputs: '8', pitch: `${pitch}mm` }), board('fr4-1.6'), 1e9, proc('v-bit'));
  }, 120_000);
});

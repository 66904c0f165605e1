/**
 * Blocks rebuilt independently in scikit-rf (Debian python3-scikit-rf 0.15.4, scripts/reference/skrf_blocks.py):
 * each block is written by `stripwright block … --junctions ideal --t 0 --tand 0`, sized by `stripwright build
 * --json`, and every line piece (its width and network length from that report) is rebuilt as the library's own
 * microstrip line (Hammerstad–Jensen / Kirschning–Jansen, t = 0, lossless), joined at ideal junctions with the
 * library's resistors. Our lossless sweep of the same file must agree in |S|: within 0.15 dB where |S| is above
 * −15 dB (the two line models differ only in Z0's dispersion, which the library's 0.15.4 release gets wrong and
 * the oracle therefore leaves out; that moves small reflections most) and within 0.02 in linear magnitude elsewhere; both must also meet the block's
 * textbook split at f0 (Pozar, Microwave Engineering, 4th ed., §5.6, §7.3, §7.5) within 0.2 dB.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDesign, sizeDesign, netlistFromSized, solveNetwork } from '../../core/index.ts';
import { python } from './network-oracle.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'blocks-skrf-'));
function cli(args: string[]): string {
  const r = spawnSync(process.execPath, [join(ROOT, 'bin', 'stripwright.mjs'), ...args], { encoding: 'utf8', maxBuffer: 1 << 26 });
  if (r.status !== 0) throw new Error(`stripwright ${args.join(' ')}: ${r.stderr}`);
  return r.stdout;
}

const CASES: { kind: string; args: string[]; ideal: [string, string, number][]; h?: string }[] = [
  { kind: 'corporate', args: ['--outputs', '4'], ideal: [['b1.out1', 'b1.in', -6.02], ['b1.out4', 'b1.in', -6.02]] },
  { kind: 'wilkinson', args: ['--ratio-db', '3'], ideal: [['b1.o1', 'b1.in', 10 * Math.log10(1 / (1 + 10 ** -0.3))], ['b1.o2', 'b1.in', 10 * Math.log10(1 - 1 / (1 + 10 ** -0.3))]] },
  { kind: 'branchline', args: [], ideal: [['b1.p2', 'b1.p1', -3.01], ['b1.p3', 'b1.p1', -3.01]] },
  { kind: 'transformer', args: ['--z2', '20', '--sections', '3'], ideal: [['b1.load', 'b1.src', 10 * Math.log10(1)]] },
  // Folded to fit a footprint (core/blocks/fold-branched.ts): every fold's part is a line of the report, so the oracle
  // rebuilds the folded copper piece by piece.
  { kind: 'corporate', args: ['--outputs', '4', '--feed', '20mm', '--footprint', '200mm,80mm'], ideal: [['b1.out1', 'b1.in', -6.02], ['b1.out3', 'b1.in', -6.02]] },
  { kind: 'wilkinson', args: ['--feed', '15mm', '--footprint', '45mm,24mm'], h: '0.8mm', ideal: [['b1.o1', 'b1.in', -3.01], ['b1.o2', 'b1.in', -3.01]] },
];

describe('blocks rebuilt in scikit-rf from build --json agree in |S|', () => {
  for (const c of CASES) {
    it(`${c.kind} ${c.args.join(' ')}`, () => {
      const file = join(dir, `${c.kind}-${CASES.indexOf(c)}.json`);
      // Plain microstrip sizing: the oracle rebuilds every line as scikit-rf's microstrip (no side copper).
      cli(['block', c.kind, ...c.args, '--f0', '2.45GHz', '--er', '4.4', '--h', c.h ?? '1.6mm', '--t', '0', '--tand', '0', '--junctions', 'ideal', '--sizing', 'microstrip', '--out', file, '--force']);
      const report = JSON.parse(cli(['build', file, '--json'])) as { pieces: { id: string; kind: string; a: string; b: string; width_m?: number; length_m: number; compensations?: { model: string; node: string; amount_m: number; applied: boolean }[] }[] };
      const parsed = parseDesign(readFileSync(file, 'utf8'));
      if (!parsed.ok) throw new Error('refused');
      const doc = parsed.doc;
      // A footprint case did fold (the footprints above are smaller than the copper as laid out).
      if (c.args.includes('--footprint')) expect(doc.nodes.some((n) => n.id.includes('.fold'))).toBe(true);
      const freqs = [2.2e9, 2.45e9, 2.7e9];
      const ours = solveNetwork(netlistFromSized(sizeDesign(doc), { lossless: true }), freqs);
      const resistors = doc.segments.filter((x) => x.kind === 'lumped').map((x) => ({ id: x.id, a: x.a, b: x.b, value: x.kind === 'lumped' ? x.value : 0 }));
      // Resistor pads are copper on the path: the sized line stops at a pad's edge, and the pad itself is a short line
      // of the pad's width (the footprint's pad across the path: 0603 0.9 mm, 0805 1.4 mm, 1206 1.8 mm, the sizes
      // of core/layout/footprints.ts) from the node to the line, on both sides.
      const ACROSS: Record<string, number> = { '0603': 0.9e-3, '0805': 1.4e-3, '1206': 1.8e-3 };
      const padAt = new Map<string, number>();
      for (const x of doc.segments) if (x.kind === 'lumped') for (const n of [x.a, x.b]) padAt.set(n, Math.max(padAt.get(n) ?? 0, ACROSS[x.size]!));
      const pieces: { id: string; a: string; b: string; width_m: number; length_m: number }[] = [];
      for (const p of report.pieces.filter((x) => x.kind === 'line')) {
        const ends = [p.a, p.b];
        for (const [k, node] of [[0, p.a], [1, p.b]] as const) {
          const cut = (p.compensations ?? []).filter((c) => c.applied && c.node === node && c.model === 'lumped-pad' && c.amount_m > 0);
          cut.forEach((c, i) => {
            const inner = `${p.id}~pad${k}${i}`;
            pieces.push({ id: `${p.id}:pad${k}${i}`, a: ends[k]!, b: inner, width_m: Math.max(p.width_m!, padAt.get(node) ?? 0), length_m: c.amount_m });
            ends[k] = inner;
          });
        }
        pieces.push({ id: p.id, a: ends[0]!, b: ends[1]!, width_m: p.width_m!, length_m: p.length_m });
      }
      const spec = {
        freqs, er: doc.substrate.er, h: doc.substrate.h, pieces,
        resistors, ports: ours.ports.map((p) => ({ name: p.name, node: p.name, zRef: p.zRef })),
      };
      expect(report.pieces.every((p) => p.kind === 'line' || p.kind === 'lumped')).toBe(true);
      const lib = JSON.parse(python('skrf_blocks.py', JSON.stringify(spec))) as { s: [number, number][][][] };
      const P = ours.ports.length;
      const mag = (k: number, i: number, j: number) => { const t = 2 * ((k * P + i) * P + j); return Math.hypot(ours.s[t]!, ours.s[t + 1]!); };
      lib.s.forEach((m, k) => m.forEach((row, i) => row.forEach(([re, im], j) => {
        const a = mag(k, i, j), b = Math.hypot(re, im);
        if (Math.max(a, b) > 10 ** (-15 / 20)) expect(Math.abs(20 * Math.log10(a / b)), `${c.kind} S${i + 1}${j + 1} at ${freqs[k]}`).toBeLessThan(0.15);
        else expect(Math.abs(a - b), `${c.kind} S${i + 1}${j + 1} at ${freqs[k]}`).toBeLessThan(0.02);
      })));
      for (const [to, from, db] of c.ideal) {
        const i = ours.ports.findIndex((p) => p.name === to), j = ours.ports.findIndex((p) => p.name === from);
        const [re, im] = lib.s[1]![i]![j]!;
        expect(Math.abs(20 * Math.log10(mag(1, i, j)) - db), `ours ${to}`).toBeLessThan(0.2);
        expect(Math.abs(20 * Math.log10(Math.hypot(re, im)) - db), `scikit-rf ${to}`).toBeLessThan(0.2);
      }
    }, 120_000);
  }
});

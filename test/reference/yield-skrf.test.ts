/**
 * The Monte Carlo's made boards against an independent rebuild: the three-section transformer example (t = 0, no
 * roughness, tanδ = 0 and σ = 1e9 S/m so the lines are nearly lossless, the current-distribution conductor loss that
 * scikit-rf's MLine uses; milled with an end mill) with
 * board-wide εr, h and tool width and per-piece width errors; 24 boards' raw draws go to scripts/reference/skrf_yield.py, which applies them
 * itself and rebuilds each board with Debian's scikit-rf 0.15.4 (MLine static values and εe(f); Z0(f) from the
 * published Jansen–Kirschning 1983 equations, see the script), then |S| is compared at every point.
 *
 * Tolerance 1e-3 on |S|: the oracle's lines carry a real Z0 (Re Zc; scikit-rf's line media take a real one) where
 * ours carry the complex Zc (hence nearly lossless lines: with copper and tanδ 0.02 the low-impedance sections'
 * Im Zc alone moves |S| by several 1e-3 near the match); the nominal boards differ by 2.4e-4 as run here, the made
 * boards by 3e-4; per-piece width errors enter our lines to first order (a few 1e-5 of the constants). The draws
 * move |S| by several 1e-2 between boards, so a mishandled draw (a sign, a factor on the tool width, a width given to
 * the wrong piece) fails.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, sizeDesign, netlistFromSized, madeBoardResponses, type DesignDoc, type LineModel, type SizedPiece } from '../../core/index.ts';
import { python } from './network-oracle.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');

function transformer(): DesignDoc {
  const r = parseDesign(readFileSync(join(EX, 'three-section-transformer.json'), 'utf8'), { complete: true });
  if (!r.ok) throw new Error('refused');
  return {
    ...r.doc,
    // The oracle rebuilds lines only: its width steps are plain joins, so ours are sized and swept ideal here too
    // (the step models have their own scikit-rf check, test/reference/network-junctions-skrf.test.ts).
    junctions: 'ideal',
    substrate: { ...r.doc.substrate, t: 0, roughness: 0, tanDelta: 0, sigma: 1e9 },
    tolerances: [
      { quantity: 'er', distribution: 'normal', spread: 0.15, scope: 'board' },
      { quantity: 'h', distribution: 'normal', spread: 40e-6, scope: 'board' },
      { quantity: 'tool-width', distribution: 'uniform', spread: 30e-6, scope: 'board' },
      { quantity: 'width', distribution: 'normal', spread: 15e-6, scope: 'piece' },
    ],
  };
}

describe('made boards against scikit-rf (Debian python3-scikit-rf 0.15.4)', () => {
  it('24 boards of the three-section transformer agree in |S| at every point within 1e-3', () => {
    const doc = transformer();
    const line = { conductorLoss: 'current-distribution' as const };
    const run = madeBoardResponses(doc, { samples: 24, seed: 2024, points: 21, line });
    // The nominal netlist, with each line's nominal width and piece, for the oracle to apply the draws to.
    const sized = sizeDesign(doc, { line });
    const pieceIndex = new Map(sized.pieces.map((p, i) => [p.id, i]));
    const tags = new Map<LineModel, { width: number; piece: number }>();
    const net = netlistFromSized(sized, { line, lineModel: (width: number, piece: SizedPiece) => { const m: LineModel = () => { throw new Error('not solved here'); }; tags.set(m, { width, piece: pieceIndex.get(piece.id)! }); return m; } });
    const lines = net.elements.flatMap((e) => (e.kind === 'line' ? [{ id: e.id, a: e.a, b: e.b, length: e.length, ...tags.get(e.model)! }] : []));
    const resistors = net.elements.flatMap((e) => (e.kind === 'resistor' ? [{ id: e.id, a: e.a, b: e.b, value: e.value, piece: pieceIndex.get(e.id)! }] : []));
    expect(lines.length).toBeGreaterThan(3);
    expect(new Set(lines.map((l) => l.width)).size).toBeGreaterThan(3);
    const spec = {
      freqs: [...run.freqs], ports: net.ports, substrate: doc.substrate, process: doc.process,
      lines, resistors, tolerances: run.tolerances.map((t) => ({ quantity: t.quantity, scope: t.scope })),
      boards: run.boards.map((b) => ({ draws: b.draws })),
    };
    const oracle = JSON.parse(python('skrf_yield.py', JSON.stringify(spec))) as { s: [number, number][][][][] };
    const P = run.ports.length, F = run.freqs.length;
    let worst = 0, spread = 0;
    run.boards.forEach((b, n) => {
      for (let k = 0; k < F; k++) for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
        const t = 2 * ((k * P + i) * P + j);
        const ours = Math.hypot(b.s[t]!, b.s[t + 1]!);
        const [re, im] = oracle.s[n]![k]![i]![j]!;
        worst = Math.max(worst, Math.abs(ours - Math.hypot(re, im)));
        const first = Math.hypot(run.boards[0]!.s[t]!, run.boards[0]!.s[t + 1]!);
        spread = Math.max(spread, Math.abs(ours - first));
      }
    });
    expect(worst).toBeLessThan(1e-3);
    // The draws matter far more than the disagreement (so the check can fail).
    expect(spread).toBeGreaterThan(10 * worst);
  }, 180_000);
});

/**
 * The meander's own coupling in its electrical length. Neighbouring legs of a serpentine run side by side in
 * opposite directions at an edge gap s, so each neighbouring pair is a coupled pair folded into a U (joined at one end
 * by the short stretch between them). Its transmission phase is computed from the coupled-pair four-port
 * (coupledPair.ts: even and odd modes, the Reed–Wheeler decomposition) with the modes of the Kirschning–Jansen 1984
 * static model and Getsinger 1973 dispersion (core/line coupled.ts), and compared with the same U built from two
 * far-apart pair of the same model (edge gap 100h, where its two modes coincide to 0.05 %): the difference is the
 * coupling's share of the meander's phase. The share is taken from the static modes (dispersion 'none'), because the
 * published per-mode dispersion does not converge to the single line's at wide gaps and would show a difference that
 * is not coupling; the single-line model (sizing and the ledger) carries the dispersion of the whole meander.
 *
 * A serpentine of k bumps has 2k − 1 neighbouring leg pairs (k joined at the top, k − 1 along the run); their shares
 * are added. That is first order in the coupling (each pair's share is small, and legs two apart, at 2p + s, are
 * left out): valid while the pair's coupling factor is well below 1 — at the default gap of 3h it is near −30 dB. A
 * dogleg's ramps diverge and are not coupled. The coupled run of a leg is its straight copper: the leg's centreline
 * less a strip width taken by the two corners.
 */
import type { SubstrateSpec } from '../../substrate/types.ts';
import { analyzeCoupled } from '../../line/index.ts';
import { coupledPairY, modeConstants } from '../coupledPair.ts';
import { solveNetwork } from '../sweep.ts';
import type { Netlist } from '../netlist.ts';
import type { MeanderShape } from './meander.ts';

/** Phase of S21 through a U of two coupled legs of `leg` m at edge gap `gap`, joined by `join` m at the far end, radians. */
export function foldedPairPhase(sub: SubstrateSpec, width: number, gap: number, leg: number, join: number, f: number): number {
  const c = analyzeCoupled(sub, width, gap, f, { dispersion: 'none' });
  const even = modeConstants(c.even.z0, c.even.epsEff, c.even.alphaC, c.even.alphaD, f);
  const odd = modeConstants(c.odd.z0, c.odd.epsEff, c.odd.alphaC, c.odd.alphaD, f);
  // The joining stretch and the reference impedance: the mean of the modes (a single strip of the same model).
  const z = Math.sqrt(c.even.z0 * c.odd.z0);
  const s = modeConstants(z, ((Math.sqrt(c.even.epsEff) + Math.sqrt(c.odd.epsEff)) / 2) ** 2, (c.even.alphaC + c.odd.alphaC) / 2, (c.even.alphaD + c.odd.alphaD) / 2, f);
  const y = coupledPairY(even, odd, leg);
  const elements: Netlist['elements'] = [
    { kind: 'line', id: 'join', a: 'top1', b: 'top2', length: join, model: () => s },
    { kind: 'nport', id: 'legs', nodes: ['p1', 'top1', 'p2', 'top2'], y: () => y },
  ];
  const r = solveNetwork({ elements, ports: [{ name: 'p1', node: 'p1', zRef: z }, { name: 'p2', node: 'p2', zRef: z }] }, [f]);
  // S21 of a two-port: index 2·((0·2 + 1)·2 + 0) = 4.
  return Math.atan2(r.s[5]!, r.s[4]!);
}

/** Edge gap, in substrate heights, of the far-apart reference pair (the coupled model's upper limit). */
const FAR_GAPS = 100;

const wrapPi = (x: number) => x - 2 * Math.PI * Math.round(x / (2 * Math.PI));

/** Extra phase delay the coupling of the meander's legs adds at f, degrees (positive = electrically longer). */
export function meanderCouplingDeg(sub: SubstrateSpec, width: number, shape: MeanderShape, f: number): number {
  if (shape.kind !== 'serpentine') return 0;
  const gap = shape.pitch - width;
  const leg = Math.max(0, shape.height - width);
  if (!(leg > 0) || !(gap > 0)) return 0;
  const plain = foldedPairPhase(sub, width, FAR_GAPS * sub.h, leg, shape.pitch, f);
  const withCoupling = foldedPairPhase(sub, width, gap, leg, shape.pitch, f);
  // Phase of S21 falls with delay: the extra delay is plain − coupled.
  const share = (wrapPi(plain - withCoupling) * 180) / Math.PI;
  return (2 * shape.bumps - 1) * share;
}

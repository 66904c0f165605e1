/**
 * Block: coupled-line directional coupler, one quarter-wave coupled section at f0 (backward coupler).
 *
 * Design equations: D. M. Pozar, Microwave Engineering, 4th ed., Wiley, 2012, §7.6: C = 10^(−C_dB/20),
 * Z0e = Z0·√((1 + C)/(1 − C)), Z0o = Z0·√((1 − C)/(1 + C)), section 90° long at f0 (here on the mean of the two
 * modes' phase constants, since microstrip's modes travel at different speeds). The geometry comes from the coupled
 * model (core/line, Kirschning–Jansen 1984). Ports: `in` and `through` on the first strip, `coupled` beside `in`,
 * `isolated` beside `through`; each port line leaves its strip end with a 90° optimal-miter bend, away from the other
 * strip. A gap narrower than the process can cut is refused with the tightest coupling it can make.
 */
import type { DesignDoc, DesignNode, DesignSegment } from '../design/types.ts';
import { newDesign } from '../design/defaults.ts';
import { lineModels, modesForCoupling } from '../line/index.ts';
import { InputError, describe } from '../util/errors.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { netlistFromSized } from '../network/fromSized.ts';
import { solveNetwork } from '../network/sweep.ts';
import { magnitudeDb } from '../network/figures.ts';
import { portIndex } from '../network/response.ts';
import { drawAsPlaced, requireCuttableGap, type BlockBase } from './common.ts';

export interface CouplerOptions extends BlockBase {
  /** Coupling at f0, dB (a positive number, e.g. 10 or 20). */
  couplingDb: number;
}

export function couplerBlock(opts: CouplerOptions): DesignDoc {
  const cdb = opts.couplingDb;
  if (typeof cdb !== 'number' || !(cdb >= 3 && cdb <= 60)) throw new InputError(typeof cdb === 'number' && Number.isFinite(cdb) ? 'out-of-range' : 'invalid-number', 'couplingDb', 'a coupling from 3 dB to 60 dB', describe(cdb));
  const z0 = opts.z0 ?? 50;
  const doc = newDesign({
    name: opts.name ?? `${Number(cdb.toPrecision(4))} dB coupled-line coupler, ${(opts.f0 / 1e9).toPrecision(4)} GHz`,
    f0: opts.f0, band: { start: opts.f0 * 0.8, stop: opts.f0 * 1.2 },
    ...(opts.substrate ? { substrate: opts.substrate } : {}), ...(opts.process ? { process: opts.process } : {}),
  });
  const sub = doc.substrate;
  const modes = modesForCoupling(cdb, z0);
  const r = lineModels.pair().geometryFor(sub, modes, opts.f0);
  requireCuttableGap(r.gap, sub, doc.process, z0, cdb, 'couplingDb', `a ${cdb} dB coupler`, 'ask for a looser coupling, use a finer tool, or a thinner substrate');
  const feed = opts.feedLength ?? Math.max(2e-3, 3 * sub.h);
  const L = 10e-3, pitch = r.width + r.gap; // drawn only for directions; sizing places the block
  const bend = { style: 'miter-optimal' } as const;
  const nodes: DesignNode[] = [
    { id: 'in', kind: 'port', zRef: z0, heading: -Math.PI / 2, label: 'input', at: { x: 0, y: feed } },
    { id: 'through', kind: 'port', zRef: z0, heading: -Math.PI / 2, label: 'through', at: { x: L, y: feed } },
    { id: 'coupled', kind: 'port', zRef: z0, heading: Math.PI / 2, label: 'coupled', at: { x: 0, y: -pitch - feed } },
    { id: 'isolated', kind: 'port', zRef: z0, heading: Math.PI / 2, label: 'isolated', at: { x: L, y: -pitch - feed } },
    { id: 'a', kind: 'vertex', bend, at: { x: 0, y: 0 } },
    { id: 'b', kind: 'vertex', bend, at: { x: L, y: 0 } },
    { id: 'c', kind: 'vertex', bend, at: { x: 0, y: -pitch } },
    { id: 'd', kind: 'vertex', bend, at: { x: L, y: -pitch } },
  ];
  const port = (id: string, from: string, to: string): DesignSegment => ({ id, kind: 'line', a: from, b: to, width: { by: 'z0', z0 }, length: { by: 'length', length: feed } });
  const segments: DesignSegment[] = [
    port('feed-in', 'in', 'a'),
    { id: 'pair', kind: 'coupled', a: 'a', b: 'b', c: 'c', d: 'd', label: 'coupled section', pair: { by: 'geometry', width: r.width, gap: r.gap }, length: { by: 'degrees', deg: 90 } },
    port('feed-through', 'b', 'through'),
    port('feed-coupled', 'c', 'coupled'),
    port('feed-isolated', 'd', 'isolated'),
  ];
  doc.nodes = nodes;
  doc.segments = segments;
  doc.notes = [
    `Coupled-line coupler made by the coupler block: ${cdb} dB at ${(opts.f0 / 1e9).toPrecision(5)} GHz in ${z0} Ω.`,
    `Mode impedances Z0e ${modes.z0Even.toFixed(2)} Ω, Z0o ${modes.z0Odd.toFixed(2)} Ω (Pozar, Microwave Engineering, 4th ed., §7.6); strips ${(r.width * 1e3).toFixed(3)} mm wide, gap ${(r.gap * 1e3).toFixed(3)} mm (Kirschning–Jansen 1984 static model), 90° at f0 on the modes' mean phase constant.`,
    'Microstrip\'s even and odd modes travel at different speeds, so the isolation (directivity) is finite; the response shows it.',
  ].join('\n');
  drawAsPlaced(doc);
  const fig = couplerFiguresAtF0(doc);
  if (fig) doc.notes += `\nSwept at f0 with losses (the core's own sizing and solver): coupling ${fig.couplingDb.toFixed(2)} dB, isolation ${fig.isolationDb.toFixed(2)} dB, directivity ${fig.directivityDb.toFixed(2)} dB. Not compensated: the unequal mode speeds set the directivity (no end capacitors or wiggled edges are added).`;
  return doc;
}

/** Coupling, isolation and directivity (dB, positive) of a coupler design at its f0, with losses, from the core's own sweep. */
export function couplerFiguresAtF0(doc: DesignDoc): { couplingDb: number; isolationDb: number; directivityDb: number } | undefined {
  const sized = sizeDesign(doc);
  if (sized.problems.length) return undefined;
  const r = solveNetwork(netlistFromSized(sized), [doc.frequency.f0]);
  const p = (name: string) => portIndex(r, name);
  const couplingDb = -magnitudeDb(r, p('coupled'), p('in'))[0]!;
  const isolationDb = -magnitudeDb(r, p('isolated'), p('in'))[0]!;
  return { couplingDb, isolationDb, directivityDb: isolationDb - couplingDb };
}

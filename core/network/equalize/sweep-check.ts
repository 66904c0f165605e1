/**
 * Equalize's check in the sweep's own phase: the ledger counts lengths, the nodal solve also sees what the lines a
 * meander sits on reflect at their ends. `sweepSpreadDeg` solves an equal-phase group at band start, f0 and stop;
 * `matchedLeads` finds the port leads matched to their ports, where a meander adds only its length (a line ended in
 * its own impedance shows that impedance at any length: D. M. Pozar, Microwave Engineering, 4th ed., 2012, eq. 2.44).
 */
import type { DesignDoc, PhaseGroup } from '../../design/types.ts';
import { sizeDesign, type PathReport, type SizedDesign } from '../../layout/index.ts';
import { netlistFromSized } from '../fromSized.ts';
import { solveNetwork } from '../sweep.ts';

/** A line within this fraction of the port's reference impedance counts as matched to it. */
const MATCH_TOL = 0.03;

/**
 * The port leads of a group's paths that are matched lines: from the port back toward the start, line pieces whose
 * Z0 at f0 is within MATCH_TOL of the port's reference impedance, joined by plain vertices (no tee between). Seen
 * from the start, such a line ends in its own impedance, so a meander on it adds only its length at every frequency.
 */
export function matchedLeads(s: SizedDesign, report: PathReport): Set<string> {
  const out = new Set<string>();
  const nodeById = new Map(s.nodes.map((n) => [n.id, n]));
  const pieceById = new Map(s.pieces.map((p) => [p.id, p]));
  for (const path of report.paths) {
    const zRef = nodeById.get(path.to)?.port?.zRef;
    if (!zRef) continue;
    for (let i = path.pieces.length - 1; i >= 0; i--) {
      const piece = pieceById.get(path.pieces[i]!);
      if (!piece || piece.kind !== 'line' || !(Math.abs(piece.z0 - zRef) <= MATCH_TOL * zRef)) break;
      out.add(piece.id);
      if (nodeById.get(path.nodes[i] ?? '')?.kind !== 'vertex') break;
    }
  }
  return out;
}

/**
 * The sweep's S21 phase spread of an equal-phase group at the band's start, f0 and stop, degrees: ∠S(out, in) of
 * every output less the first one's, largest minus smallest (the nodal solve of the sized design, junction models in).
 */
export function sweepSpreadDeg(doc: DesignDoc, g: PhaseGroup): [number, number, number] {
  const s = sizeDesign(doc);
  const b = doc.frequency.band;
  const r = solveNetwork(netlistFromSized(s, { line: s.lineOptions }), [b.start, doc.frequency.f0, b.stop]);
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === g.from);
  const cols = g.to.map((t) => r.ports.findIndex((p) => p.name === t));
  const at = (k: number): number => {
    if (i < 0 || cols.some((j) => j < 0)) return 0;
    const ph = cols.map((j) => { const x = 2 * ((k * P + j) * P + i); return (Math.atan2(r.s[x + 1]!, r.s[x]!) * 180) / Math.PI; });
    const rel = ph.map((p) => ((p - ph[0]! + 540) % 360) - 180);
    return Math.max(...rel) - Math.min(...rel);
  };
  return [at(0), at(1), at(2)];
}

/**
 * Which S entries a view of a design's response reads, so a live sweep solves only those (mna.ts SolveEntries):
 *  - a network of up to four ports: every entry (the response panel offers every pair);
 *  - else the input's column (S_i,in: insertion loss, phase and delay to each output) and row (S_in,j), every
 *    reflection S_ii (return loss, the Smith chart), and the columns the design's targets read: a target on
 *    S_to,from reads the column of `from`, isolation S_ab the column of b, a balance the column of its group's input.
 * The figure table (isolation between every two outputs) and Touchstone files read the whole matrix: their sweeps
 * ask for every entry. A target naming a port the network does not have asks for every entry too, so that
 * evaluateTargets reports it in its own words.
 */
import type { DesignDoc } from '../design/types.ts';
import type { SolveEntries } from './mna.ts';

/** Undefined: every entry. */
export function viewEntries(net: { ports: readonly { name: string }[]; input: number }, doc: Pick<DesignDoc, 'targets' | 'phaseGroups'>): SolveEntries | undefined {
  const P = net.ports.length;
  if (P <= 4) return undefined;
  const index = (id: string | undefined) => net.ports.findIndex((p) => p.name === id);
  const columns = [net.input];
  for (const t of doc.targets ?? []) {
    const ports = t.ports ?? [];
    let from = -1;
    switch (t.figure) {
      case 'return-loss': from = index(ports[0]) >= 0 ? net.input : -1; break;
      case 'isolation': from = index(ports[0]) >= 0 ? index(ports[1]) : -1; break;
      case 'amplitude-balance': case 'phase-balance': case 'phase-spread': {
        const g = doc.phaseGroups.find((x) => x.id === t.group);
        from = g && g.to.every((id) => index(id) >= 0) ? index(g.from) : -1;
        break;
      }
      default: from = index(ports[1]) >= 0 ? index(ports[0]) : -1;
    }
    if (from < 0) return undefined;
    columns.push(from);
  }
  return { columns, rows: [net.input], diagonal: true };
}

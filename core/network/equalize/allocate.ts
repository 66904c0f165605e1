/**
 * Which pieces to lengthen, and by how much, so every path of a group reaches its aim: the paths from the group's
 * start form a tree (shared first pieces); walking it from the start, each branch (a chain of pieces between two
 * forks) takes the least deficit of the paths through it, so a fork's whole subtree is lengthened once, on the
 * branch nearest the start, and the paths that need most end up with meanders on their own branches (on a tree:
 * the sibling branches). A branch with no piece that may carry a meander passes its share on to its children.
 */
export interface TreePath { to: string; pieces: string[]; deficitDeg: number }

export interface Branch {
  /** Pieces of the chain, from the start outward. */
  pieces: string[];
  /** Paths (their `to`) through it. */
  paths: string[];
}

/** The branches of the tree of paths, from the start outward (parents before children). */
export function branchesOf(paths: readonly TreePath[]): Branch[] {
  const out: Branch[] = [];
  const walk = (members: TreePath[], depth: number): void => {
    // Split by the piece at `depth`; paths that end here stop.
    const groups = new Map<string, TreePath[]>();
    for (const p of members) {
      const id = p.pieces[depth];
      if (id === undefined) continue;
      const g = groups.get(id);
      if (g) g.push(p); else groups.set(id, [p]);
    }
    for (const [, g] of groups) {
      const pieces: string[] = [];
      let d = depth;
      // Extend the chain while all of g share the next piece and none ends.
      for (;;) {
        const id = g[0]!.pieces[d];
        if (id === undefined || !g.every((p) => p.pieces[d] === id)) break;
        pieces.push(id); d++;
        if (g.some((p) => p.pieces.length === d)) break;
      }
      out.push({ pieces, paths: g.map((p) => p.to) });
      walk(g, d);
    }
  };
  walk([...paths], 0);
  return out;
}

export interface Allocation {
  /** Degrees at f0 to add on each branch (its pieces; the caller chooses which one carries it). */
  shares: { branch: Branch; deg: number }[];
  /** What is left for each path when no branch could take it, degrees. */
  unmet: Map<string, number>;
}

/**
 * Shares of each branch. `usable(branch)` says whether a branch can carry a meander at all; `smallDeg` is the least
 * share worth a meander (smaller remainders are left, to be reported against the tolerance).
 */
export function allocate(paths: readonly TreePath[], usable: (b: Branch) => boolean, smallDeg: number): Allocation {
  const left = new Map(paths.map((p) => [p.to, Math.max(0, p.deficitDeg)]));
  const shares: Allocation['shares'] = [];
  for (const b of branchesOf(paths)) {
    if (!usable(b)) continue;
    const m = Math.min(...b.paths.map((t) => left.get(t) ?? 0));
    if (!(m > smallDeg)) continue;
    shares.push({ branch: b, deg: m });
    for (const t of b.paths) left.set(t, (left.get(t) ?? 0) - m);
  }
  const unmet = new Map<string, number>();
  for (const [t, d] of left) if (d > smallDeg) unmet.set(t, d);
  return { shares, unmet };
}

/**
 * Checks across records that a schema cannot express: unique ids, segment ends that name existing nodes, node kinds
 * that agree with how many segments meet there, phase groups that name ports, a band around f0, and outlines that
 * enclose an area without crossing themselves (OWASP Input Validation Cheat Sheet: semantic after syntactic checks).
 *
 * Degree rule (segments meeting at a node): port 1, vertex 2, junction 3 or 4, open 1, short 1. More than that is
 * a contradiction and an error. Fewer is an unfinished network (a port just placed, a tee with one branch drawn):
 * it must still load and save so no work is lost, so it is reported as an 'incomplete' warning, and as an error
 * only when `complete: true` is asked for (what sizing and export ask for).
 */
import type { Vec2 } from '../geometry/types.ts';
import { ringArea } from '../geometry/polygons.ts';
import { findSelfCrossing } from '../geometry/crossing.ts';
import type { Warning } from '../util/warnings.ts';
import type { DesignDoc, DesignNode } from './types.ts';
import { issue, type DesignIssue } from './issues.ts';
import { crossCheckTargets } from './crossref-targets.ts';

export const DEGREE: Record<DesignNode['kind'], { min: number; max: number; words: string }> = {
  port: { min: 1, max: 1, words: 'one segment at a port' },
  vertex: { min: 2, max: 2, words: 'two segments at a vertex' },
  junction: { min: 3, max: 4, words: 'three or four segments at a junction' },
  open: { min: 1, max: 1, words: 'one segment at an open end' },
  short: { min: 1, max: 1, words: 'one segment at a shorted end' },
};

export interface CrossCheck { errors: DesignIssue[]; warnings: Warning[] }

export function crossCheck(doc: DesignDoc, opts: { complete?: boolean } = {}): CrossCheck {
  const errors: DesignIssue[] = [];
  const warnings: Warning[] = [];
  const seen = new Map<string, string>();
  const claim = (id: string, path: string) => {
    const prev = seen.get(id);
    if (prev !== undefined) errors.push(issue('invalid-design', `${path}.id`, `an id not used elsewhere in the design (already used by ${prev})`, JSON.stringify(id), { fix: 'rename one of the two' }));
    else seen.set(id, path);
  };
  doc.nodes.forEach((n, i) => claim(n.id, `nodes[${i}]`));
  doc.segments.forEach((s, i) => claim(s.id, `segments[${i}]`));
  doc.areas.forEach((a, i) => claim(a.id, `areas[${i}]`));
  doc.phaseGroups.forEach((g, i) => claim(g.id, `phaseGroups[${i}]`));

  const nodeIndex = new Map<string, number>();
  doc.nodes.forEach((n, i) => { if (!nodeIndex.has(n.id)) nodeIndex.set(n.id, i); });
  const degree = new Map<string, number>();
  doc.segments.forEach((s, i) => {
    for (const end of (s.kind === 'coupled' ? ['a', 'b', 'c', 'd'] : ['a', 'b']) as ('a' | 'b' | 'c' | 'd')[]) {
      const id = (s as Record<string, unknown>)[end] as string;
      if (!nodeIndex.has(id)) errors.push(issue('invalid-design', `segments[${i}].${end}`, 'the id of a node in this design', `${JSON.stringify(id)}, which no node has`, { fix: 'name an existing node, or add the node' }));
      else degree.set(id, (degree.get(id) ?? 0) + 1);
    }
    if (s.a === s.b) errors.push(issue('invalid-design', `segments[${i}].b`, 'a node other than its start a (a segment joins two nodes)', JSON.stringify(s.b), { fix: 'join two different nodes' }));
    if (s.kind === 'coupled' && new Set([s.a, s.b, s.c, s.d]).size !== 4) {
      errors.push(issue('invalid-design', `segments[${i}].c`, 'four different nodes a, b, c, d (a coupled pair has four terminals)', [s.a, s.b, s.c, s.d].map((x) => JSON.stringify(x)).join(', '), { fix: 'join the pair to four different nodes' }));
    }
    const na = doc.nodes[nodeIndex.get(s.a) ?? -1], nb = doc.nodes[nodeIndex.get(s.b) ?? -1];
    if (na && nb && s.a !== s.b && na.at.x === nb.at.x && na.at.y === nb.at.y) {
      errors.push(issue('invalid-design', `segments[${i}]`, 'ends at two different places (the drawing gives each piece its direction)', `both ends at (${na.at.x}, ${na.at.y}) m`, { fix: 'move one of its nodes' }));
    }
  });

  doc.nodes.forEach((n, i) => {
    const d = degree.get(n.id) ?? 0;
    const rule = DEGREE[n.kind];
    if (d > rule.max) {
      errors.push(issue('invalid-design', `nodes[${i}]`, rule.words, `${d} segments meeting at ${n.kind} ${JSON.stringify(n.id)}`, { fix: 'remove segments there or change the node kind' }));
    } else if (d < rule.min) {
      const msg = `${JSON.stringify(n.id)} has ${d} segment${d === 1 ? '' : 's'}, needs ${rule.words}: the network is unfinished there`;
      if (opts.complete) errors.push(issue('invalid-design', `nodes[${i}]`, rule.words, `${d} segments meeting at ${n.kind} ${JSON.stringify(n.id)} (the network is unfinished there)`, { fix: 'connect the missing segments, or delete the node' }));
      else warnings.push({ code: 'note', severity: 'warning', message: `nodes[${i}]: ${msg}. It is kept as drawn; sizing waits until it is connected.`, subjects: [n.id], source: 'design-topology' });
    }
    if (n.kind === 'short' && n.via.pad <= n.via.drill) {
      errors.push(issue('invalid-design', `nodes[${i}].via.pad`, `a pad diameter larger than the drill (${n.via.drill} m)`, String(n.via.pad), { fix: 'make the pad larger than the drill' }));
    }
  });

  doc.phaseGroups.forEach((g, i) => {
    const isPort = (id: string) => { const k = nodeIndex.get(id); return k !== undefined && doc.nodes[k]!.kind === 'port'; };
    if (!isPort(g.from)) errors.push(issue('invalid-design', `phaseGroups[${i}].from`, 'the id of a port node', JSON.stringify(g.from), { fix: 'name a port of this design' }));
    const dup = new Set<string>();
    g.to.forEach((id, k) => {
      if (!isPort(id)) errors.push(issue('invalid-design', `phaseGroups[${i}].to[${k}]`, 'the id of a port node', JSON.stringify(id), { fix: 'name a port of this design' }));
      else if (id === g.from) errors.push(issue('invalid-design', `phaseGroups[${i}].to[${k}]`, 'a port other than the group\'s start', JSON.stringify(id), { fix: 'remove it from "to"' }));
      else if (dup.has(id)) errors.push(issue('invalid-design', `phaseGroups[${i}].to[${k}]`, 'each port once', `${JSON.stringify(id)} again`, { fix: 'remove the repeat' }));
      dup.add(id);
    });
    if (g.offsetsDeg && g.offsetsDeg.length !== g.to.length) {
      errors.push(issue('invalid-design', `phaseGroups[${i}].offsetsDeg`, `one offset per port in "to" (${g.to.length})`, `${g.offsetsDeg.length}`, { fix: 'give one offset per port' }));
    }
  });

  const { f0, band } = doc.frequency;
  if (!(band.start < band.stop)) {
    errors.push(issue('invalid-design', 'frequency.band.stop', `a band stop above its start (${band.start} Hz)`, String(band.stop), { fix: 'raise the stop or lower the start' }));
  } else if (f0 < band.start || f0 > band.stop) {
    warnings.push({ code: 'note', severity: 'warning', message: `frequency.f0 (${f0} Hz) lies outside the band ${band.start}–${band.stop} Hz; lengths are set at f0, the band only sets the sweep.`, source: 'design-frequency' });
  }

  crossCheckTargets(doc, errors);
  if (doc.board) checkRing(doc.board.outline, 'board.outline', errors);
  doc.areas.forEach((a, i) => checkRing(a.polygon, `areas[${i}].polygon`, errors));
  return { errors, warnings };
}

function checkRing(ring: readonly Vec2[], path: string, errors: DesignIssue[]): void {
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i]!, q = ring[(i + 1) % ring.length]!;
    if (p.x === q.x && p.y === q.y) {
      const closing = i === ring.length - 1;
      errors.push(issue('invalid-design', `${path}[${(i + 1) % ring.length}]`, closing
        ? 'an outline that does not repeat its first point at the end (it closes by itself)'
        : 'a point different from the one before it', `the same point (${q.x}, ${q.y}) twice`, { fix: 'remove the repeated point' }));
      return;
    }
  }
  if (crossesItself(ring, path, errors)) return;
  if (Math.abs(ringArea(ring as Vec2[])) < 1e-12) {
    errors.push(issue('invalid-design', path, 'a closed outline enclosing an area (points not all on one line)', `an outline of ${ring.length} points enclosing no area`, { fix: 'give at least three points that are not on one line' }));
  }
}

/** Any two non-neighbouring edges crossing or touching, found by a sweep line at any size (core/geometry/crossing.ts). */
function crossesItself(ring: readonly Vec2[], path: string, errors: DesignIssue[]): boolean {
  const hit = findSelfCrossing(ring);
  if (!hit) return false;
  const n = ring.length;
  errors.push(issue('invalid-design', path, 'an outline that does not cross itself', `edges ${hit.i}–${(hit.i + 1) % n} and ${hit.j}–${(hit.j + 1) % n} crossing`, { fix: 'move or reorder the points so no two edges cross or touch' }));
  return true;
}

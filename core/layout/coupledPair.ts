/**
 * Sizing of a coupled pair (design segment kind 'coupled', four terminals a, b, c, d). Inside the layout a pair is
 * two strips: the first keeps the segment's id and runs a → b, the second is `<id>:2` and runs c → d. Each strip
 * is then placed, drawn and corrected at its ends (bends, open ends, launch pads) like a line of its width; the
 * pair's data for the network (gap, mode figures) ride on both pieces as `pair`.
 *
 * Geometry from `pair`: given (width, gap), or chosen for the even- and odd-mode impedances at f0 — both through the
 * coupled-pair family of the line-model interface (`LineModels.pair()`, core/line/line-model.ts; the core's is the
 * Kirschning–Jansen 1984 static model, core/line kirschning-jansen-1984-coupled.ts, inverted in coupled-synthesis.ts). Length by degrees at f0 on the mean of the
 * two modes' phase constants (βe + βo)/2 — the coupled section's usual design length, common practice — or as given.
 */
import type { DesignSegment, CoupledSpec, DesignNode } from '../design/types.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import { lineModels as coreLineModels, pairAt, type LineModels } from '../line/index.ts';
import { InputError, describe } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';

/** Suffix of the second strip's piece id. */
export const SECOND_STRIP = ':2';

/** What the network and the faces need of a pair, on both of its strips. */
export interface PairData {
  /** The design segment's id (the first strip's piece id) and the other strip's piece id. */
  segment: string;
  partner: string;
  /** 1 = the strip a → b, 2 = the strip c → d. */
  strip: 1 | 2;
  width: number;
  gap: number;
  /** Mode figures at f0. */
  z0Even: number;
  z0Odd: number;
  epsEffEven: number;
  epsEffOdd: number;
  betaEven: number;
  betaOdd: number;
  couplingDb: number;
  /** Copper this strip loses at its first end (a or c) and its far end (b or d) to applied end corrections (open
   * ends, vias), m. Each strip keeps its own: the strips then overlap over nominal − max(near) − max(far), and the
   * strip cut less at an end carries the difference as a plain line (the usual staggered ends of a coupled filter). */
  cuts?: { near: number; far: number };
}

export type CoupledSegment = DesignSegment & CoupledSpec;

/** The design's segments with each pair split into its two strips (first strip keeps the id). */
export function splitPairs(segments: DesignSegment[]): { segments: DesignSegment[]; index: number[] } {
  const out: DesignSegment[] = [];
  const index: number[] = [];
  segments.forEach((s, i) => {
    out.push(s); index.push(i);
    if (s.kind === 'coupled') { out.push({ ...s, id: s.id + SECOND_STRIP, a: s.c, b: s.d }); index.push(i); }
  });
  return { segments: out, index };
}

/**
 * Resolves a pair's geometry and mode figures at f0 through `models`' coupled-pair family (InputError for an
 * impossible request).
 */
export function sizePair(sub: SubstrateSpec, seg: CoupledSegment, f0: number, field: string, models: LineModels = coreLineModels): { data: Omit<PairData, 'strip' | 'partner' | 'segment'>; warnings: Warning[] } {
  const p = seg.pair;
  if (!p || typeof p !== 'object') throw new InputError('invalid-design', `${field}.pair`, "a pair by 'geometry' or by 'modes'", describe(p));
  const family = models.pair();
  const geo = p.by === 'geometry' ? { width: p.width, gap: p.gap }
    : p.by === 'modes' ? family.geometryFor(sub, { z0Even: p.z0Even, z0Odd: p.z0Odd }, f0)
      : (() => { throw new InputError('bad-choice', `${field}.pair.by`, "'geometry' or 'modes'", describe((p as { by?: unknown }).by)); })();
  const r = pairAt(family, sub, geo.width, geo.gap, f0);
  return {
    data: {
      width: r.width, gap: r.gap, z0Even: r.even.z0, z0Odd: r.odd.z0, epsEffEven: r.even.epsEff, epsEffOdd: r.odd.epsEff,
      betaEven: r.even.beta, betaOdd: r.odd.beta, couplingDb: r.couplingDb,
    },
    warnings: r.warnings,
  };
}

/** Nominal length of the coupled run, m. */
export function pairLength(seg: CoupledSegment, betaMean: number, field: string): number {
  const l = seg.length;
  if (l.by === 'degrees') return ((l.deg * Math.PI) / 180) / betaMean;
  if (l.by === 'length') return l.length;
  throw new InputError('bad-choice', `${field}.length.by`, "'degrees' or 'length'", describe((l as { by?: unknown }).by));
}

/**
 * For placement: each terminal of a pair and the terminal beside it on the other strip, with the offset from one to
 * the other (the pitch W + gap, across the first strip's drawn direction, to the side the second strip is drawn on).
 */
export function pairLinks(
  segments: DesignSegment[], nodeAt: (id: string) => Vec2 | undefined, pitchOf: (segId: string) => number | undefined,
  cutAt: (pieceId: string, node: string) => number,
): Map<string, { to: string; offset: Vec2; seg: string }[]> {
  const links = new Map<string, { to: string; offset: Vec2; seg: string }[]>();
  const add = (from: string, to: string, offset: Vec2, seg: string) => {
    const l = links.get(from) ?? [];
    l.push({ to, offset, seg });
    links.set(from, l);
  };
  for (const s of segments) {
    if (s.kind !== 'coupled') continue;
    const A = nodeAt(s.a), B = nodeAt(s.b), C = nodeAt(s.c);
    const pitch = pitchOf(s.id);
    if (!A || !B || !C || pitch === undefined) continue;
    const dx = B.x - A.x, dy = B.y - A.y, L = Math.hypot(dx, dy);
    if (!(L > 0)) continue;
    const ux = dx / L, uy = dy / L;
    const nx = -uy, ny = ux; // left of a → b
    const side = nx * (C.x - A.x) + ny * (C.y - A.y) >= 0 ? 1 : -1;
    // Each strip's copper ends where its own end corrections put it: a node sits at its strip's cut end.
    const s2 = s.id + SECOND_STRIP;
    const alongA = cutAt(s2, s.c) - cutAt(s.id, s.a), alongB = cutAt(s.id, s.b) - cutAt(s2, s.d);
    const offA = { x: side * nx * pitch + ux * alongA, y: side * ny * pitch + uy * alongA };
    const offB = { x: side * nx * pitch + ux * alongB, y: side * ny * pitch + uy * alongB };
    add(s.a, s.c, offA, s.id); add(s.c, s.a, { x: -offA.x, y: -offA.y }, s.id);
    add(s.b, s.d, offB, s.id); add(s.d, s.b, { x: -offB.x, y: -offB.y }, s.id);
  }
  return links;
}

/** Drawn nodes of a pair in the wrong arrangement (the two strips must be drawn side by side and the same way). */
export function pairDrawingProblem(seg: CoupledSegment, node: (id: string) => DesignNode | undefined): string | null {
  const A = node(seg.a)?.at, B = node(seg.b)?.at, C = node(seg.c)?.at, D = node(seg.d)?.at;
  if (!A || !B || !C || !D) return null;
  const ux = B.x - A.x, uy = B.y - A.y, vx = D.x - C.x, vy = D.y - C.y;
  const lu = Math.hypot(ux, uy), lv = Math.hypot(vx, vy);
  if (!(lu > 0) || !(lv > 0)) return `pair ${seg.id}: both strips need two different end points`;
  if ((ux * vx + uy * vy) / (lu * lv) < Math.cos(Math.PI / 180)) return `pair ${seg.id}: the strips a → b and c → d must be drawn parallel and in the same direction (c beside a, d beside b)`;
  return null;
}

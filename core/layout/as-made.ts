/**
 * The cross-section a design's process leaves around its lines (design `asMade`), as a section template for the
 * field solver's sizing tables, and the line options that size every line from it.
 *
 * - Isolation milling (end mill, V-bit): the isolation passes open a channel beside the copper and leave the rest of
 *   the top copper standing, so every line has wide side copper on both sides at the channel's width — the same
 *   channel the G-code mills (`isolationPlan` in process-cut.ts: cut + (passes − 1)·stepover). End mill: straight
 *   walls, a trench of (cut depth − copper thickness) into the substrate. V-bit: the channel at the substrate
 *   surface is narrower by the V's taper through the copper, 2·t·tan(angle/2); copper walls at 90° − angle/2; a
 *   trench down to the tip with walls at the V's angle (several passes: a flat bottom between them, which slightly
 *   overstates what the ridges between passes remove).
 * - Etching: side copper only where ground-copper areas are given a clearance; then every line is sized with side
 *   copper at the smallest such clearance (the design is sized as one cross-section: lines far from the ground
 *   copper are sized a little low in Z0 — the piece sheet shows the shift from plain microstrip for each).
 * Applies with asMade.sizing = 'as-made', which is the default of a milled design (core/design/as-made-default.ts);
 * 'microstrip' keeps plain microstrip.
 */
import type { DesignDoc } from '../design/types.ts';
import { asMadeOf } from '../design/as-made-default.ts';
import type { LineOptions } from '../line/index.ts';
import { sectionTable, type SectionTemplate } from '../section/index.ts';
import { isolationPlan } from './process-cut.ts';

export function asMadeTemplate(doc: DesignDoc): SectionTemplate | null {
  const m = asMadeOf(doc);
  if (m.sizing !== 'as-made') return null;
  const sub = doc.substrate;
  const p = doc.process;
  const base: SectionTemplate = { er: sub.er, h: sub.h, t: sub.t };
  if (m.cover && m.cover.thickness > 0) base.cover = { er: m.cover.er, thickness: m.cover.thickness };
  const connection = m.sideCopper;
  switch (p.kind) {
    case 'end-mill': {
      const depth = Math.max(0, p.depth - sub.t);
      return { ...base, side: { gap: isolationPlan(p).gap, width: Infinity, connection }, ...(depth > 0 ? { trench: { depth: Math.min(depth, 0.9 * sub.h) } } : {}) };
    }
    case 'v-bit': {
      const half = Math.tan(((p.angleDeg / 2) * Math.PI) / 180);
      const depth = Math.max(0, p.depth - sub.t);
      // The channel at the copper's top less the V's taper through the copper: its width at the substrate surface.
      const gap = isolationPlan(p).gap - 2 * Math.min(sub.t, p.depth) * half;
      if (!(gap > 0)) return null;
      const t: SectionTemplate = { ...base, side: { gap, width: Infinity, connection }, etchAngleDeg: 90 - p.angleDeg / 2 };
      if (sub.t > 0 && sub.t / Math.tan(((90 - p.angleDeg / 2) * Math.PI) / 180) > 0.4 * gap) delete t.etchAngleDeg;
      if (depth > 0) t.trench = { depth: Math.min(depth, 0.9 * sub.h), angleDeg: p.angleDeg };
      return t;
    }
    case 'etch': {
      const gaps = (doc.areas ?? []).filter((a) => a.kind === 'ground-copper' && typeof a.clearance === 'number' && a.clearance > 0).map((a) => a.clearance!);
      if (!gaps.length) return null;
      return { ...base, side: { gap: Math.min(...gaps), width: Infinity, connection } };
    }
  }
}

/** Line options that size from the design's as-made cross-section (the table is built on first use, TABLE_POINTS solves). */
export function asMadeLineOptions(doc: DesignDoc, line?: LineOptions): LineOptions | undefined {
  if (line?.crossSection) return line;
  const t = asMadeTemplate(doc);
  if (!t) return line;
  return { ...line, crossSection: sectionTable(t) };
}

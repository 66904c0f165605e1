/**
 * The last step of every branched block (corporate, wilkinson, branchline, ratrace): the block as drawn is swept once
 * at f0, lossless, with the junction and bend models the sweep uses, and judged against the figures of the blocks
 * issue (each transmission within 0.1 dB and 1° of its design value, every port that should be matched, and every
 * pair that should be isolated, below −25 dB). Where the junctions are too large for the wavelength (a thick board at
 * a high frequency) the textbook structure no longer meets them; the block is then refused, and the refusal names
 * the nearest spec that is made: the thickest common sheet of the same laminate, thinner than this one, on which
 * the same spec meets every figure (or, when none does, a lower frequency).
 */
import type { DesignDoc } from '../../design/types.ts';
import { sizeDesign } from '../../layout/sizing.ts';
import { netlistFromSized } from '../../network/fromSized.ts';
import { solveNetwork } from '../../network/sweep.ts';
import { InputError } from '../../util/errors.ts';
import { contextDesign, type BlockContext, type BlockPieces } from '../context.ts';

/** What a split should do at f0: design levels (dB) and phases (degrees, relative to the first output) of each path. */
export interface SplitFigures {
  paths: { from: string; outs: string[]; levelsDb: number[]; phasesDeg: number[] }[];
  matched: string[];
  isolated: [string, string][];
}

/** The issue's bounds: 0.1 dB, 1°, −25 dB. */
const LEVEL_DB = 0.1, PHASE_DEG = 1, MATCH_DB = -25;

const wrap = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;

/** The figures the block misses, in words (empty: it meets them all). */
export function splitMisses(pieces: BlockPieces, ctx: BlockContext, figs: SplitFigures): string[] {
  const doc: DesignDoc = contextDesign(ctx);
  doc.junctions = ctx.junctions; doc.nodes = pieces.nodes; doc.segments = pieces.segments;
  const r = solveNetwork(netlistFromSized(sizeDesign(doc), { lossless: true }), new Float64Array([ctx.f0]));
  const P = r.ports.length;
  const idx = (id: string) => r.ports.findIndex((p) => p.name === id);
  const s = (to: string, from: string) => {
    const t = 2 * (idx(to) * P + idx(from));
    return { db: 20 * Math.log10(Math.max(1e-15, Math.hypot(r.s[t]!, r.s[t + 1]!))), deg: (Math.atan2(r.s[t + 1]!, r.s[t]!) * 180) / Math.PI };
  };
  const out: string[] = [];
  for (const p of figs.paths) {
    const ref = s(p.outs[0]!, p.from).deg;
    p.outs.forEach((o, i) => {
      const x = s(o, p.from);
      if (Math.abs(x.db - p.levelsDb[i]!) >= LEVEL_DB) out.push(`port ${o} gets ${x.db.toFixed(2)} dB from ${p.from} (design ${p.levelsDb[i]!.toFixed(2)} dB)`);
      const dp = wrap(x.deg - ref - p.phasesDeg[i]!);
      if (Math.abs(dp) >= PHASE_DEG) out.push(`port ${o} is ${dp.toFixed(1)}° off its design phase`);
    });
  }
  for (const p of figs.matched) { const db = s(p, p).db; if (db >= MATCH_DB) out.push(`port ${p} is matched only to ${db.toFixed(1)} dB`); }
  for (const [a, b] of figs.isolated) { const db = s(b, a).db; if (db >= MATCH_DB) out.push(`ports ${a} and ${b} are isolated only to ${db.toFixed(1)} dB`); }
  return out;
}

/** Common laminate thicknesses, m, thickest first (common practice: 1.6, 1.2, 1.0, 0.8, 0.508, 0.254 mm). */
const SHEETS = [1.6e-3, 1.2e-3, 1.0e-3, 0.8e-3, 0.508e-3, 0.254e-3];

/**
 * Makes a block and judges it; refuses it when it cannot be laid out on this sheet (its junctions and bends need
 * more room than its quarter waves leave) or misses a figure, naming what fails and the nearest spec it makes.
 */
export function requireFigures(kind: string, make: (ctx: BlockContext) => BlockPieces, ctx: BlockContext, figs: SplitFigures): BlockPieces {
  let misses: string[];
  try {
    const pieces = make(ctx);
    misses = splitMisses(pieces, ctx, figs);
    if (!misses.length) return pieces;
  } catch (e) {
    if (!(e instanceof InputError) || e.code !== 'impossible-layout') throw e;
    misses = [e.got];
  }
  const h = ctx.substrate.h;
  let sheet = 0;
  for (const t of SHEETS.filter((x) => x < h - 1e-6)) {
    const c = { ...ctx, substrate: { ...ctx.substrate, h: t } };
    try {
      if (!splitMisses(make(c), c, figs).length) { sheet = t; break; }
    } catch (e) { if (!(e instanceof InputError)) throw e; }
  }
  const mm = (x: number) => `${+(x * 1e3).toFixed(3)} mm`;
  const nearest = sheet ? `the same spec is made on a ${mm(sheet)} sheet of this laminate` : 'no thinner common sheet of this laminate makes it at this frequency';
  throw new InputError('out-of-range', 'substrate.h',
    `a ${kind} whose junctions and bends are small beside the wavelength, so it can be laid out and meets the design figures (levels within ${LEVEL_DB} dB and ${PHASE_DEG}° of design, match and isolation below ${MATCH_DB} dB): ${nearest}`,
    `on a ${mm(h)} sheet at ${+(ctx.f0 / 1e9).toPrecision(4)} GHz: ${misses.slice(0, 3).join('; ')}${misses.length > 3 ? ` and ${misses.length - 3} more` : ''}`,
    sheet ? `use a ${mm(sheet)} sheet, or a lower design frequency` : 'use a lower design frequency, or a laminate of lower permittivity');
}

/**
 * Blocks as design data: making a whole design from a block (`makeBlockDesign`, the CLI's --out), adding a block
 * to a design (`blockPlacement`: the pieces and the record the `block.put` command stores), changing a placed
 * block's spec (`respecPlacement`: lists the hand edits inside it first) and detaching it (`block.detach`).
 * The record (`PlacedBlock`, design format 8) keeps the kind, the spec as given, where it was placed and the ids it
 * made, so the block can be re-opened and re-generated.
 */
import type { DesignDoc, DesignNode, DesignSegment, PhaseGroup, PlacedBlock, Target, Tolerance } from '../design/types.ts';
import { newDesign } from '../design/defaults.ts';
import { asMadeOf } from '../design/as-made-default.ts';
import { withBlock } from '../design/commands-blocks.ts';
import type { Vec2 } from '../geometry/types.ts';
import { InputError } from '../util/errors.ts';
import { blockDef } from './registry.ts';
import { readSpec, type ParamValue } from './params.ts';
import { contextDesign, type BlockContext, type BlockPieces } from './context.ts';
import { placeAsSized } from './drawn.ts';
import { fitFootprint, footprintOf } from './fold.ts';
import { sizeDesign } from '../layout/sizing.ts';
import { processCautions } from '../layout/cautions.ts';
import { DEFAULT_TOLERANCES_NOTE, defaultTolerances } from './tolerance-defaults.ts';

/** The design's own laminate, process, f0 and junctions, as a block context. */
export function contextOf(doc: DesignDoc): BlockContext {
  return { substrate: doc.substrate, process: doc.process, f0: doc.frequency.f0, junctions: doc.junctions ?? 'modelled', asMade: asMadeOf(doc) };
}

/** Checks the spec (text with units or SI numbers) and generates the block's pieces, placed where sizing puts them. */
export function generateBlock(kind: string, raw: Record<string, unknown>, ctx: BlockContext): { spec: Record<string, ParamValue>; pieces: BlockPieces } {
  const def = blockDef(kind);
  const spec = readSpec(kind, def.params, raw);
  const pieces = def.generate(spec, ctx);
  // Every block is laid out once on its own, so a spec sizing cannot realise is refused here, naming the problem.
  const probe = contextDesign(ctx);
  probe.junctions = ctx.junctions; probe.nodes = pieces.nodes; probe.segments = pieces.segments;
  placeAsSized(probe, kind);
  // An optional footprint: the block is turned or folded to fit it, or refused naming the footprint it needs.
  const fp = footprintOf(spec, kind);
  const note = fp ? fitFootprint(probe, kind, fp, { pitchRow: def.params.some((x) => x.name === 'pitch') }) : null;
  if (note) return { spec, pieces: { ...pieces, nodes: probe.nodes, segments: probe.segments, notes: [...pieces.notes, note] } };
  return { spec, pieces };
}

/** Extent of the drawn nodes. */
function extent(nodes: { at: Vec2 }[]): { x0: number; y0: number; x1: number; y1: number } {
  const xs = nodes.map((n) => n.at.x), ys = nodes.map((n) => n.at.y);
  return { x0: Math.min(...xs), y0: Math.min(...ys), x1: Math.max(...xs), y1: Math.max(...ys) };
}

/**
 * A complete design of one block: laminate, band, ports, board edge (a 5 mm margin, common practice for hand-cut
 * boards), phase groups and targets. `build`, `sweep` and `export` take it as is.
 */
export function makeBlockDesign(kind: string, raw: Record<string, unknown>, base: { f0: number; substrate?: DesignDoc['substrate']; process?: DesignDoc['process']; name?: string; junctions?: DesignDoc['junctions']; asMade?: DesignDoc['asMade'] }): DesignDoc {
  const doc = newDesign({ f0: base.f0, ...(base.substrate ? { substrate: base.substrate } : {}), ...(base.process ? { process: base.process } : {}), ...(base.asMade ? { asMade: base.asMade } : {}) });
  doc.junctions = base.junctions ?? 'modelled';
  return placeBlock(doc, kind, raw, { x: 0, y: 0 }, { asWhole: true, ...(base.name ? { name: base.name } : {}) });
}

/** The records a placement adds: pieces under ids prefixed by the block id, and the block record. */
export interface BlockPlacement {
  record: PlacedBlock;
  nodes: DesignNode[];
  segments: DesignSegment[];
  phaseGroups: PhaseGroup[];
  targets: Target[];
  name: string;
  notes: string[];
  /** The block's own band, Hz: placing it widens the design's band (and sweep settings) to cover it. */
  band: { start: number; stop: number };
  /** Default tolerances, given only when the design is empty and has none (tolerance-defaults.ts), with their reasons. */
  tolerances?: Tolerance[];
  toleranceReasons?: string[];
}

/** A fresh block id (`b1`, `b2`, …) not used by any record of the design. */
export function freshBlockId(doc: DesignDoc): string {
  const used = new Set([...doc.nodes.map((n) => n.id), ...doc.segments.map((s) => s.id), ...(doc.blocks ?? []).map((b) => b.id), ...doc.phaseGroups.map((g) => g.id), ...doc.targets.map((t) => t.id)]);
  for (let k = 1; ; k++) if (![...used].some((u) => u === `b${k}` || u.startsWith(`b${k}.`))) return `b${k}`;
}

/**
 * The pieces of a block for `doc`, made with its laminate, process and f0, prefixed `id.` and moved so the block's
 * first port sits at `at`. Pure: the caller adds them with the `block.put` command (one undo step).
 */
export function blockPlacement(doc: DesignDoc, kind: string, raw: Record<string, unknown>, at: Vec2, id = freshBlockId(doc)): BlockPlacement {
  const { spec, pieces } = generateBlock(kind, raw, contextOf(doc));
  const anchor = pieces.nodes.find((n) => n.kind === 'port') ?? pieces.nodes[0]!;
  const dx = at.x - anchor.at.x, dy = at.y - anchor.at.y;
  const p = (s: string) => `${id}.${s}`;
  const nodes = pieces.nodes.map((n) => ({ ...n, id: p(n.id), at: { x: nm(n.at.x + dx), y: nm(n.at.y + dy) } }));
  const segments = pieces.segments.map((s) => (s.kind === 'coupled' ? { ...s, id: p(s.id), a: p(s.a), b: p(s.b), c: p(s.c), d: p(s.d) } : { ...s, id: p(s.id), a: p(s.a), b: p(s.b) }));
  const phaseGroups = pieces.phaseGroups.map((g) => ({ ...g, id: p(g.id), from: p(g.from), to: g.to.map(p) }));
  const targets = pieces.targets.map((t) => ({ ...t, id: p(t.id), ...(t.ports ? { ports: t.ports.map(p) } : {}), ...(t.group ? { group: p(t.group) } : {}) }));
  const record: PlacedBlock = {
    id, kind, spec: spec as PlacedBlock['spec'], at: { x: nm(at.x), y: nm(at.y) },
    members: [...nodes.map((n) => n.id), ...segments.map((s) => s.id)],
    made: Object.fromEntries([...nodes, ...segments].map((r) => [r.id, fingerprint(r)])),
  };
  // An empty design with no tolerances gets the defaults for its laminate and process, so its yield has a spread.
  const empty = !doc.nodes.length && !doc.segments.length && !(doc.tolerances ?? []).length;
  const tol = empty ? defaultTolerances(doc.substrate, doc.process, { resistors: segments.some((s) => s.kind === 'lumped' && s.part === 'resistor') }) : null;
  return {
    record, nodes, segments, phaseGroups, targets, name: pieces.name, notes: pieces.notes, band: pieces.band,
    ...(tol && tol.tolerances.length ? { tolerances: tol.tolerances, toleranceReasons: tol.reasons } : {}),
  };
}

/** One line for the faces: how placing widened the design's band or sweep settings (null when it did not). */
export function bandChangeWords(before: DesignDoc, after: DesignDoc): string | null {
  const ghz = (f: number) => `${+(f / 1e9).toFixed(4)} GHz`;
  const span = (b: { start: number; stop: number }) => `${ghz(b.start)}–${ghz(b.stop)}`;
  const out: string[] = [];
  const b0 = before.frequency.band, b1 = after.frequency.band;
  if (b0.start !== b1.start || b0.stop !== b1.stop) out.push(`design band widened from ${span(b0)} to ${span(b1)}`);
  if (before.sweep && after.sweep && (before.sweep.start !== after.sweep.start || before.sweep.stop !== after.sweep.stop)) out.push(`sweep settings widened from ${span(before.sweep)} to ${span(after.sweep)}`);
  return out.length ? `${out.join('; ')}, to cover the block's band` : null;
}

/** Adds a block to a copy of `doc` (`asWhole`: the design is the block: its name, notes, band and board edge follow it). */
export function placeBlock(doc: DesignDoc, kind: string, raw: Record<string, unknown>, at: Vec2, opts: { asWhole?: boolean; name?: string } = {}): DesignDoc {
  const pl = blockPlacement(doc, kind, raw, at);
  let next = withBlock(doc, pl);
  if (opts.asWhole) {
    // 5 mm beyond the copper (common practice for hand-cut boards): the nodes' extent plus the widest piece.
    const widest = Math.max(0, ...sizeDesign(next).pieces.map((x) => (Number.isFinite(x.width) ? x.width : 0)), ...pl.nodes.map((n) => (n.kind === 'port' && n.launch ? n.launch.padWidth : 0)));
    const e = extent(pl.nodes), m = 5e-3 + widest;
    const band = pl.band;
    next = {
      ...next, name: opts.name ?? pl.name, notes: [...pl.notes, ...(pl.toleranceReasons ? [DEFAULT_TOLERANCES_NOTE, ...pl.toleranceReasons.map((r) => `- ${r}`)] : []), `Safety: transmitting into a made board needs the usual RF-exposure care and a licence where your local rules ask for one. ${processCautions(doc.process).join(' ')}`].join('\n'),
      frequency: { f0: doc.frequency.f0, band },
      board: { outline: [{ x: nm(e.x0 - m), y: nm(e.y0 - m) }, { x: nm(e.x1 + m), y: nm(e.y0 - m) }, { x: nm(e.x1 + m), y: nm(e.y1 + m) }, { x: nm(e.x0 - m), y: nm(e.y1 + m) }] },
    };
  }
  return next;
}

/** What changed by hand inside a placed block since it was made: ids edited, removed or added to its members. */
export function handEdits(doc: DesignDoc, id: string): string[] {
  const rec = (doc.blocks ?? []).find((b) => b.id === id);
  if (!rec) throw new InputError('bad-choice', 'block', `a placed block of this design (${(doc.blocks ?? []).map((b) => b.id).join(', ') || 'none'})`, id);
  const before = new Map<string, string>(Object.entries(rec.made));
  const now = new Map<string, string>([...doc.nodes, ...doc.segments].filter((r) => before.has(r.id) || r.id.startsWith(`${id}.`)).map((r) => [r.id, fingerprint(r)]));
  const out: string[] = [];
  for (const [k, v] of before) {
    if (!now.has(k)) out.push(`${k} removed`);
    else if (now.get(k) !== v) out.push(`${k} changed`);
  }
  for (const k of now.keys()) if (!before.has(k)) out.push(`${k} added`);
  return out;
}

/**
 * Re-generates placed block `id` with a new spec (same place). Returns the placement for `block.put` and the hand
 * edits it would overwrite; the face shows them and lets the user keep the block (re-generate) or detach it.
 */
export function respecPlacement(doc: DesignDoc, id: string, raw: Record<string, unknown>): { placement: BlockPlacement; handEdits: string[] } {
  const edits = handEdits(doc, id);
  const rec = doc.blocks!.find((b) => b.id === id)!;
  return { placement: blockPlacement(doc, rec.kind, raw, rec.at, id), handEdits: edits };
}

/**
 * A short fingerprint of a record (FNV-1a, 32 bits, over its JSON with sorted keys), kept per member so a later
 * hand edit can be found without storing the pieces twice.
 */
export function fingerprint(r: unknown): string {
  const text = JSON.stringify(r, (_k, v: unknown) => (v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b))) : v));
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) { h ^= text.charCodeAt(i); h = Math.imul(h, 0x01000193) >>> 0; }
  return h.toString(16).padStart(8, '0');
}
const nm = (x: number) => Math.round(x * 1e9) / 1e9;

/**
 * What every block generator is given (the laminate, process, design frequency and junction choice of the design it
 * is made for) and what it returns (pieces with local ids, its phase groups and targets), plus the small drawing
 * helper they share. Positions drawn here only need the right directions and rough lengths: the design is redrawn
 * where sizing places it (drawAsPlaced), so the sketch and the board agree.
 */
import type { AsMade, DesignDoc, DesignNode, DesignSegment, FabProcess, JunctionChoice, PhaseGroup, SubstrateSpec, Target } from '../design/types.ts';
import type { Vec2 } from '../geometry/types.ts';
import { newDesign } from '../design/defaults.ts';
import { lineModels, stripAt, type LineAt, type LineOptions } from '../line/index.ts';
import { asMadeLineOptions } from '../layout/as-made.ts';
import { cutWidth } from '../layout/checks.ts';
import { InputError } from '../util/errors.ts';
import type { ParamDef, ParamValue } from './params.ts';

export interface BlockContext {
  substrate: SubstrateSpec;
  process: FabProcess;
  /** Design frequency, Hz. */
  f0: number;
  junctions: JunctionChoice;
  /** How the host design sizes its lines (absent: the default for the process, core/design/as-made-default.ts). */
  asMade?: AsMade;
}

export interface BlockPieces {
  /** A name for the design or the placed block. */
  name: string;
  nodes: DesignNode[];
  segments: DesignSegment[];
  phaseGroups: PhaseGroup[];
  targets: Target[];
  /** Design equations and values, one line each, naming the published source. */
  notes: string[];
  /** The band the block is meant to be looked at over, Hz. */
  band: { start: number; stop: number };
}

export type Spec = Record<string, ParamValue>;

export interface BlockDef {
  kind: string;
  title: string;
  /** One line: what it makes. */
  summary: string;
  /** The published design equations it follows. */
  source: string;
  params: readonly ParamDef[];
  generate(spec: Spec, ctx: BlockContext): BlockPieces;
}

/** The port impedance every block asks for. */
export const Z0_PARAM: ParamDef = { name: 'z0', type: 'number', unit: 'impedance', min: 10, max: 200, default: 50, meaning: 'System impedance of the ports' };
/** Length of the port lines. */
export const FEED_PARAM: ParamDef = { name: 'feed', type: 'number', unit: 'length', min: 0.5e-3, max: 100e-3, default: 5e-3, meaning: 'Length of each port line' };

/** Narrowest copper the process makes, m (etching: its minimum feature; milling: one cut, below which copper lifts). */
/**
 * A design on the block's laminate, band, process and line sizing, for laying out, probing or sweeping the block on
 * its own: every such design sees what the host design will, so a correction measured on it holds when placed.
 */
export function contextDesign(ctx: BlockContext, substrate: SubstrateSpec = ctx.substrate): DesignDoc {
  return newDesign({ f0: ctx.f0, substrate, process: ctx.process, ...(ctx.asMade ? { asMade: ctx.asMade } : {}) });
}

export function narrowestWidth(p: FabProcess): number { return p.kind === 'etch' ? p.minFeature : cutWidth(p); }

/**
 * Width of a Z line at f0 as the host design sizes it (plain microstrip, or as made beside the process's isolation
 * channel), refused when the process cannot make it: the message names the highest impedance it can make on this
 * laminate (the nearest it can do).
 */
export function widthFor(ctx: BlockContext, z: number, field: string, what: string): number {
  const opts = madeLineOptions(ctx);
  const widthOf = (zz: number): number => { try { return lineModels.strip().widthFor(ctx.substrate, zz, ctx.f0, opts); } catch { return 0; } };
  const w = widthOf(z);
  const minW = narrowestWidth(ctx.process);
  if (w >= minW) return w;
  // The synthesis is monotone in Z: step down until the width is makeable, to name the nearest the process can do.
  let zMax = z;
  for (let k = 0; k < 600 && widthOf(zMax) < minW; k++) zMax *= 0.99;
  const beside = opts?.crossSection ? ' beside its isolation channel' : '';
  throw new InputError('out-of-range', field, `impedances the process can make (its narrowest copper is ${(minW * 1e3).toFixed(3)} mm, about ${zMax.toFixed(1)} Ω on this laminate${beside})`,
    `${what} needs ${z.toFixed(1)} Ω${w > 0 ? `, ${(w * 1e3).toFixed(3)} mm wide` : ', narrower than the line model reaches'}`, 'ask for a smaller ratio or impedance, use a thicker laminate, a wider isolation clearance, or a finer process');
}

/** The line options the host sizes with (as made: the cross-section table of its process; else none). */
function madeLineOptions(ctx: BlockContext): LineOptions | undefined {
  return asMadeLineOptions(contextDesign(ctx));
}

/** Guided wavelength of a Z line at f, m. */
export function lambdaG(ctx: BlockContext, z: number, f = ctx.f0): number { return stripOfZ0(ctx.substrate, z, f).lambdaG; }

/** The strip of impedance z on `sub` at f, through the line-model interface (the core's strip family). */
export function stripOfZ0(sub: BlockContext['substrate'], z: number, f: number): LineAt {
  const strip = lineModels.strip();
  return stripAt(strip, sub, strip.widthFor(sub, z, f), f);
}

/** Collects nodes and segments with local ids, drawn at rough positions. */
export class Sketch {
  nodes: DesignNode[] = [];
  segments: DesignSegment[] = [];
  port(id: string, at: Vec2, zRef: number, heading: number, label: string, launch?: { padWidth: number; padLength: number }): string {
    this.nodes.push({ id, kind: 'port', zRef, heading, label, at, ...(launch ? { launch } : {}) });
    return id;
  }
  vertex(id: string, at: Vec2, style: 'miter-optimal' | 'square' = 'miter-optimal'): string {
    this.nodes.push({ id, kind: 'vertex', bend: { style }, at });
    return id;
  }
  junction(id: string, at: Vec2): string { this.nodes.push({ id, kind: 'junction', at }); return id; }
  open(id: string, at: Vec2, label?: string): string { this.nodes.push({ id, kind: 'open', at, ...(label ? { label } : {}) }); return id; }
  short(id: string, at: Vec2, label?: string): string {
    // A 0.8 mm drill in a 1.4 mm pad: a common hand-drilled via (common practice).
    this.nodes.push({ id, kind: 'short', via: { drill: 0.8e-3, pad: 1.4e-3, count: 1 }, at, ...(label ? { label } : {}) });
    return id;
  }
  line(id: string, a: string, b: string, z: number, length: { deg: number } | { length: number } | 'drawn', label?: string): void {
    this.segments.push({
      id, kind: 'line', a, b, width: { by: 'z0', z0: round6(z) },
      length: length === 'drawn' ? { by: 'drawn' } : 'deg' in length ? { by: 'degrees', deg: round9(length.deg) } : { by: 'length', length: round9(length.length) },
      ...(label ? { label } : {}),
    });
  }
  at(id: string): Vec2 { return this.nodes.find((n) => n.id === id)!.at; }
}

export function round6(x: number): number { return Math.round(x * 1e6) / 1e6; }
export function round9(x: number): number { return Math.round(x * 1e9) / 1e9; }
export const deg = (rad: number): number => (rad * 180) / Math.PI;
export const ghz = (f: number): string => `${+(f / 1e9).toPrecision(5)} GHz`;
export const ohm = (z: number): string => `${z.toFixed(2)} Ω`;

/**
 * The smallest resistor footprint whose pad pitch leaves the two arm ends meeting it apart (half their widths plus
 * 0.5 mm); 0603 at least, a size still soldered by hand (common practice). Pitches as in core/layout/footprints.ts.
 */
export function resistorFor(w1: number, w2: number): { size: '0603' | '0805' | '1206'; pitch: number } {
  const need = (w1 + w2) / 2 + 0.5e-3;
  for (const f of [{ size: '0603', pitch: 1.6e-3 }, { size: '0805', pitch: 2.0e-3 }] as const) if (f.pitch >= need) return f;
  return { size: '1206', pitch: 3.1e-3 };
}

/**
 * The jobs the compute worker runs, as plain functions of plain data (so they also run inline in tests):
 * layout (sizing, copper geometry, paths and phase, fabrication checks) and response (a sweep of the sized
 * network). All physics and geometry come from the core; this file only sequences the calls and reports progress.
 */
import type { DesignDoc } from '../../../core/design/types.ts';
import type { BoardGeometry, DrillHit } from '../../../core/geometry/types.ts';
import { initPolygons } from '../../../core/geometry/index.ts';
import { sizeDesign, LineCache, type SizedDesign } from '../../../core/layout/index.ts';
import { buildBoardGeometry, pieceOutlines, type PieceOutline } from '../../../core/layout/geometry.ts';
import { InputError, exhaustive } from '../../../core/util/errors.ts';
import type { JobKind } from './protocol.ts';
import type { Progress } from './client.ts';

export interface LayoutInput { doc: DesignDoc }
/**
 * The live layout: sized pieces and each piece's own copper (no union, so it needs no polygon engine and stays
 * fast while dragging). The united board geometry is built only for outputs (geometryJob).
 */
export interface LayoutOutput { sized: SizedDesign; outlines: PieceOutline[]; drills: DrillHit[]; geometryError: string | null }

export interface ResponseInput { doc: DesignDoc; points?: number; start?: number; stop?: number }
export interface ResponseOutput { freqs: number[]; ports: string[] }

/** How the polygon engine finds its wasm: the worker passes Vite's asset URL; Node needs nothing. */
let polygonInit: (() => Promise<void>) | null = null;
let polygonsReady: Promise<void> | null = null;

export function setPolygonInit(init: () => Promise<void>): void { polygonInit = init; }

function polygons(): Promise<void> {
  polygonsReady ??= (polygonInit ?? (() => initPolygons()))();
  return polygonsReady;
}

// One line cache per substrate and line-model choice: re-sizing on every keystroke then costs Map lookups.
let cache: { key: string; cache: LineCache } | null = null;
function lineCache(doc: DesignDoc): LineCache {
  const key = JSON.stringify(doc.substrate);
  if (!cache || cache.key !== key) cache = { key, cache: new LineCache(doc.substrate) };
  return cache.cache;
}

export async function runJob(kind: JobKind, input: unknown, progress: (p: Progress) => void): Promise<unknown> {
  switch (kind) {
    case 'layout': return layoutJob(input as LayoutInput, progress);
    case 'geometry': return geometryJob(input as LayoutInput);
    case 'response': throw new InputError('bad-choice', 'job', 'a job this build can run', 'response');
    default: return exhaustive(kind, 'job');
  }
}

export async function layoutJob(input: LayoutInput, progress: (p: Progress) => void): Promise<LayoutOutput> {
  progress({ done: 0, total: 2, label: 'sizing' });
  const sized = sizeDesign(input.doc, { cache: lineCache(input.doc) });
  progress({ done: 1, total: 2, label: 'copper' });
  let outlines: PieceOutline[] = [];
  let drills: DrillHit[] = [];
  let geometryError: string | null = null;
  try {
    ({ outlines, drills } = pieceOutlines(sized));
  } catch (err) {
    // The sizes are still worth showing when the copper cannot be drawn (an unplaced piece, for example).
    geometryError = errorText(err);
  }
  progress({ done: 2, total: 2, label: 'done' });
  return { sized, outlines, drills, geometryError };
}

/** The united board geometry for outputs (copper, ground, clearance, drills), from the polygon engine. */
export async function geometryJob(input: LayoutInput): Promise<BoardGeometry> {
  const sized = sizeDesign(input.doc, { cache: lineCache(input.doc) });
  if (sized.problems.length) {
    throw new InputError('impossible-layout', 'design', 'a design that can be laid out', sized.problems.map((p) => p.message).join('; '));
  }
  await polygons();
  return buildBoardGeometry(sized);
}

export function errorText(err: unknown): string {
  return err instanceof InputError ? `${err.field}: expected ${err.expected}, got ${err.got}` : err instanceof Error ? err.message : String(err);
}

/**
 * The jobs the compute worker runs, as plain functions of plain data (so they also run inline in tests):
 * layout (sizing, copper geometry, paths and phase, fabrication checks) and response (a sweep of the sized
 * network). All physics and geometry come from the core.
 */
import type { DesignDoc } from '../../../core/design/types.ts';
import type { BoardGeometry } from '../../../core/geometry/types.ts';
import type { SizedDesign } from '../../../core/layout/types.ts';
import type { JobKind } from './protocol.ts';
import type { Progress } from './client.ts';
import { InputError } from '../../../core/util/errors.ts';

export interface LayoutInput { doc: DesignDoc }
export interface LayoutOutput { sized: SizedDesign; geometry: BoardGeometry | null; geometryError: string | null }

export interface ResponseInput { doc: DesignDoc; points?: number; start?: number; stop?: number }
export interface ResponseOutput { freqs: number[]; ports: string[] }

export async function runJob(kind: JobKind, input: unknown, progress: (p: Progress) => void): Promise<unknown> {
  switch (kind) {
    case 'layout': return layoutJob(input as LayoutInput, progress);
    case 'response': throw new InputError('bad-choice', 'job', 'a job this build can run', 'response');
  }
}

async function layoutJob(input: LayoutInput, progress: (p: Progress) => void): Promise<LayoutOutput> {
  progress({ done: 0, total: 2, label: 'sizing' });
  throw new InputError('bad-choice', 'job', 'the layout layer', 'none yet');
}

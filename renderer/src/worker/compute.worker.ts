/**
 * The compute worker: runs sizing, geometry, checks and sweeps off the main thread and reports progress, so the
 * board stays responsive on big designs. The work itself is in jobs.ts (the same code runs inline in tests).
 */
import wasmUrl from 'clipper2-wasm/dist/es/clipper2z.wasm?url';
import { initPolygons } from '../../../core/geometry/index.ts';
import { runJob, setPolygonInit } from './jobs.ts';
import type { JobRequest, WorkerMessage } from './protocol.ts';
import { toJobError } from './client.ts';

setPolygonInit(() => initPolygons({ locateFile: () => wasmUrl }));

const post = (m: WorkerMessage) => (self as unknown as { postMessage(m: WorkerMessage): void }).postMessage(m);

self.onmessage = async (e: MessageEvent<JobRequest>) => {
  const { id, kind, input } = e.data;
  const t0 = performance.now();
  try {
    const value = await runJob(kind, input, (p) => post({ type: 'progress', id, ...p }));
    post({ type: 'result', id, value, ms: performance.now() - t0 });
  } catch (err) {
    post({ type: 'error', id, ...toJobError(err) });
  }
};

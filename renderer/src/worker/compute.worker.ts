/**
 * The compute worker: runs sizing, geometry, checks and sweeps off the main thread and reports progress, so the
 * board stays responsive on big designs. The work itself is in jobs.ts (the same code runs inline in tests).
 */
import wasmUrl from 'clipper2-wasm/dist/es/clipper2z.wasm?url';
import { initPolygons } from '../../../core/index.ts';
import fontUrl from 'dejavu-fonts-ttf/ttf/DejaVuSans.ttf?url';
import { runJob, setPolygonInit } from './jobs.ts';
import { setReportFont } from './measured-job.ts';
import type { CancelRequest, JobRequest, WorkerMessage } from './protocol.ts';
import { toJobError } from './client.ts';

setPolygonInit(() => initPolygons({ locateFile: () => wasmUrl }));
setReportFont(async () => new Uint8Array(await (await fetch(fontUrl)).arrayBuffer()));

const post = (m: WorkerMessage) => (self as unknown as { postMessage(m: WorkerMessage): void }).postMessage(m);

// Jobs that can be stopped (a yield run): the editor's cancel reaches them between chunks.
const running = new Map<number, AbortController>();

self.onmessage = async (e: MessageEvent<JobRequest | CancelRequest>) => {
  if (e.data.type === 'cancel') { running.get(e.data.id)?.abort(); return; }
  const { id, kind, input } = e.data;
  const t0 = performance.now();
  const ctl = new AbortController();
  running.set(id, ctl);
  try {
    const value = await runJob(kind, input, (p) => post({ type: 'progress', id, ...p }), ctl.signal);
    post({ type: 'result', id, value, ms: performance.now() - t0 });
  } catch (err) {
    post({ type: 'error', id, ...toJobError(err) });
  } finally {
    running.delete(id);
  }
};

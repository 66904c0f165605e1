/**
 * The compute worker: runs sizing, geometry, checks and sweeps off the main thread and reports progress, so the
 * board stays responsive on big designs. The work itself is in jobs.ts (the same code runs inline in tests).
 */
import wasmUrl from 'clipper2-wasm/dist/es/clipper2z.wasm?url';
import { initPolygons } from '../../../core/index.ts';
import fontUrl from 'dejavu-fonts-ttf/ttf/DejaVuSans.ttf?url';
import { runJob, setPolygonInit } from './jobs.ts';
import { setReportFont } from './measured-job.ts';
import { serveJobs } from './serve-jobs.ts';

setPolygonInit(() => initPolygons({ locateFile: () => wasmUrl }));
setReportFont(async () => new Uint8Array(await (await fetch(fontUrl)).arrayBuffer()));

// Jobs that can be stopped (a yield run): the editor's cancel reaches them between chunks (serve-jobs.ts).
serveJobs(runJob);

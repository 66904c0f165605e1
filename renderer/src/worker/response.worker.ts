/**
 * The response worker: runs only response jobs (response-job.ts), apart from the compute worker's layout, so a sweep
 * never waits behind a layout and a layout never behind a sweep. It speaks the compute worker's protocol
 * (protocol.ts), so the editor drives it with the same ComputeClient; it keeps its own pipeline (each worker has
 * its own instance of worker-pipeline.ts) with the sweep's kept element values, and loads neither the polygon
 * engine nor the report font. A newer revision's request does not queue behind a stale one: the editor cancels a
 * long stale pass (compute.svelte.ts follow) and the cancel stops it between chunks.
 */
import { responseJob } from './response-job.ts';
import { packResponse } from './response-post.ts';
import type { JobRequest } from './protocol.ts';
import type { Progress } from './client.ts';
import { serveJobs } from './serve-jobs.ts';

/** The response job as the page receives it: packed into one block of numbers (response-post.ts). */
async function runResponse(kind: JobRequest['kind'], input: unknown, progress: (p: Progress) => void, signal?: AbortSignal): Promise<unknown> {
  if (kind !== 'response') throw new Error(`the response worker runs response jobs only, not '${kind}'`);
  return packResponse(await responseJob(input as Parameters<typeof responseJob>[0], progress, signal));
}

serveJobs(runResponse);

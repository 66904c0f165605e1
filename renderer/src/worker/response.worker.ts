/**
 * The response worker: runs only response jobs (response-job.ts), apart from the compute worker's layout, so a sweep
 * never waits behind a layout and a layout never behind a sweep. It speaks the compute worker's protocol
 * (protocol.ts), so the editor drives it with the same ComputeClient, and loads neither the polygon engine nor the
 * report font.
 *
 * What makes a drag's response quick here:
 * - the design arrives as the change from the revision sent before (response-doc.ts), applied to the worker's own
 *   copy, so records the edit left alone keep their identity;
 * - its pipeline sizes each revision from the one before (core DesignPipeline `live`: liveSizing, ends memoised per
 *   node by those very records) and keeps the sweep's element values across revisions (core sweepDesign);
 * - a newer revision's request does not queue behind a stale one: the editor cancels the stale pass
 *   (compute.svelte.ts follow) and the cancel stops it between frequency chunks.
 */
import { DesignPipeline } from '../../../core/index.ts';
import { responseSeries, type ResponseInput } from './response-job.ts';
import { packResponse } from './response-post.ts';
import { DesignReplica, type DesignPost } from './response-doc.ts';
import type { JobRequest } from './protocol.ts';
import type { Progress } from './client.ts';
import { serveJobs } from './serve-jobs.ts';
import { Turns } from './response-turns.ts';

/** A response request as the page sends it to this worker: the design as a post of response-doc.ts. */
export type ResponseRequest = Omit<ResponseInput, 'doc'> & { design: DesignPost };

const pipeline = new DesignPipeline({ capacity: 48, live: true });
const replica = new DesignReplica();

/** One pass at a time; of the requests waiting meanwhile only the newest runs (response-turns.ts). */
const turns = new Turns();

/** The response job as the page receives it: packed into one block of numbers (response-post.ts). */
async function runResponse(kind: JobRequest['kind'], input: unknown, progress: (p: Progress) => void, signal?: AbortSignal, begin?: () => void): Promise<unknown> {
  if (kind !== 'response') throw new Error(`the response worker runs response jobs only, not '${kind}'`);
  // Applied as the request arrives (before any pause), so the copy follows the page's posts in order.
  const { design, ...rest } = input as ResponseRequest;
  const doc = replica.receive(design);
  return turns.run(() => {
    begin?.();
    return responseSeries({ ...rest, doc }, progress, signal, pipeline).then(packResponse);
  }, signal);
}

serveJobs(runResponse);

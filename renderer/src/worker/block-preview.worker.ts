/**
 * The block picker's worker: runs only the preview job (block-preview-job.ts), so generating, folding and sweeping a
 * large block never holds up the page while the user types, nor the compute worker's layout of the open design. It
 * speaks the compute worker's protocol (protocol.ts) through the same ComputeClient; the picker stops a long stale
 * preview by ending this worker and starting another (state/block-preview.ts).
 */
import { blockPreviewJob, type BlockPreviewInput } from './block-preview-job.ts';
import { serveJobs } from './serve-jobs.ts';

serveJobs(async (kind, input) => {
  if (kind !== 'block-preview') throw new Error(`the block worker runs block previews only, not '${kind}'`);
  return blockPreviewJob(input as BlockPreviewInput);
});

/**
 * The worker's one pipeline (core/pipeline): every job of one design revision shares its sizing, board, paths, plan
 * and network, whichever job asks first. Bounded, so a long session keeps only recent revisions. Each worker (the
 * compute worker, the response worker) has its own instance of this module, hence its own pipeline.
 */
import { DesignPipeline } from '../../../core/index.ts';

export const pipeline = new DesignPipeline({ capacity: 48 });

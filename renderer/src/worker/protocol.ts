/**
 * Messages between the editor and its compute worker. Each job carries an id; the worker answers with any number
 * of progress messages and then one result or one error. A newer job of the same kind supersedes an older one
 * (the older result is dropped on arrival), so typing fast never queues stale work on screen.
 */
export type JobKind = 'layout' | 'geometry' | 'check' | 'response' | 'export' | 'section' | 'milling' | 'yield' | 'equalize' | 'tune' | 'compare' | 'block-preview';

export interface JobRequest<K extends JobKind = JobKind, I = unknown> { type: 'job'; id: number; kind: K; input: I }

/** Asks the worker to stop job `id` (it stops at its next pause and answers with an error named AbortError). */
export interface CancelRequest { type: 'cancel'; id: number }

export type WorkerMessage =
  | { type: 'progress'; id: number; done: number; total: number; label: string }
  | { type: 'result'; id: number; value: unknown; ms: number }
  | { type: 'error'; id: number; message: string; field?: string; expected?: string; got?: string };

/**
 * The pause a response sweep takes between frequency chunks, so the worker takes in a cancel or a newer revision.
 * In a worker it is a message to itself (MessageChannel): browsers clamp a timer set from within a timer's callback,
 * five levels deep, to at least 4 ms (HTML Living Standard, timer initialisation steps), and a sweep's chunks and
 * the passes of a drag, run back to back, chain that deep at once: three pauses a pass then cost 12 ms of waiting.
 * Elsewhere (Node tests, the inline fallback) a zero timer, which neither clamps there nor keeps a process alive.
 */
const inWorker = typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined' && typeof MessageChannel !== 'undefined';

let channel: MessageChannel | null = null;
const waiting: (() => void)[] = [];

export function yieldToHost(): Promise<void> {
  if (!inWorker) return new Promise((ok) => setTimeout(ok, 0));
  if (!channel) {
    channel = new MessageChannel();
    channel.port1.onmessage = () => waiting.shift()?.();
  }
  const port = channel.port2;
  return new Promise((ok) => { waiting.push(ok); port.postMessage(0); });
}

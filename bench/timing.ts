/** Timing helpers the benchmarks share: this process's CPU time (user + system) beside the wall clock. */

/** CPU milliseconds since `t0` (a `process.cpuUsage()` reading). */
export function cpuMs(t0: NodeJS.CpuUsage): number {
  const c = process.cpuUsage(t0);
  return (c.user + c.system) / 1000;
}

/** One call of `body`: its CPU and wall milliseconds. */
export function timed(body: () => void): { cpu: number; wall: number } {
  const c = process.cpuUsage(), t = performance.now();
  body();
  return { cpu: cpuMs(c), wall: performance.now() - t };
}

/**
 * The watchdog of the I/O fuzz suites (touchstone, bridge, cli): the inputs run in a child process
 * (io-fuzz-runner.ts) that prints one line per input; when no line comes for 10 s the child is killed, the input
 * counted as a hang, and a new child goes on from the next input. Synchronous code cannot be interrupted in-process,
 * so this is the only way a runaway parser is stopped rather than waited for.
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

const ROOT = join(import.meta.dirname, '..', '..');
const TSX = pathToFileURL(join(ROOT, 'node_modules', 'tsx', 'dist', 'esm', 'index.mjs')).href;
export const WATCHDOG_MS = 10_000;

export interface FuzzFigures {
  suite: string;
  inputs: number;
  /** An exception that is not the project's own error type (or a CLI 'internal error'). */
  crashes: number;
  /** Inputs the watchdog had to stop. */
  hangs: number;
  /** A result holding NaN, Infinity or null. */
  nonFinite: number;
  /** A message in the validation library's (or the engine's) wording instead of ours. */
  libraryWording: number;
  /** Inputs refused with our own error, and inputs accepted. */
  refused: number;
  accepted: number;
  ms: number;
  /** The first few failures, for the report. */
  examples: string[];
}

/** Runs `count` inputs of `suite` with the watchdog, restarting after a hang; resolves with the figures. */
export async function runSuite(suite: string, count: number, seed: number, watchdogMs = WATCHDOG_MS): Promise<FuzzFigures> {
  const t0 = Date.now();
  const f: FuzzFigures = { suite, inputs: 0, crashes: 0, hangs: 0, nonFinite: 0, libraryWording: 0, refused: 0, accepted: 0, ms: 0, examples: [] };
  let next = 0;
  while (next < count) {
    next = await runChild(suite, seed, next, count, f, watchdogMs);
  }
  f.ms = Date.now() - t0;
  return f;
}

function runChild(suite: string, seed: number, start: number, count: number, f: FuzzFigures, watchdogMs: number): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', TSX, join(import.meta.dirname, 'io-fuzz-runner.ts'), suite, String(seed), String(start), String(count)], {
      cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, FORCE_COLOR: '0' },
    });
    let done = start;
    let buf = '';
    let timer: NodeJS.Timeout;
    let stderr = '';
    const arm = () => { clearTimeout(timer); timer = setTimeout(() => { child.kill('SIGKILL'); }, watchdogMs); };
    // The first line may take a moment more: the child loads the code and builds its inputs.
    timer = setTimeout(() => child.kill('SIGKILL'), 6 * Math.max(watchdogMs, WATCHDOG_MS));
    child.stdout.setEncoding('utf8');
    child.stderr.setEncoding('utf8');
    child.stderr.on('data', (c: string) => { stderr = (stderr + c).slice(-4000); });
    child.stdout.on('data', (c: string) => {
      buf += c;
      let nl: number;
      while ((nl = buf.indexOf('\n')) >= 0) {
        const line = buf.slice(0, nl); buf = buf.slice(nl + 1);
        if (line === 'READY') { arm(); continue; }
        if (!line.startsWith('R\t')) continue;
        arm();
        const [, i, status, detail] = line.split('\t');
        done = Number(i) + 1;
        f.inputs++;
        if (status === 'accepted') f.accepted++;
        else if (status === 'refused') f.refused++;
        else {
          if (status === 'crash') f.crashes++;
          else if (status === 'non-finite') f.nonFinite++;
          else if (status === 'wording') f.libraryWording++;
          if (f.examples.length < 8) f.examples.push(`${suite} #${i} ${status}: ${detail ?? ''}`.slice(0, 400));
        }
      }
    });
    child.on('close', (code) => {
      clearTimeout(timer);
      if (done >= count) { resolve(done); return; }
      // Killed by the watchdog (or died): the input in progress is a hang (or a crash); go on after it.
      f.inputs++;
      if (code === null) { f.hangs++; if (f.examples.length < 8) f.examples.push(`${suite} #${done} hang: stopped after ${watchdogMs / 1000} s`); }
      else { f.crashes++; if (f.examples.length < 8) f.examples.push(`${suite} #${done} crash: the process exited ${code}: ${stderr.slice(-300)}`); }
      resolve(done + 1);
    });
  });
}

/** One line for the log and the README's reliability figures. */
export function formatFigures(f: FuzzFigures): string {
  return `fuzz ${f.suite}: ${f.inputs} inputs (${f.accepted} accepted, ${f.refused} refused with our message), crashes ${f.crashes}, hangs ${f.hangs}, non-finite ${f.nonFinite}, library wording ${f.libraryWording}, ${(f.ms / 1000).toFixed(1)} s`;
}

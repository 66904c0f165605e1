/**
 * Kill test of the app's saving (the project's own rule: kill the process (SIGKILL) at random points during save,
 * data lost = 0). Each round starts a child that saves a large design in a loop with the atomic save and a
 * recovery copy, kills it with SIGKILL at a random moment, cleans stray temporaries as the app does at start, and
 * checks what is on disk:
 *   corrupt — the design, its .bak or the recovery copy is not byte for byte one of the saved versions (each of which
 *             loads with core/design's parser);
 *   lost    — the design is missing, or older than the last save the child had reported as done.
 *   npx tsx scripts/kill-test.ts [--rounds N] [--naive]   (prints the figures; exits 1 on any corrupt or lost)
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { build } from 'esbuild';
import { parseDesign } from '../core/design/index.ts';
import { backupPathOf } from '../electron/files/atomic-write.ts';
import { RecoveryStore } from '../electron/files/recovery-store.ts';
import { cleanStrayTemps, parseTempName } from '../electron/files/temp-files.ts';
import { KILL_TEST_FILE, killTestDesign } from './kill-test-design.ts';

export interface KillFigures {
  mode: 'atomic' | 'naive';
  rounds: number;
  /** Rounds in which the child was killed while at least one save had been reported done. */
  killedAfterSaves: number;
  saves: number;
  corrupt: number;
  lost: number;
  strayTempsCleaned: number;
  strayTempsLeft: number;
  designBytes: number;
  seconds: number;
  problems: string[];
}

export interface RoundState { lastAck: number }

/** The exact text the writer saves as save number `seq` (it sets `notes` last on the same design object). */
export function expectedTextFactory(): (seq: number) => string {
  const doc = killTestDesign();
  doc.notes = 'kill-test save @@SEQ@@';
  const [head, tail] = JSON.stringify(doc).split('@@SEQ@@') as [string, string];
  return (seq) => `${head}${seq}${tail}`;
}

const SEQ_RE = /"notes":"kill-test save (\d+)"/;

export function seqOf(path: string): number | null {
  try {
    const m = SEQ_RE.exec(readFileSync(path, 'utf8'));
    return m ? Number(m[1]) : null;
  } catch { return null; }
}

/**
 * What is wrong with a saved text, or null: it must be byte for byte one of the versions the writer saved (so it
 * also loads, since every version does). On a mismatch, core/design's parser says how it fails to load.
 */
export function textProblem(text: string, expected: (seq: number) => string): string | null {
  const m = SEQ_RE.exec(text);
  if (m && text === expected(Number(m[1]))) return null;
  const r = parseDesign(text);
  return r.ok ? `loads, but is not any version the writer saved (${text.length} characters)` : `does not load: ${r.errors[0]?.expected ?? 'unknown'} (${text.length} characters)`;
}

/** Check the folder after a kill. Returns the problems found (empty when nothing is corrupt or lost). */
export async function checkAfterKill(folder: string, state: RoundState, expected = expectedTextFactory()): Promise<{ corrupt: string[]; lost: string[] }> {
  const corrupt: string[] = [], lost: string[] = [];
  const read = (p: string) => { try { return readFileSync(p, 'utf8'); } catch { return null; } };
  const target = join(folder, KILL_TEST_FILE);
  const design = read(target);
  if (design !== null) {
    const p = textProblem(design, expected);
    if (p) corrupt.push(`design ${p}`);
    else {
      const seq = Number(SEQ_RE.exec(design)![1]);
      if (seq < state.lastAck) lost.push(`design holds save ${seq}, but save ${state.lastAck} had been reported done`);
    }
  } else if (state.lastAck > 0) lost.push('design missing after a save had been reported done');
  const bak = read(backupPathOf(target));
  if (bak !== null) { const p = textProblem(bak, expected); if (p) corrupt.push(`backup ${p}`); }
  if (existsSync(join(folder, 'recovery', 'kill-test-doc.recovery.json'))) {
    const copy = await new RecoveryStore(join(folder, 'recovery'), 'checker').read('kill-test-doc');
    if (!copy) corrupt.push('recovery copy does not read');
    else { const p = textProblem(copy.text, expected); if (p) corrupt.push(`recovery copy ${p}`); }
  }
  return { corrupt, lost };
}

async function bundleWriter(out: string): Promise<string> {
  const file = join(out, 'writer.mjs');
  await build({
    entryPoints: [fileURLToPath(new URL('./kill-test-writer.ts', import.meta.url))], outfile: file, bundle: true, platform: 'node',
    format: 'esm', target: 'node20', logLevel: 'warning',
  });
  return file;
}

export async function runKillTest(o: { rounds?: number; mode?: 'atomic' | 'naive'; maxKillDelayMs?: number; random?: () => number } = {}): Promise<KillFigures> {
  const rounds = o.rounds ?? 100, mode = o.mode ?? 'atomic', random = o.random ?? Math.random;
  const started = Date.now();
  const work = mkdtempSync(join(tmpdir(), 'sw-kill-'));
  const folder = join(work, 'designs');
  const f: KillFigures = { mode, rounds, killedAfterSaves: 0, saves: 0, corrupt: 0, lost: 0, strayTempsCleaned: 0, strayTempsLeft: 0, designBytes: 0, seconds: 0, problems: [] };
  try {
    const writer = await bundleWriter(work);
    const expected = expectedTextFactory();
    // Every version the writer saves is this design with another note; check once that it loads at all.
    const first = parseDesign(expected(1));
    if (!first.ok) throw new Error(`the kill-test design does not load: ${first.errors[0]?.expected}`);
    const state: RoundState = { lastAck: 0 };
    let nextSeq = 1;
    for (let round = 1; round <= rounds; round++) {
      let savesThisRound = 0;
      await new Promise<void>((resolve, reject) => {
        const child = spawn(process.execPath, [writer, folder, String(nextSeq), mode], { stdio: ['ignore', 'pipe', 'inherit'] });
        let buf = '';
        let timer: NodeJS.Timeout | null = null;
        child.stdout.on('data', (d: Buffer) => {
          buf += d.toString();
          let nl: number;
          while ((nl = buf.indexOf('\n')) >= 0) {
            const line = buf.slice(0, nl); buf = buf.slice(nl + 1);
            const m = /^saved (\d+)$/.exec(line);
            if (m) { state.lastAck = Math.max(state.lastAck, Number(m[1])); savesThisRound++; }
            // Kill at a random moment once the child is saving: anywhere within the next few saves.
            if (line === 'ready') timer = setTimeout(() => child.kill('SIGKILL'), random() * (o.maxKillDelayMs ?? 250));
          }
        });
        child.on('error', reject);
        child.on('exit', (code, signal) => {
          if (timer) clearTimeout(timer);
          if (signal !== 'SIGKILL') reject(new Error(`the writer exited by itself (code ${code}); it should only stop when killed`));
          else resolve();
        });
      });
      f.saves += savesThisRound;
      if (savesThisRound > 0) f.killedAfterSaves++;
      // What the app does at its next start: remove the temporaries the killed process left.
      f.strayTempsCleaned += (await cleanStrayTemps(folder)).length + (await cleanStrayTemps(join(folder, 'recovery'))).length;
      f.strayTempsLeft = [...readdirSync(folder), ...readdirSync(join(folder, 'recovery'))].filter((n) => parseTempName(n)).length;
      const { corrupt, lost } = await checkAfterKill(folder, state, expected);
      if (corrupt.length) { f.corrupt++; f.problems.push(`round ${round}: ${corrupt.join('; ')}`); }
      if (lost.length) { f.lost++; f.problems.push(`round ${round}: ${lost.join('; ')}`); }
      nextSeq = Math.max(state.lastAck, seqOf(join(folder, KILL_TEST_FILE)) ?? 0) + 1;
    }
    const target = join(folder, KILL_TEST_FILE);
    f.designBytes = existsSync(target) ? readFileSync(target).length : 0;
  } finally {
    rmSync(work, { recursive: true, force: true });
    f.seconds = (Date.now() - started) / 1000;
  }
  return f;
}

export function formatFigures(f: KillFigures): string {
  return [
    `kill test (${f.mode} save): ${f.rounds} rounds, SIGKILL at a random moment, ${f.killedAfterSaves} kills after at least one completed save`,
    `  saves completed ${f.saves}, design size ${(f.designBytes / 1024 / 1024).toFixed(2)} MiB`,
    `  corrupt ${f.corrupt}, lost ${f.lost}, stray temp files cleaned ${f.strayTempsCleaned}, left after clean-up ${f.strayTempsLeft}`,
    `  time ${f.seconds.toFixed(1)} s`,
    ...f.problems.slice(0, 10).map((p) => `  ${p}`),
  ].join('\n');
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const { values } = parseArgs({ options: { rounds: { type: 'string', default: '100' }, naive: { type: 'boolean', default: false } }, strict: true });
  const rounds = Number(values.rounds);
  if (!Number.isInteger(rounds) || rounds < 1) { console.error(`--rounds: expected a whole number ≥ 1, got ${values.rounds}`); process.exit(2); }
  const f = await runKillTest({ rounds, mode: values.naive ? 'naive' : 'atomic' });
  console.log(formatFigures(f));
  process.exit(f.corrupt === 0 && f.lost === 0 ? 0 : 1);
}

/**
 * `npm run bench -- blocks-matrix`: the whole matrix of what the branched blocks can make (test/blocks-matrix/matrix.ts:
 * kinds × boards × frequencies × processes), one line per case: made (with its worst misses against the textbook
 * figures), refused (with the words the user sees) or FAIL, and the time each took. The vitest file
 * test/unit/blocks-makeable.test.ts checks a representative subset; this prints everything (about half an hour on one
 * core). Filters: BLOCKS_MATRIX=text keeps the cases whose line contains the text (e.g. "corporate 4 wilkinson").
 */
import { initPolygons } from '../core/index.ts';
import { BOARDS, FREQUENCIES, PROCESSES, SPECS, runCase } from '../test/blocks-matrix/matrix.ts';
import { timed } from './timing.ts';

export async function run(): Promise<void> {
  await initPolygons();
  const only = process.env.BLOCKS_MATRIX;
  const counts = { made: 0, refused: 0, FAIL: 0 };
  for (const spec of SPECS) for (const board of BOARDS) for (const f0 of FREQUENCIES) for (const proc of PROCESSES) {
    const name = `${spec.label} | ${board.label} | ${+(f0 / 1e9).toFixed(2)} GHz | ${proc.label}`;
    if (only && !name.includes(only)) continue;
    let r!: ReturnType<typeof runCase>;
    const ms = timed(() => { r = runCase(spec, board, f0, proc); }).cpu;
    counts[r.verdict]++;
    const w = r.worst ? ` [level ${r.worst.levelDb.toFixed(3)} dB, phase ${r.worst.phaseDeg.toFixed(2)}°, match/iso ${r.worst.matchDb.toFixed(1)} dB, lossy ${r.worst.lossyDb.toFixed(3)} dB]` : '';
    console.log(`${r.verdict.padEnd(7)} ${name} (${(ms / 1e3).toFixed(1)} s)${w}${r.verdict === 'made' ? '' : `: ${r.detail}`}`);
  }
  console.log(`\n${counts.made} made, ${counts.refused} refused, ${counts.FAIL} failing`);
}

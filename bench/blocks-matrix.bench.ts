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
  /** Per spec, per board and frequency: one letter per process (E etched, M end mill, V V-bit; lower case refused, ! failing). */
  const grid = new Map<string, Map<string, string>>();
  const letter = { etch: 'e', 'end-mill': 'm', 'v-bit': 'v' } as Record<string, string>;
  for (const spec of SPECS) for (const board of BOARDS) for (const f0 of FREQUENCIES) for (const proc of PROCESSES) {
    const name = `${spec.label} | ${board.label} | ${+(f0 / 1e9).toFixed(2)} GHz | ${proc.label}`;
    if (only && !name.includes(only)) continue;
    let r!: ReturnType<typeof runCase>;
    const ms = timed(() => { r = runCase(spec, board, f0, proc); }).cpu;
    counts[r.verdict]++;
    const col = `${board.label} ${+(f0 / 1e9).toFixed(2)}`;
    const row = grid.get(spec.label) ?? new Map<string, string>();
    grid.set(spec.label, row);
    const l = letter[proc.id] ?? '?';
    row.set(col, (row.get(col) ?? '') + (r.verdict === 'made' ? l.toUpperCase() : r.verdict === 'refused' ? l : '!'));
    const w = r.worst ? ` [level ${r.worst.levelDb.toFixed(3)} dB, phase ${r.worst.phaseDeg.toFixed(2)}°, match/iso ${r.worst.matchDb.toFixed(1)} dB, lossy ${r.worst.lossyDb.toFixed(3)} dB]` : '';
    console.log(`${r.verdict.padEnd(7)} ${name} (${(ms / 1e3).toFixed(1)} s)${w}${r.verdict === 'made' ? '' : `: ${r.detail}`}`);
  }
  console.log(`\n${counts.made} made, ${counts.refused} refused, ${counts.FAIL} failing`);
  // What can be made, at a glance: upper case made, lower case refused (naming the nearest spec), ! failing.
  const cols = BOARDS.flatMap((b) => FREQUENCIES.map((f) => `${b.label} ${+(f / 1e9).toFixed(2)}`));
  console.log(`\nmade (E etched, M end mill, V V-bit; lower case: refused; !: failing)\n${'spec'.padEnd(32)}${cols.map((c) => c.padStart(22)).join('')}`);
  for (const [spec, row] of grid) console.log(`${spec.padEnd(32)}${cols.map((c) => (row.get(c) ?? '').padStart(22)).join('')}`);
}

/**
 * Prints the done figures of the single-path blocks over the whole matrix of boards, frequencies and processes
 * (test/unit/blocks-figures.ts; the unit test runs a representative subset). `npx tsx scripts/blocks-matrix.ts
 * [kind…]`; exits 1 when a case misses its figures or refuses without naming a nearer spec.
 */
import { initPolygons } from '../core/index.ts';
import { BOARDS, CASES, FREQS, PROCESSES, judge } from '../test/unit/blocks-figures.ts';

await initPolygons();
const only = process.argv.slice(2);
let bad = 0;
for (const c of CASES.filter((x) => !only.length || only.includes(x.kind))) {
  for (const b of BOARDS) for (const f of FREQS) for (const p of PROCESSES) {
    const t0 = performance.now();
    const v = judge(c, b, f, p);
    if (v.status === 'fails') bad++;
    process.stdout.write(`${v.status.padEnd(7)} ${c.name.padEnd(24)} ${b.name.padEnd(17)} ${(f / 1e9).toFixed(2).padStart(5)} GHz ${p.name.padEnd(6)} ${(performance.now() - t0).toFixed(0).padStart(6)} ms  ${v.status === 'fails' ? v.misses.join('; ') + ' | ' : ''}${v.text}\n`);
  }
}
process.stdout.write(`${bad} case(s) miss their figures\n`);
process.exit(bad ? 1 : 0);

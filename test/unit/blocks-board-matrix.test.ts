/**
 * SLOW (about 10–20 s of CPU here): the single-path blocks' done figures beyond the default board, on boards,
 * frequencies and processes a user would try (test/unit/blocks-figures.ts names the figures and their textbook
 * sources): 3 boards × 3 frequencies × 2 processes for each case. Every case either meets the blocks issue's figures
 * or is refused with the field at fault and a nearer spec named; a nearer spec named in numbers is made and must
 * meet the figures itself. `npx tsx scripts/blocks-matrix.ts` prints the same matrix.
 */
import { describe, expect, it } from 'vitest';
import { BOARDS, CASES, FREQS, PROCESSES, judge } from './blocks-figures.ts';
import { InputError, initPolygons, makeBlockDesign } from '../../core/index.ts';

await initPolygons();

const COMBOS = BOARDS.flatMap((_, b) => FREQS.flatMap((_, f) => PROCESSES.map((_, p) => [b, f, p] as const)));

describe('single-path blocks on boards, frequencies and processes a user would try', () => {
  CASES.forEach((c) => {
    it(c.name, () => {
      const seen: string[] = [];
      for (const [b, f, p] of COMBOS) {
        const v = judge(c, BOARDS[b]!, FREQS[f]!, PROCESSES[p]!);
        seen.push(`${BOARDS[b]!.name} ${FREQS[f]! / 1e9} GHz ${PROCESSES[p]!.name}: ${v.status} ${v.misses.join('; ')} ${v.text}`);
        expect(v.status, seen.join('\n')).not.toBe('fails');
      }
    }, 120_000);
  });

  it('a launch refused on a thin laminate names a pad that is made and meets −25 dB (Pozar §5.5: a shorter pad reflects less)', () => {
    // The pin (1.27 mm) is wider than the 50 Ω line on 0.508 mm εr 3.55, so the default pad is a 3 mm low-impedance
    // section: at 5.8 GHz it misses −25 dB and the refusal names the longest pad that meets it.
    const base = { f0: 5.8e9, substrate: BOARDS[2]!.substrate as never, process: PROCESSES[0]!.process };
    let err: unknown;
    try { makeBlockDesign('launch', {}, base); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('launch.padLength');
    const len = /a pad at most ([\d.]+) mm long/.exec((err as InputError).hint ?? '')?.[1];
    expect(len, (err as InputError).hint).toBeDefined();
    const v = judge({ name: 'named', kind: 'launch', raw: { padLength: `${len} mm` } }, BOARDS[2]!, 5.8e9, PROCESSES[0]!);
    expect(v.status, v.text).toBe('meets');
  });
});

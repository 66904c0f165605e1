/**
 * Fuzz: a sample of CLI commands in-process (sweep on generated Touchstone files, line with odd flags and batch tables, build/sweep/export on damaged design bytes, random command lines).
 * 800 inputs from a fixed seed (fast-check), run in a child process under a 10 s watchdog (io-watchdog.ts). Fails on
 * any crash, any input the watchdog had to stop, a non-finite (or null) result, or a message not in our own words.
 * The figures are printed and written to reports/fuzz-cli.json for the README's reliability section.
 */
import { describe, expect, it } from 'vitest';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatFigures, runSuite } from './io-watchdog.ts';

describe('fuzz: cli', () => {
  it('800 bad inputs: no crash, no hang, nothing non-finite, our own words', async () => {
    const f = await runSuite('cli', 800, 1322);
    console.log(formatFigures(f));
    mkdirSync(join(import.meta.dirname, '..', '..', 'reports'), { recursive: true });
    writeFileSync(join(import.meta.dirname, '..', '..', 'reports', 'fuzz-cli.json'), JSON.stringify(f, null, 2));
    expect(f.inputs).toBe(800);
    expect(f.examples).toEqual([]);
    expect({ crashes: f.crashes, hangs: f.hangs, nonFinite: f.nonFinite, libraryWording: f.libraryWording }).toEqual({ crashes: 0, hangs: 0, nonFinite: 0, libraryWording: 0 });
    expect(f.refused).toBeGreaterThan(800 / 4); // the inputs really are bad: most are refused
  }, 300_000);
});

/**
 * Fuzz: the Touchstone reader (generated files and damaged real ones), each result read on as a part's admittance and figures.
 * 3000 inputs from a fixed seed (fast-check), run in a child process under a 10 s watchdog (io-watchdog.ts). Fails on
 * any crash, any input the watchdog had to stop, a non-finite (or null) result, or a message not in our own words.
 * The figures are printed and written to reports/fuzz-touchstone.json for the README's reliability section.
 */
import { describe, expect, it } from 'vitest';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatFigures, runSuite } from './io-watchdog.ts';

describe('fuzz: touchstone', () => {
  it('3000 bad inputs: no crash, no hang, nothing non-finite, our own words', async () => {
    const f = await runSuite('touchstone', 3000, 20261205);
    console.log(formatFigures(f));
    mkdirSync(join(import.meta.dirname, '..', '..', 'reports'), { recursive: true });
    writeFileSync(join(import.meta.dirname, '..', '..', 'reports', 'fuzz-touchstone.json'), JSON.stringify(f, null, 2));
    expect(f.inputs).toBe(3000);
    expect(f.examples).toEqual([]);
    expect({ crashes: f.crashes, hangs: f.hangs, nonFinite: f.nonFinite, libraryWording: f.libraryWording }).toEqual({ crashes: 0, hangs: 0, nonFinite: 0, libraryWording: 0 });
    expect(f.refused).toBeGreaterThan(3000 / 4); // the inputs really are bad: most are refused
  }, 300_000);
});

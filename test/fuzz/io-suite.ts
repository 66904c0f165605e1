/**
 * The one shape every child-process fuzz suite (bridge, cli, touchstone) asserts: run `count` inputs from a fixed
 * seed under the watchdog, print and keep the figures for the README's reliability section, and fail on any crash,
 * hang, non-finite (or null) result or message not in our own words. Kept here so the suites differ only in what
 * they feed, not in what they demand.
 */
import { expect, it } from 'vitest';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatFigures, runSuite } from './io-watchdog.ts';

export function ioFuzzSuite(suite: string, count: number, seed: number): void {
  it(`${count} bad inputs: no crash, no hang, nothing non-finite, our own words`, async () => {
    const f = await runSuite(suite, count, seed);
    console.log(formatFigures(f));
    const reports = join(import.meta.dirname, '..', '..', 'reports');
    mkdirSync(reports, { recursive: true });
    writeFileSync(join(reports, `fuzz-${suite}.json`), JSON.stringify(f, null, 2));
    expect(f.inputs).toBe(count);
    expect(f.examples).toEqual([]);
    expect({ crashes: f.crashes, hangs: f.hangs, nonFinite: f.nonFinite, libraryWording: f.libraryWording }).toEqual({ crashes: 0, hangs: 0, nonFinite: 0, libraryWording: 0 });
    expect(f.refused).toBeGreaterThan(count / 4); // the inputs really are bad: most are refused
  }, 300_000);
}

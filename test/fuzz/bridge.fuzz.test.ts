/**
 * Fuzz: the bridge: every channel's sender and argument checks through registerBridge, with a real Shell in a temporary folder.
 * 2500 inputs from a fixed seed (fast-check), run in a child process under a 10 s watchdog (io-watchdog.ts). Fails on
 * any crash, any input the watchdog had to stop, a non-finite (or null) result, or a message not in our own words.
 * The figures are printed and written to reports/fuzz-bridge.json for the README's reliability section.
 */
import { describe, expect, it } from 'vitest';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { formatFigures, runSuite } from './io-watchdog.ts';

describe('fuzz: bridge', () => {
  it('2500 bad inputs: no crash, no hang, nothing non-finite, our own words', async () => {
    const f = await runSuite('bridge', 2500, 22022);
    console.log(formatFigures(f));
    mkdirSync(join(import.meta.dirname, '..', '..', 'reports'), { recursive: true });
    writeFileSync(join(import.meta.dirname, '..', '..', 'reports', 'fuzz-bridge.json'), JSON.stringify(f, null, 2));
    expect(f.inputs).toBe(2500);
    expect(f.examples).toEqual([]);
    expect({ crashes: f.crashes, hangs: f.hangs, nonFinite: f.nonFinite, libraryWording: f.libraryWording }).toEqual({ crashes: 0, hangs: 0, nonFinite: 0, libraryWording: 0 });
    expect(f.refused).toBeGreaterThan(2500 / 4); // the inputs really are bad: most are refused
  }, 300_000);
  it('the watchdog itself: a runaway input is stopped and counted as a hang, a dead process as a crash, and the run goes on', async () => {
    const f = await runSuite('watchdog-self-test', 5, 0, 2_000);
    expect({ inputs: f.inputs, accepted: f.accepted, hangs: f.hangs, crashes: f.crashes }).toEqual({ inputs: 5, accepted: 3, hangs: 1, crashes: 1 });
  }, 120_000);
});

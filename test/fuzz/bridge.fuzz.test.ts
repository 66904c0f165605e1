/**
 * Fuzz: the bridge: every channel's sender and argument checks through registerBridge, with a real Shell in a temporary folder.
 * 2500 inputs from a fixed seed (fast-check), run in a child process under a 10 s watchdog (io-watchdog.ts). Fails on
 * any crash, any input the watchdog had to stop, a non-finite (or null) result, or a message not in our own words.
 * The figures are printed and written to reports/fuzz-bridge.json for the README's reliability section.
 */
import { describe, expect, it } from 'vitest';
import { runSuite } from './io-watchdog.ts';
import { ioFuzzSuite } from './io-suite.ts';

describe('fuzz: bridge', () => {
  ioFuzzSuite('bridge', 2500, 22022);
  it('the watchdog itself: a runaway input is stopped and counted as a hang, a dead process as a crash, and the run goes on', async () => {
    const f = await runSuite('watchdog-self-test', 5, 0, 2_000);
    expect({ inputs: f.inputs, accepted: f.accepted, hangs: f.hangs, crashes: f.crashes }).toEqual({ inputs: 5, accepted: 3, hangs: 1, crashes: 1 });
  }, 120_000);
});

/**
 * Fuzz: bad design files through the design loader (issue 22: crash, hang, non-finite output, library wording).
 * Inputs from core-inputs.ts (text edits, random values, every field missing or wrong in turn, arbitrary JSON,
 * format-1 files), each under a 10 s watchdog in a worker thread. Every refusal must read as field, expected,
 * found, fix. The figures are printed for the README's reliability section.
 */
import { describe, expect, it } from 'vitest';
import { loaderCases } from './core-inputs.ts';
import { runCases, summary } from './core-watchdog.ts';

const INPUTS = 4400;

describe('design loader fuzz', () => {
  it(`${INPUTS} bad design files: no crash, no hang, no non-finite output, every refusal in our words`, async () => {
    const t = await runCases(loaderCases(INPUTS));
    console.log(summary('loader', t));
    expect(t.inputs).toBe(INPUTS);
    expect(t.crashes).toEqual([]);
    expect(t.hangs).toEqual([]);
    expect(t.nonFinite).toEqual([]);
    expect(t.wording).toEqual([]);
    // The inputs reach every outcome: most are refused, some still load (a bad value in a field that allows it).
    expect(t.stages.refused ?? 0).toBeGreaterThan(INPUTS / 2);
    expect(t.stages.loaded ?? 0).toBeGreaterThan(0);
  }, 600_000);
});

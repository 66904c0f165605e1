/**
 * Fuzz: generated designs through the whole pipeline as the CLI and the app run it — load → size → paths →
 * fabrication checks → build report → every export (DXF, DXF R12, SVG, Gerber, Excellon, mask; etch bias or
 * isolation outlines for the design's process) → a sweep of three points. Each case under a 10 s watchdog in a
 * worker thread; a crash is any exception that is not an InputError.
 */
import { describe, expect, it } from 'vitest';
import { pipelineCases } from './core-inputs.ts';
import { runCases, summary } from './core-watchdog.ts';

const INPUTS = 800;

describe('pipeline fuzz', () => {
  it(`${INPUTS} generated designs: no crash, no hang, no non-finite output, no library wording`, async () => {
    const t = await runCases(pipelineCases(INPUTS));
    console.log(summary('pipeline', t));
    expect(t.inputs).toBe(INPUTS);
    expect(t.crashes).toEqual([]);
    expect(t.hangs).toEqual([]);
    expect(t.nonFinite).toEqual([]);
    expect(t.wording).toEqual([]);
    // The inputs reach every part: some are refused at load, some by sizing, many go all the way through a sweep.
    expect(t.stages.done ?? 0).toBeGreaterThan(INPUTS / 4);
    expect(t.stages.refused ?? 0).toBeGreaterThan(0);
  }, 600_000);
});

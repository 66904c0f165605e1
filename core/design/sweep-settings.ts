/**
 * A design's own sweep settings (format 9): the frequencies the app and `stripwright sweep` compute its response at.
 * Absent means the design band, widened to include f0, at 201 linear points (what every face did before).
 * SI units: Hz. The schema lives here too so the format change stays in one place.
 */
import * as v from 'valibot';
import type { Out } from './infer.ts';

/** The most points a design may ask for (the network sweep's own limit). */
export const SWEEP_MAX_POINTS = 100_001;

/** `start` and `stop` in Hz (1 MHz … 300 GHz, stop above start), `points` 2 … 100 001, `spacing` linear or log. */
export type SweepSpec = Out<typeof sweepSpecSchema>;

const FREQ = 'a frequency in hertz from 1 MHz to 300 GHz (2.45 GHz is 2450000000)';
const freq = v.pipe(v.number(FREQ), v.finite(FREQ), v.minValue(1e6, FREQ), v.maxValue(300e9, FREQ));
const POINTS = `a whole number of points from 2 to ${SWEEP_MAX_POINTS}`;

export const sweepSpecSchema = v.pipe(
  v.looseObject({
    start: freq,
    stop: freq,
    points: v.pipe(v.number(POINTS), v.integer(POINTS), v.minValue(2, POINTS), v.maxValue(SWEEP_MAX_POINTS, POINTS)),
    spacing: v.picklist(['linear', 'log'], 'a spacing "linear" or "log"'),
  }, 'sweep settings {start, stop, points, spacing}'),
  v.check((s) => s.stop > s.start, 'sweep settings whose stop frequency is above the start'),
);

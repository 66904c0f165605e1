/**
 * The sweep a design asks for: its own settings (format 9, `doc.sweep`) or, without them, the band widened to include
 * f0 at 201 linear points. The one answer for every face (the app's response panel and `stripwright sweep`), so the
 * two compute the same frequencies.
 */
import type { DesignDoc } from '../design/types.ts';
import { bandSweep, type SweepSettings } from './sweep.ts';

/** Points of the default sweep (a design without its own settings). */
export const DEFAULT_SWEEP_POINTS = 201;

export function designSweepSettings(doc: Pick<DesignDoc, 'frequency' | 'sweep'>): SweepSettings {
  const s = doc.sweep;
  if (s) return { start: s.start, stop: s.stop, points: s.points, log: s.spacing === 'log' };
  return { ...bandSweep(doc.frequency.band, doc.frequency.f0, DEFAULT_SWEEP_POINTS), log: false };
}

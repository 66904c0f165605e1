/**
 * A design's own sweep settings (format 9): the schema, the migration from 8, the `design.setSweep` command with
 * undo, and the one function every face asks for its frequencies. The default sweep is the project's own rule (the
 * band widened to f0, 201 linear points, as every face did before format 9).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, serializeDesign, runCommand, History, DESIGN_VERSION } from '../../core/design/index.ts';
import { designSweepSettings, sweepFrequencies, bandSweep, responseCacheKey } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const v8 = readFileSync(join(ROOT, 'test', 'fixtures', 'design', 'v8', 'open-stub-no-sweep.json'), 'utf8');
const wilk = () => { const r = parseDesign(readFileSync(join(ROOT, 'assets', 'examples', 'wilkinson-2g45.json'), 'utf8')); if (!r.ok) throw new Error('example'); return r.doc; };

describe('sweep settings in the design file', () => {
  it('a version 8 file (before sweep settings) opens without settings and is swept over its band widened to f0 at 201 points', () => {
    const r = parseDesign(v8);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.doc.version).toBe(DESIGN_VERSION);
    expect(r.doc.sweep).toBeUndefined();
    const s = designSweepSettings(r.doc);
    expect(s).toEqual({ ...bandSweep(r.doc.frequency.band, r.doc.frequency.f0, 201), log: false });
  });

  it('settings round-trip through save and load and give the frequencies asked for', () => {
    const doc = runCommand(wilk(), 'design.setSweep', { sweep: { start: 1e9, stop: 4e9, points: 7, spacing: 'log' } });
    const back = parseDesign(serializeDesign(doc));
    expect(back.ok).toBe(true);
    if (!back.ok) return;
    expect(back.doc.sweep).toEqual({ start: 1e9, stop: 4e9, points: 7, spacing: 'log' });
    const f = sweepFrequencies(designSweepSettings(back.doc));
    expect(f.length).toBe(7);
    // Logarithmic spacing: equal ratios between neighbours, (4e9/1e9)^(1/6).
    for (let k = 1; k < 7; k++) expect(f[k]! / f[k - 1]!).toBeCloseTo(4 ** (1 / 6), 12);
  });

  it('refuses settings the loader would refuse, naming the field', () => {
    const bad = [
      { start: 3e9, stop: 2e9, points: 11, spacing: 'linear' },
      { start: 1e9, stop: 2e9, points: 1, spacing: 'linear' },
      { start: 1e9, stop: 2e9, points: 200_000, spacing: 'linear' },
      { start: 1e9, stop: 2e9, points: 11, spacing: 'octave' },
      { start: 0, stop: 2e9, points: 11, spacing: 'linear' },
    ];
    for (const sweep of bad) {
      expect(() => runCommand(wilk(), 'design.setSweep', { sweep }), JSON.stringify(sweep)).toThrow(InputError);
      const text = serializeDesign({ ...wilk(), sweep } as never);
      const r = parseDesign(text);
      expect(r.ok, JSON.stringify(sweep)).toBe(false);
      if (!r.ok) expect(r.errors[0]!.path).toMatch(/^sweep/);
    }
  });

  it('setting and clearing are undoable steps', () => {
    const h = new History(wilk());
    h.apply('design.setSweep', { sweep: { start: 2e9, stop: 3e9, points: 401, spacing: 'linear' } });
    h.mark();
    expect(h.doc.sweep?.points).toBe(401);
    h.apply('design.setSweep', { sweep: null });
    h.mark();
    expect(h.doc.sweep).toBeUndefined();
    h.undo();
    expect(h.doc.sweep?.points).toBe(401);
    h.undo();
    expect(h.doc.sweep).toBeUndefined();
  });

  it('the response cache key follows the settings, not where they are kept', () => {
    const doc = wilk();
    const s = designSweepSettings(doc);
    const withOwn = { ...doc, sweep: { start: s.start, stop: s.stop, points: s.points, spacing: 'linear' as const } };
    expect(responseCacheKey(withOwn, designSweepSettings(withOwn))).toBe(responseCacheKey(doc, s));
    expect(responseCacheKey(doc, { ...s, points: 401 })).not.toBe(responseCacheKey(doc, s));
  });
});

/**
 * Sweeps: the frequency grid, progress, cancellation and the cache (behaviour of our own API; no outside source
 * needed beyond arithmetic).
 */
import { describe, expect, it } from 'vitest';
import { sweepFrequencies, sweepNetwork, solveNetwork, SweepCache, designHash, bandSweep, idealLine, type Netlist } from '../../core/network/index.ts';
import { InputError } from '../../core/util/errors.ts';

const net: Netlist = { elements: [{ kind: 'line', id: 'l', a: 'a', b: 'b', length: 0.03, model: idealLine(60, 2.5) }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] };

describe('frequency grid', () => {
  it('linear and logarithmic spacing hit both ends exactly', () => {
    const lin = sweepFrequencies({ start: 1e9, stop: 3e9, points: 5 });
    expect(Array.from(lin)).toEqual([1e9, 1.5e9, 2e9, 2.5e9, 3e9]);
    const log = sweepFrequencies({ start: 1e6, stop: 1e9, points: 4, log: true });
    expect(log[0]).toBe(1e6); expect(log[3]).toBe(1e9);
    expect(log[1]).toBeCloseTo(1e7, 1); expect(log[2]).toBeCloseTo(1e8, 0);
  });
  it('bad settings name the field', () => {
    const field = (s: Parameters<typeof sweepFrequencies>[0]) => { try { sweepFrequencies(s); } catch (e) { return (e as InputError).field; } return 'none'; };
    expect(field({ start: 0, stop: 1e9, points: 3 })).toBe('sweep.start');
    expect(field({ start: 2e9, stop: 1e9, points: 3 })).toBe('sweep.stop');
    expect(field({ start: 1e9, stop: 2e9, points: 2.5 })).toBe('sweep.points');
  });
  it('the band sweep includes f0', () => {
    expect(bandSweep({ start: 2e9, stop: 3e9 }, 1.5e9)).toEqual({ start: 1.5e9, stop: 3e9, points: 201 });
  });
});

describe('chunked sweep', () => {
  it('gives the same numbers as the one-shot solve and reports progress per chunk', async () => {
    const seen: number[] = [];
    const r = await sweepNetwork(net, { start: 1e9, stop: 5e9, points: 250 }, { chunk: 100, onProgress: (d, t) => { seen.push(d / t); } });
    expect(seen).toEqual([0.4, 0.8, 1]);
    const one = solveNetwork(net, r.freqs);
    expect(Array.from(r.s)).toEqual(Array.from(one.s));
  });
  it('stops when the signal is aborted, between chunks', async () => {
    const ctl = new AbortController();
    let chunks = 0;
    const p = sweepNetwork(net, { start: 1e9, stop: 5e9, points: 1000 }, { chunk: 10, signal: ctl.signal, onProgress: () => { if (++chunks === 3) ctl.abort(); } });
    await expect(p).rejects.toMatchObject({ name: 'AbortError' });
    expect(chunks).toBe(3);
  });
});

describe('cache', () => {
  it('returns the stored response for the same design and settings, and computes again after an edit', async () => {
    const cache = new SweepCache(2);
    const settings = { start: 1e9, stop: 2e9, points: 11 };
    let computed = 0;
    const compute = async () => { computed++; return solveNetwork(net, sweepFrequencies(settings)); };
    const doc = { name: 'feed', segments: [{ id: 's1', z0: 50 }] };
    const a = await cache.getOrSweep(SweepCache.key(designHash(doc), settings), compute);
    const b = await cache.getOrSweep(SweepCache.key(designHash({ segments: [{ z0: 50, id: 's1' }], name: 'feed' }), settings), compute);
    expect(b).toBe(a);
    expect(computed).toBe(1);
    await cache.getOrSweep(SweepCache.key(designHash({ ...doc, segments: [{ id: 's1', z0: 51 }] }), settings), compute);
    expect(computed).toBe(2);
    await cache.getOrSweep(SweepCache.key(designHash(doc), { ...settings, log: true }), compute);
    expect(computed).toBe(3);
    expect(cache.size).toBe(2);
  });
});

describe('cache, concurrent and failed sweeps', () => {
  it('two requests for the same key while it runs share one sweep; a failure stores nothing', async () => {
    const cache = new SweepCache();
    let computed = 0;
    const compute = async () => { computed++; await Promise.resolve(); return solveNetwork(net, [1e9]); };
    const [a, b] = await Promise.all([cache.getOrSweep('k', compute), cache.getOrSweep('k', compute)]);
    expect(a).toBe(b);
    expect(computed).toBe(1);
    await expect(cache.getOrSweep('bad', async () => { throw new Error('cancelled'); })).rejects.toThrow('cancelled');
    expect(cache.get('bad')).toBeUndefined();
  });
});

describe('responseCacheKey', () => {
  it('ignores name, notes and view; follows the physics, the sweep and the solver options', async () => {
    const { newDesign } = await import('../../core/design/index.ts');
    const { responseCacheKey } = await import('../../core/network/index.ts');
    const doc = newDesign({ name: 'a' });
    const s = { start: 1e9, stop: 2e9, points: 11 };
    const k = responseCacheKey(doc, s);
    expect(responseCacheKey({ ...doc, name: 'b', notes: 'x', view: { grid: 2.54e-4 } }, s)).toBe(k);
    expect(responseCacheKey({ ...doc, substrate: { ...doc.substrate, er: doc.substrate.er + 0.01 } }, s)).not.toBe(k);
    expect(responseCacheKey(doc, { ...s, points: 12 })).not.toBe(k);
    expect(responseCacheKey(doc, s, { line: { dispersion: 'hammerstad-jensen' } })).not.toBe(k);
    expect(responseCacheKey({ ...doc, junctions: 'ideal' }, s)).not.toBe(k);
  });
});

/**
 * Coupler and band-pass blocks (core/blocks) built, sized and swept as a user would, with losses and as a lossless
 * copy. Outside checks, each named: prototype element values against the published tables (Matthaei, Young and
 * Jones 1964, Tables 4.05-1 and 4.05-2(a); the same in Pozar, Microwave Engineering, 4th ed., Tables 8.3 and 8.4;
 * quoted from memory to 4 digits); the coupler's coupling against its spec (Pozar §7.6); the filter's centre and
 * bandwidth against its spec — the −3 dB band relative to peak transmission for maximally flat, the ripple band for
 * equal ripple, and for a lossy equal-ripple filter the −3 dB band of the Chebyshev response, Δ·cosh(arccosh(1/ε)/N)
 * with ε = √(10^(ripple/10) − 1) (Matthaei et al. §4.03).
 */
import { describe, expect, it } from 'vitest';
import {
  prototypeValues, couplerBlock, bandpassBlock, sizeDesign, netlistFromSized, solveNetwork, magnitudeDb, portIndex, validateDesign,
  InputError, type SubstrateSpec,
} from '../../core/index.ts';

const LOW_LOSS: SubstrateSpec = { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 };
const FR4: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const FINE = { kind: 'etch', edgeBias: 0, minFeature: 0.02e-3 } as const;

describe('low-pass prototype values from the closed forms', () => {
  it('maximally flat N = 5: 0.6180, 1.6180, 2.0000, 1.6180, 0.6180, 1 (MYJ Table 4.05-1)', () => {
    const g = prototypeValues('maximally-flat', 5);
    [1, 0.618, 1.618, 2.0, 1.618, 0.618, 1].forEach((x, i) => expect(g[i]).toBeCloseTo(x, 3));
  });
  it('0.5 dB equal ripple N = 3: 1.5963, 1.0967, 1.5963, 1.0000; N = 4 ends in 1.9841 (MYJ Table 4.05-2(a))', () => {
    const g = prototypeValues('equal-ripple', 3, 0.5);
    [1, 1.5963, 1.0967, 1.5963, 1].forEach((x, i) => expect(g[i]).toBeCloseTo(x, 3));
    expect(prototypeValues('equal-ripple', 4, 0.5)[5]).toBeCloseTo(1.9841, 3);
  });
});

function sweep(doc: ReturnType<typeof couplerBlock>, freqs: number[], lossless = false) {
  const sized = sizeDesign(doc);
  expect(sized.problems).toEqual([]);
  return solveNetwork(netlistFromSized(sized, { lossless }), freqs);
}

describe('coupler block', () => {
  for (const [sub, name] of [[LOW_LOSS, 'low-loss 0.508 mm'], [FR4, 'glass-epoxy 1.6 mm']] as const) {
    for (const db of [10, 15, 20]) {
      it(`${db} dB at 2.45 GHz on ${name}: coupling at f0 within 0.3 dB of spec, directivity reported`, () => {
        const doc = couplerBlock({ couplingDb: db, f0: 2.45e9, substrate: sub, process: FINE });
        expect(validateDesign(doc, { complete: true }).ok).toBe(true);
        const r = sweep(doc, [2.45e9]);
        const p = (n: string) => portIndex(r, n);
        const coupling = -magnitudeDb(r, p('coupled'), p('in'))[0]!;
        const isolation = -magnitudeDb(r, p('isolated'), p('in'))[0]!;
        const directivity = isolation - coupling;
        expect(Math.abs(coupling - db)).toBeLessThan(0.3);
        // Microstrip's unequal mode speeds limit the directivity; it is finite and positive (reported in the README).
        expect(directivity).toBeGreaterThan(3);
        // The block reports the same directivity in its notes (to the 0.01 dB it prints).
        const noted = Number(/directivity (-?\d+\.\d\d) dB/.exec(doc.notes ?? '')![1]);
        expect(Math.abs(noted - directivity)).toBeLessThan(0.006);
        expect(-magnitudeDb(r, p('in'), p('in'))[0]!).toBeGreaterThan(15);
      });
    }
  }
  it('refuses a coupling whose gap the process cannot cut, saying the tightest it can make', () => {
    try {
      couplerBlock({ couplingDb: 6, f0: 2.45e9, substrate: FR4, process: { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 } });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('couplingDb');
      expect((e as InputError).expected).toMatch(/tightest coupling at 50\.0 Ω on this substrate is \d+\.\d\d dB/);
    }
  });
  it('a malformed process (a hand-edited file) is refused naming its field, what it must be, what was found and the fix — never a NaN', () => {
    const cases: [unknown, string, RegExp][] = [
      [{ kind: 'end-mill', depth: 0.1e-3 }, 'process.toolDiameter', /nothing/],
      [{ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 'thirty', depth: 0.1e-3 }, 'process.angleDeg', /"thirty"/],
      [{ kind: 'etch', edgeBias: 0, minFeature: -1 }, 'process.minFeature', /-1/],
      [{ kind: 'laser' }, 'process.kind', /"laser"/],
    ];
    for (const [process, field, got] of cases) {
      for (const make of [() => couplerBlock({ couplingDb: 10, f0: 2.45e9, substrate: FR4, process: process as never }), () => bandpassBlock({ order: 3, f0: 2.45e9, bw: 0.1, substrate: LOW_LOSS, process: process as never })]) {
        let err: unknown = null;
        try { make(); } catch (e) { err = e; }
        expect(err).toBeInstanceOf(InputError);
        const e = err as InputError;
        expect(e.field).toBe(field);
        expect(e.got).toMatch(got);
        expect(e.hint).toMatch(/Process panel/);
        expect(e.message).not.toMatch(/NaN/);
      }
    }
  });
});

/** Band edges: the outermost crossings of `level` below the peak, interpolated. */
function bandOf(s21: Float64Array, freqs: number[], drop: number) {
  let pk = -Infinity, ipk = 0;
  s21.forEach((v, i) => { if (v > pk) { pk = v; ipk = i; } });
  const lvl = pk - drop;
  let lo = 0, hi = s21.length - 1;
  while (lo < ipk && s21[lo]! < lvl) lo++;
  while (hi > ipk && s21[hi]! < lvl) hi--;
  const x = (i: number, j: number) => freqs[i]! + ((lvl - s21[i]!) * (freqs[j]! - freqs[i]!)) / (s21[j]! - s21[i]!);
  const fl = x(lo - 1, lo), fh = x(hi, hi + 1);
  return { centre: (fl + fh) / 2, width: fh - fl, peak: pk };
}

describe('edge-coupled band-pass block', () => {
  const cases = [
    { sub: LOW_LOSS, order: 5, bw: 0.1, ripple: 0.5, f0: 2.45e9 },
    { sub: LOW_LOSS, order: 3, bw: 0.1, ripple: 0, f0: 2.45e9 },
    { sub: LOW_LOSS, order: 4, bw: 0.12, ripple: 0.1, f0: 5.8e9 },
    { sub: FR4, order: 3, bw: 0.1, ripple: 0, f0: 2.45e9 },
    { sub: LOW_LOSS, order: 3, bw: 0.05, ripple: 0.5, f0: 1.5e9 },
    // Cases where the closed-form design alone came out 5–15 % narrow (the correction loop's reason to be):
    { sub: FR4, order: 5, bw: 0.15, ripple: 0, f0: 2.45e9 },
    { sub: FR4, order: 3, bw: 0.05, ripple: 0, f0: 2.45e9 },
    { sub: FR4, order: 3, bw: 0.15, ripple: 0.1, f0: 2.45e9 },
    { sub: LOW_LOSS, order: 5, bw: 0.15, ripple: 0, f0: 2.45e9 },
    // Orders 3–5 on both laminates, maximally flat and equal ripple, at 10 % (the task's matrix), and 5 % equal-ripple
    // cases on glass-epoxy where losses narrow the −3 dB band most (the design then ripples less than asked):
    ...[3, 4, 5].flatMap((order) => [FR4, LOW_LOSS].flatMap((sub) => [0, 0.1, 0.5].map((ripple) => ({ sub, order, bw: 0.1, ripple, f0: 2.45e9 })))),
    { sub: FR4, order: 4, bw: 0.05, ripple: 0.5, f0: 2.45e9 },
    { sub: FR4, order: 5, bw: 0.05, ripple: 0.1, f0: 2.45e9 },
  ];
  for (const c of cases) {
    const kind = c.ripple ? `${c.ripple} dB ripple` : 'maximally flat';
    it(`order ${c.order}, ${c.bw * 100} %, ${kind} at ${c.f0 / 1e9} GHz (εr ${c.sub.er}, h ${c.sub.h * 1e3} mm): centre and bandwidth within 2 % / 10 % with losses, 1 % / 5 % lossless`, () => {
      const doc = bandpassBlock({ order: c.order, f0: c.f0, bw: c.bw, rippleDb: c.ripple, substrate: c.sub, process: FINE });
      expect(validateDesign(doc, { complete: true }).ok).toBe(true);
      expect(doc.segments.filter((s) => s.kind === 'coupled')).toHaveLength(c.order + 1);
      const freqs = Array.from({ length: 3001 }, (_, i) => c.f0 * (1 - 3 * c.bw) + (i * c.f0 * 6 * c.bw) / 3000);
      const eps = Math.sqrt(10 ** (c.ripple / 10) - 1);
      const bw3 = c.ripple ? c.bw * Math.cosh(Math.acosh(1 / eps) / c.order) : c.bw;
      const lossy = bandOf(magnitudeDb(sweep(doc, freqs), 1, 0), freqs, 3);
      expect(Math.abs(lossy.centre / c.f0 - 1)).toBeLessThan(0.02);
      expect(Math.abs(lossy.width / (bw3 * c.f0) - 1)).toBeLessThan(0.1);
      const ideal = bandOf(magnitudeDb(sweep(doc, freqs, true), 1, 0), freqs, c.ripple ? c.ripple + 1e-3 : 3);
      expect(ideal.peak).toBeGreaterThan(-1e-3);
      expect(Math.abs(ideal.centre / c.f0 - 1)).toBeLessThan(0.01);
      expect(Math.abs(ideal.width / (c.bw * c.f0) - 1)).toBeLessThan(0.05);
    });
  }
  it('heavy loss, maximally flat (order 5, 5 % on glass-epoxy, ≈ 10 dB mid-band loss): the lossless band stays within 5 %, the lossy −3 dB band is at most 15 % narrow and the notes say by how much', () => {
    // A maximally flat design cannot ripple less; it widens only while the lossless band stays within 4 % of spec.
    // What remains (about 13 % here) is reported, not hidden: the limit the README states.
    const c = { order: 5, bw: 0.05, f0: 2.45e9 };
    const doc = bandpassBlock({ order: c.order, f0: c.f0, bw: c.bw, substrate: FR4, process: FINE });
    const freqs = Array.from({ length: 3001 }, (_, i) => c.f0 * (1 - 3 * c.bw) + (i * c.f0 * 6 * c.bw) / 3000);
    const ideal = bandOf(magnitudeDb(sweep(doc, freqs, true), 1, 0), freqs, 3);
    expect(Math.abs(ideal.width / (c.bw * c.f0) - 1)).toBeLessThan(0.05);
    const lossy = bandOf(magnitudeDb(sweep(doc, freqs), 1, 0), freqs, 3);
    expect(Math.abs(lossy.centre / c.f0 - 1)).toBeLessThan(0.02);
    expect(lossy.width / (c.bw * c.f0)).toBeGreaterThan(0.85);
    const said = /with losses −3 dB band −(\d+\.\d\d) %[^;]*\.$/m.exec(doc.notes ?? "");
    expect(said).not.toBeNull();
    expect(Math.abs(Number(said![1]) / 100 - (1 - lossy.width / (c.bw * c.f0)))).toBeLessThan(0.01);
  });
  it('heavy loss, equal ripple (order 5, 5 %, 0.1 dB on glass-epoxy): the design prototype ripples less than asked so the lossy band is within 10 %', () => {
    // Losses round the pass band; a flatter design keeps its band at the asked ripple and widens its −3 dB band.
    // Before the loop this case swept 27 % narrow, with the loop alone 15 %.
    const c = { order: 5, bw: 0.05, ripple: 0.1, f0: 2.45e9 };
    const doc = bandpassBlock({ order: c.order, f0: c.f0, bw: c.bw, rippleDb: c.ripple, substrate: FR4, process: FINE });
    const freqs = Array.from({ length: 3001 }, (_, i) => c.f0 * (1 - 3 * c.bw) + (i * c.f0 * 6 * c.bw) / 3000);
    const ideal = bandOf(magnitudeDb(sweep(doc, freqs, true), 1, 0), freqs, c.ripple + 1e-3);
    expect(Math.abs(ideal.centre / c.f0 - 1)).toBeLessThan(0.01);
    expect(Math.abs(ideal.width / (c.bw * c.f0) - 1)).toBeLessThan(0.05);
    const eps = Math.sqrt(10 ** (c.ripple / 10) - 1);
    const lossy = bandOf(magnitudeDb(sweep(doc, freqs), 1, 0), freqs, 3);
    expect(Math.abs(lossy.centre / c.f0 - 1)).toBeLessThan(0.02);
    expect(Math.abs(lossy.width / (c.bw * Math.cosh(Math.acosh(1 / eps) / c.order) * c.f0) - 1)).toBeLessThan(0.1);
    expect(doc.notes).toMatch(/design ripple 0\.\d{3} dB \(a flatter prototype than the asked 0\.1 dB/);
  });
  it('compensates the open ends: each resonator\'s open ends are shortened by their end extension', () => {
    const sized = sizeDesign(bandpassBlock({ order: 3, f0: 2.45e9, bw: 0.1, substrate: LOW_LOSS, process: FINE }));
    const s2 = sized.pieces.find((p) => p.id === 's2')!;
    const open = s2.compensations.filter((c) => c.model === 'open-end' && c.applied);
    expect(open).toHaveLength(1);
    expect(s2.length).toBeCloseTo(s2.nominalLength - open[0]!.amount_m, 12);
  });
  it('refuses a bandwidth whose end gaps the process cannot cut, naming the section and the tightest coupling', () => {
    expect(() => bandpassBlock({ order: 5, f0: 2.45e9, bw: 0.15, substrate: LOW_LOSS })).toThrow(/tightest coupling at \d+\.\d Ω on this substrate is \d+\.\d\d dB, got coupled section 1 of 6 needs/);
  });
});

describe('a pair in the editor commands', () => {
  it('deleting a node beside a pair takes the pair with it; copying the pair takes its four terminals', async () => {
    const { runCommand } = await import('../../core/index.ts');
    const { copySelection } = await import('../../core/design/clipboard.ts');
    const doc = couplerBlock({ couplingDb: 15, f0: 2.45e9, substrate: FR4 });
    const after = runCommand(doc, 'selection.delete', { ids: ['d'] });
    expect(after.segments.some((s) => s.kind === 'coupled')).toBe(false);
    expect(validateDesign(after).ok).toBe(true);
    const clip = JSON.parse(copySelection(doc, ['pair']));
    expect(clip.nodes.map((n: { id: string }) => n.id).sort()).toEqual(['a', 'b', 'c', 'd']);
  });
});

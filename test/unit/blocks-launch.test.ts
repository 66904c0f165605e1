/**
 * The connector launch against the theory of small reflections (D. M. Pozar, Microwave Engineering, 4th ed., 2012,
 * §5.5): a pad of impedance Zp and electrical length θ between lines of Z0 reflects exactly
 * Γ = Γ1·(1 − e^{−2jθ}) / (1 − Γ1²·e^{−2jθ}), Γ1 = (Zp − Z0)/(Zp + Z0) (the multiple-reflection sum of §5.5 with
 * Γ3 = −Γ1). The block's taper returns from the pad to the line gradually, so its reflection lies between that of a
 * return step at the pad's end and one at the taper's end (§5.8: a taper as a continuum of small steps). Zp and β
 * come from the core's line model, which the sweep also uses; what is checked is the launch's assembly (pad, taper,
 * port) in the sweep against the textbook formula. Plain microstrip (the etched process), so the line model needs
 * no cross-section table.
 */
import { describe, expect, it } from 'vitest';
import { analyzeLine, synthesizeLine, makeBlockDesign, netlistFromSized, sizeDesign, solveNetwork, FR4_DEFAULT, InputError } from '../../core/index.ts';
import { autoTaperLength } from '../../core/blocks/kinds/launch.ts';

const F0 = 2.45e9;
const ETCHED = { kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 } as const;
const base = { f0: F0, process: ETCHED };

function s11Db(raw: Record<string, unknown>): number {
  const doc = makeBlockDesign('launch', raw, base);
  const r = solveNetwork(netlistFromSized(sizeDesign(doc), { lossless: true }), [F0]);
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === 'b1.conn');
  const t = 2 * (i * P + i);
  return 20 * Math.log10(Math.hypot(r.s[t]!, r.s[t + 1]!));
}

/** |Γ| in dB of a section of width `w` and length `len` between 50 Ω lines (Pozar §5.5, exact for one section). */
function sectionDb(w: number, len: number): number {
  const p = analyzeLine(FR4_DEFAULT, w, F0);
  const g1 = (p.z0 - 50) / (p.z0 + 50), th = (2 * Math.PI * len) / p.lambdaG;
  const e = { re: Math.cos(2 * th), im: -Math.sin(2 * th) };
  const num = Math.hypot(1 - e.re, -e.im) * Math.abs(g1);
  const den = Math.hypot(1 - g1 * g1 * e.re, -g1 * g1 * e.im);
  return 20 * Math.log10(num / den);
}

/** Width of a z-ohm line on the test's laminate (the core's synthesis; plain microstrip). */
function widthOf(z: number): number { return synthesizeLine(FR4_DEFAULT, z, F0).width; }

/** |Γ| in dB at the input of cascaded line sections [Z, θ] between 50 Ω lines (ABCD matrices, Pozar Table 4.1). */
function abcdGammaDb(sections: [number, number][]): number {
  // Complex 2×2 product; entries [re, im].
  type C = [number, number];
  const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
  const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
  let M: [C, C, C, C] = [[1, 0], [0, 0], [0, 0], [1, 0]];
  for (const [z, th] of sections) {
    const L: [C, C, C, C] = [[Math.cos(th), 0], [0, z * Math.sin(th)], [0, Math.sin(th) / z], [Math.cos(th), 0]];
    M = [add(mul(M[0], L[0]), mul(M[1], L[2])), add(mul(M[0], L[1]), mul(M[1], L[3])), add(mul(M[2], L[0]), mul(M[3], L[2])), add(mul(M[2], L[1]), mul(M[3], L[3]))];
  }
  const z0 = 50;
  const num: C = [M[0][0] + M[1][0] / z0 - M[2][0] * z0 - M[3][0], M[0][1] + M[1][1] / z0 - M[2][1] * z0 - M[3][1]];
  const den: C = [M[0][0] + M[1][0] / z0 + M[2][0] * z0 + M[3][0], M[0][1] + M[1][1] / z0 + M[2][1] * z0 + M[3][1]];
  return 20 * Math.log10(Math.hypot(...num) / Math.hypot(...den));
}

describe('connector launch: the pad reflects as the theory of small reflections says (Pozar §5.5, §5.8)', () => {
  for (const [pw, pl] of [[1.5e-3, 0.5e-3], [1.5e-3, 1e-3], [2.4e-3, 3e-3]] as const) {
    it(`a ${pw * 1e3} × ${pl * 1e3} mm pad on 1.6 mm glass-epoxy: |S11| between a return step at the pad's end and at the taper's end`, () => {
      const line = analyzeLine(FR4_DEFAULT, 3e-3, F0); // about the 50 Ω width, for the flare length only
      const tl = autoTaperLength(pw, line.width);
      const got = s11Db({ padWidth: `${pw * 1e3} mm`, padLength: `${pl * 1e3} mm` });
      const lo = sectionDb(pw, pl), hi = sectionDb(pw, pl + tl + 0.2e-3);
      expect(got, `sweep ${got.toFixed(2)} dB; steps at ${lo.toFixed(2)} and ${hi.toFixed(2)} dB`).toBeGreaterThan(lo - 0.3);
      expect(got).toBeLessThan(hi + 0.3);
    });
  }
  it('a longer pad reflects more (|Γ| ≈ 2|Γ1| sin βℓ), so the refusal names a shorter one', () => {
    expect(s11Db({ padWidth: '1.5 mm', padLength: '0.5 mm' })).toBeLessThan(s11Db({ padWidth: '1.5 mm', padLength: '1 mm' }));
    let err: unknown;
    try { makeBlockDesign('launch', { padWidth: '1.2 mm', padLength: '4 mm' }, base); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).hint).toMatch(/a pad at most [\d.]+ mm long at 1\.2 mm wide/);
  });
  it('a pad that misses gets a compensating section of Z0²/Zp and the pad\'s electrical length, and reflects as that cascade does (Pozar §4.4 Table 4.1, §5.5)', () => {
    // 1.5 × 1.5 mm on 1.6 mm glass-epoxy etched: about −23 dB alone (refused with a 3 mm taper, below), so the
    // generator adds the section.
    const doc = makeBlockDesign('launch', { padWidth: '1.5 mm', padLength: '1.5 mm' }, base);
    const comp = doc.segments.find((x) => x.id === 'b1.comp');
    const pad = doc.segments.find((x) => x.id === 'b1.pad');
    expect(comp?.kind === 'line' && comp.width.by === 'z0' && pad?.kind === 'line' && pad.length.by === 'length').toBe(true);
    if (comp?.kind !== 'line' || comp.width.by !== 'z0' || comp.length.by !== 'length' || pad?.kind !== 'line' || pad.length.by !== 'length') return;
    const p = analyzeLine(FR4_DEFAULT, 1.5e-3, F0);
    expect(comp.width.z0).toBeCloseTo((50 * 50) / p.z0, 0);
    // The cascade pad · section between 50 Ω lines with ideal steps, from the lines' ABCD matrices (Pozar Table 4.1).
    const c = analyzeLine(FR4_DEFAULT, widthOf(comp.width.z0), F0);
    const cascade = abcdGammaDb([[p.z0, (2 * Math.PI * pad.length.length) / p.lambdaG], [c.z0, (2 * Math.PI * comp.length.length) / c.lambdaG]]);
    const got = s11Db({ padWidth: '1.5 mm', padLength: '1.5 mm' });
    expect(got, `sweep ${got.toFixed(2)} dB, ideal-step cascade ${cascade.toFixed(2)} dB`).toBeLessThan(-25);
    expect(Math.abs(got - cascade)).toBeLessThan(3);
    // Second order only: well below the pad alone (2|Γ1| sin θ against 4|Γ1| sin² θ).
    expect(got).toBeLessThan(sectionDb(1.5e-3, 1.5e-3) - 5);
  });
  it('an asked taper is kept: the same pad with a 3 mm taper is refused, naming the generator\'s way first', () => {
    let err: unknown;
    try { makeBlockDesign('launch', { padWidth: '1.5 mm', padLength: '1.5 mm', taperLength: '3 mm' }, base); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('launch.padWidth');
    expect((err as InputError).hint).toMatch(/^the nearest that meets it: no taper length/);
  });
  it('left to itself the pad is the line where the line is wider than the pin: no step, so no reflection', () => {
    expect(s11Db({})).toBeLessThan(-60);
    const doc = makeBlockDesign('launch', {}, base);
    expect(doc.segments.some((s) => s.kind === 'taper')).toBe(false);
    expect(doc.nodes.find((n) => n.id === 'b1.conn')).toMatchObject({ launch: { padLength: 3e-3 } });
  });
});

/**
 * The cross-section solver's behaviour: physical orderings that must hold whatever the numbers (side copper lowers
 * Z0, floating copper less than stitched, a lid lowers Z0, a cover raises εeff, a trench lowers it, even above odd),
 * mirror symmetry, input errors in the user's words, and Wheeler's loss against the line layer's own (independent,
 * closed-form) Wheeler rule on Hammerstad–Jensen microstrip (Pucel, Massé & Hartwig, IEEE MTT 16, 1968).
 */
import { describe, expect, it } from 'vitest';
import { analyzeLine, InputError, solveSection, equipotentials, sectionOutline, type SectionSpec } from '../../core/index.ts';

const MU0 = 1.25663706212e-6;
const BASE: SectionSpec = { er: 3.66, h: 0.508e-3, width: 1.1e-3, t: 35e-6 };
const z = (s: SectionSpec) => solveSection(s, { loss: false }).modes[0]!;

describe('section solver: orderings and symmetry', () => {
  const plain = z(BASE);
  const stitched = z({ ...BASE, side: { gap: 0.3e-3, width: Infinity, connection: 'stitched' } });
  const floating = z({ ...BASE, side: { gap: 0.3e-3, width: Infinity, connection: 'floating' } });
  it('side copper lowers Z0; floating copper (zero net charge) lowers it less than stitched', () => {
    expect(stitched.z0).toBeLessThan(plain.z0 * 0.97);
    expect(floating.z0).toBeGreaterThan(stitched.z0);
    expect(floating.z0).toBeLessThan(plain.z0);
  });
  it('a wider gap moves Z0 back towards plain microstrip', () => {
    const wide = z({ ...BASE, side: { gap: 1.5e-3, width: Infinity, connection: 'stitched' } });
    expect(wide.z0).toBeGreaterThan(stitched.z0);
    expect(wide.z0).toBeLessThan(plain.z0);
  });
  it('a lid lowers Z0; a cover raises εeff; a trench in the gaps lowers εeff', () => {
    expect(z({ ...BASE, lid: 2e-3 }).z0).toBeLessThan(plain.z0);
    expect(z({ ...BASE, cover: { er: 3.5, thickness: 30e-6 } }).epsEff).toBeGreaterThan(plain.epsEff);
    const side = { gap: 0.3e-3, width: Infinity, connection: 'stitched' as const };
    expect(z({ ...BASE, side, trench: { depth: 0.15e-3 } }).epsEff).toBeLessThan(stitched.epsEff);
  });
  it('copper on the left only gives the same line as on the right only (mirror image)', () => {
    const l = z({ ...BASE, side: { gap: 0.3e-3, width: 2e-3, connection: 'stitched', sides: 'left' } });
    const r = z({ ...BASE, side: { gap: 0.3e-3, width: 2e-3, connection: 'stitched', sides: 'right' } });
    expect(Math.abs(l.z0 / r.z0 - 1)).toBeLessThan(1e-4); // the graded grids are not exact mirror images
    expect(l.z0).toBeGreaterThan(stitched.z0);
  });
  it('a pair: even-mode Z0 above the single line above odd; closer strips split them further', () => {
    const near = solveSection({ ...BASE, spacing: 0.2e-3 }, { loss: false }).modes;
    const far = solveSection({ ...BASE, spacing: 1e-3 }, { loss: false }).modes;
    expect(near.map((m) => m.mode)).toEqual(['even', 'odd']);
    expect(near[0]!.z0).toBeGreaterThan(plain.z0);
    expect(near[1]!.z0).toBeLessThan(plain.z0);
    expect(near[0]!.z0 - near[1]!.z0).toBeGreaterThan(far[0]!.z0 - far[1]!.z0);
  });
  it('an unsymmetric pair is solved whole and says its modes are those of the first strip', () => {
    const r = solveSection({ ...BASE, spacing: 0.3e-3, side: { gap: 0.3e-3, width: 2e-3, connection: 'stitched', sides: 'right' } }, { loss: false });
    expect(r.modes.length).toBe(2);
    expect(r.warnings.some((w) => w.message.includes('unsymmetric'))).toBe(true);
  });
  it('every value is finite and carries an error estimate', () => {
    for (const m of [plain, stitched, floating]) {
      for (const v of [m.z0, m.epsEff, m.c, m.l, m.cAir, m.error.z0, m.error.epsEff]) expect(Number.isFinite(v)).toBe(true);
      expect(m.error.z0).toBeGreaterThan(0);
      expect(m.l * m.c).toBeCloseTo(m.epsEff / 299792458 ** 2, 25);
    }
  });
});

describe("section solver: Wheeler's incremental inductance", () => {
  it('plain microstrip loss within 5 % of the line layer\'s closed-form Wheeler rule on Hammerstad–Jensen', () => {
    const sub = { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0, sigma: 5.8e7, roughness: 0 };
    const f = 5e9;
    const m = solveSection(BASE).modes[0]!;
    const rs = Math.sqrt((Math.PI * f * MU0) / sub.sigma);
    const mine = (rs * m.dLdn) / (2 * MU0 * m.z0);
    const theirs = analyzeLine(sub, BASE.width, f, { dispersion: 'none' }).alphaC;
    expect(Math.abs(mine / theirs - 1)).toBeLessThan(0.05);
  });
  it('side copper close by raises the conductor loss (current crowds onto the facing edges)', () => {
    const a = solveSection(BASE).modes[0]!;
    const b = solveSection({ ...BASE, side: { gap: 0.15e-3, width: Infinity, connection: 'stitched' } }).modes[0]!;
    expect(b.dLdn / b.z0).toBeGreaterThan(a.dLdn / a.z0);
  });
  it('a thin sheet has no Wheeler loss and says so', () => {
    const r = solveSection({ ...BASE, t: 0 }, { loss: true });
    expect(r.modes[0]!.dLdn).toBe(0);
    expect(r.warnings.some((w) => w.source === 'wheeler-1942')).toBe(true);
  });
});

describe('section solver: input errors and drawing data', () => {
  it('refuses impossible cross-sections naming the field', () => {
    const bad: [Partial<SectionSpec>, string][] = [
      [{ width: -1 }, 'width'], [{ er: 0.5 }, 'er'], [{ t: 1 }, 't'], [{ etchAngleDeg: 10 }, 'etchAngleDeg'],
      [{ side: { gap: 0, width: Infinity, connection: 'stitched' } }, 'side.gap'], [{ trench: { depth: 1e-3 } }, 'trench.depth'],
      [{ lid: 0.5e-3 }, 'lid'], [{ width: Number.NaN }, 'width'],
    ];
    for (const [patch, field] of bad) {
      try { solveSection({ ...BASE, ...patch }); expect.unreachable(`${field} accepted`); } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).field).toBe(field);
      }
    }
  });
  it('equipotentials lie in the window and between the strip and ground; the outline has the copper', () => {
    const spec: SectionSpec = { ...BASE, side: { gap: 0.3e-3, width: Infinity, connection: 'stitched' } };
    const r = solveSection(spec, { potential: true });
    const o = sectionOutline(spec);
    const lines = equipotentials(r.potential!, [0.25, 0.5, 0.75], o.window);
    expect(lines.every((l) => l.segments.length > 0)).toBe(true);
    for (const l of lines) for (let k = 0; k < l.segments.length; k += 2) {
      expect(l.segments[k + 1]!).toBeGreaterThanOrEqual(0);
      expect(l.segments[k]!).toBeGreaterThanOrEqual(o.window.x0 - 1e-3);
    }
    expect(o.copper.map((c) => c.role).sort()).toEqual(['ground', 'ground', 'strip']);
    const v = r.potential!.v;
    expect(Math.max(...v)).toBeCloseTo(1, 9);
    expect(Math.min(...v)).toBeGreaterThanOrEqual(-1e-5); // the iterative solve's residual; the exact discrete solution has no undershoot
  });
});

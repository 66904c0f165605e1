/**
 * The coupon generator (core/layout/generators/coupon.ts): the length difference that keeps β·Δl symmetric about
 * 90° over the band (the two-line conditioning of Marks 1991: eigenvalues coincide at β·Δl = nπ), the split of
 * wide bands into sub-bands, and a design the file loader and the sizing accept. β comes from our line model, so the
 * checks here are the plan's own arithmetic and geometry; the extraction's outside check is
 * test/reference/coupon-skrf.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { analyzeLine, C0, FR4_DEFAULT, InputError, laminateCoupon, planCoupon, sizeDesign, validateDesign } from '../../core/index.ts';

const beta = (f: number, w: number) => (2 * Math.PI * f / C0) * Math.sqrt(analyzeLine(FR4_DEFAULT, w, f).epsEff);

describe('coupon plan', () => {
  it('one pair for a 4:1 band: β·Δl at the band edges adds up to 180° (symmetric about 90°)', () => {
    const p = planCoupon({ substrate: { ...FR4_DEFAULT }, band: { start: 1e9, stop: 4e9 } });
    expect(p.lines.map((l) => l.name)).toEqual(['A', 'B']);
    const b = p.lines[1]!;
    const sum = (beta(1e9, p.width) + beta(4e9, p.width)) * b.delta * 180 / Math.PI;
    expect(sum).toBeCloseTo(180, 0);
    expect(b.phaseDeg![0]).toBeGreaterThan(30);
    expect(b.phaseDeg![1]).toBeLessThan(150);
    // For a constant εe the margin would be 180°/(1 + 4) = 36°; dispersion moves it a little.
    expect(Math.abs(p.worstMarginDeg - 36)).toBeLessThan(3);
    // 50 Ω by default: the width analyses back to 50 Ω at the band centre.
    expect(analyzeLine(FR4_DEFAULT, p.width, 2e9).z0).toBeCloseTo(50, 1);
  });
  it('a 16:1 band is split into two sub-bands, each its own line against the shortest', () => {
    const p = planCoupon({ substrate: { ...FR4_DEFAULT }, band: { start: 0.5e9, stop: 8e9 } });
    expect(p.lines.length).toBe(3);
    expect(p.lines[1]!.band!.stop).toBeCloseTo(p.lines[2]!.band!.start, -3);
    expect(p.worstMarginDeg).toBeGreaterThan(30);
    expect(p.lines[1]!.delta).toBeGreaterThan(p.lines[2]!.delta); // the lower sub-band needs the longer line
  });
  it('refuses a band without width, a pitch that would couple the lines', () => {
    expect(() => planCoupon({ substrate: { ...FR4_DEFAULT }, band: { start: 2e9, stop: 2e9 } })).toThrow(InputError);
    expect(() => laminateCoupon({ substrate: { ...FR4_DEFAULT }, band: { start: 1e9, stop: 4e9 }, pitch: 3e-3 })).toThrow(/pitch/);
  });
});

describe('coupon design', () => {
  const { design, plan } = laminateCoupon({ substrate: { ...FR4_DEFAULT }, band: { start: 1e9, stop: 4e9 }, thru: true });
  it('is a complete, valid design the sizing accepts, with labelled lines and identical launches', () => {
    const v = validateDesign(design, { complete: true });
    expect(v.ok).toBe(true);
    const sized = sizeDesign(design);
    expect(sized.problems).toEqual([]);
    expect(design.segments.every((s) => s.label?.startsWith('coupon'))).toBe(true);
    const launches = design.nodes.map((n) => (n.kind === 'port' ? JSON.stringify(n.launch) : ''));
    expect(new Set(launches).size).toBe(1);
    expect(plan.lines.find((l) => l.name === 'T')).toBeDefined();
  });
  it('each line spans its own strip of board: both ports on the outline', () => {
    const ring = design.board!.outline;
    const onEdge = (p: { x: number; y: number }) => ring.some((a, i) => {
      const b = ring[(i + 1) % ring.length]!;
      const cross = (b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x);
      const within = Math.min(a.x, b.x) - 1e-12 <= p.x && p.x <= Math.max(a.x, b.x) + 1e-12 && Math.min(a.y, b.y) - 1e-12 <= p.y && p.y <= Math.max(a.y, b.y) + 1e-12;
      return Math.abs(cross) < 1e-12 && within;
    });
    for (const n of design.nodes) expect(onEdge(n.at), n.id).toBe(true);
    // Port-to-port distance is the planned length.
    for (const l of plan.lines) {
      const [a, b] = l.ports.map((id) => design.nodes.find((n) => n.id === id)!);
      expect(Math.hypot(a!.at.x - b!.at.x, a!.at.y - b!.at.y)).toBeCloseTo(l.length, 12);
    }
  });
});

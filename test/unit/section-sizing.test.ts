/**
 * Sizing for what is made: the field solver's tables as a line-layer source, the design's asMade setting, the
 * shift from plain microstrip on each piece, the sweep using the same lines, and the via-fence shop check
 * (pitch ≤ λ/10 in the substrate at the top of the band: common practice).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  analyzeLine, synthesizeLine, sectionTable, solveSection, parseDesign, sizeDesign, asMadeTemplate, fenceFindings, fencePitchLimit,
  netlistFromSized, sweepNetwork, isolationPlan, type DesignDoc,
} from '../../core/index.ts';

const SUB = { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037, sigma: 5.8e7, roughness: 0 };
const TEMPLATE = { er: SUB.er, h: SUB.h, t: SUB.t, side: { gap: 0.4e-3, width: Infinity, connection: 'stitched' as const } };

function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(import.meta.dirname, '..', '..', 'assets', 'examples', name), 'utf8'));
  if (!r.ok) throw new Error('example refused');
  return r.doc;
}

describe('cross-section tables as a line source', () => {
  const table = sectionTable(TEMPLATE);
  it('interpolate the solver to well within its own error between the solved widths', () => {
    for (const w of [0.37e-3, 1.13e-3, 2.9e-3]) {
      const direct = solveSection({ ...TEMPLATE, width: w }).modes[0]!;
      const t = table.staticAt(w);
      expect(Math.abs(t.z0 / direct.z0 - 1)).toBeLessThan(1e-3);
      expect(Math.abs(t.epsEff / direct.epsEff - 1)).toBeLessThan(1e-3);
    }
  });
  it('the line layer gives the table\'s static values, and synthesis inverts the analysis', () => {
    const r = analyzeLine(SUB, 1.1e-3, 0, { crossSection: table });
    expect(r.z0Static).toBeCloseTo(table.staticAt(1.1e-3).z0, 9);
    expect(r.epsEffStatic).toBeCloseTo(table.staticAt(1.1e-3).epsEff, 9);
    const s = synthesizeLine(SUB, 50, 5e9, { crossSection: table });
    expect(analyzeLine(SUB, s.width, 5e9, { crossSection: table }).z0).toBeCloseTo(50, 6);
    // Side copper lowers Z0, so the as-made 50 Ω line is narrower than plain microstrip's.
    expect(s.width).toBeLessThan(synthesizeLine(SUB, 50, 5e9).width);
  });
  it('dispersion is applied on top of the static values (εeff grows with frequency)', () => {
    const lo = analyzeLine(SUB, 1.1e-3, 1e9, { crossSection: table }), hi = analyzeLine(SUB, 1.1e-3, 20e9, { crossSection: table });
    expect(hi.epsEff).toBeGreaterThan(lo.epsEff);
    expect(lo.alphaC).toBeGreaterThan(0);
    expect(lo.alphaD).toBeGreaterThan(0);
  });
  it('a width outside the tables is an input error naming the width', () => {
    expect(() => analyzeLine(SUB, 50e-3, 1e9, { crossSection: table })).toThrow(/width/);
  });
});

describe('design asMade', () => {
  it('a milled design sized as made: narrower lines than plain microstrip, the shift on each piece, the same lines in the sweep', () => {
    const plainDoc: DesignDoc = { ...example('branchline-10g4.json'), asMade: { sizing: 'microstrip', sideCopper: 'stitched' } };
    expect(asMadeTemplate(plainDoc)).toBeNull(); // a file that says microstrip (as older files do after migration) keeps it
    const doc: DesignDoc = { ...plainDoc, asMade: { sizing: 'as-made', sideCopper: 'stitched' } };
    const t = asMadeTemplate(doc)!;
    // The channel the G-code mills (core/toolpath/isolation.ts): the example's 0.4 mm end mill in the passes its
    // isolation clearance asks for, each further pass 0.6 of a cut out (format 12 files: two passes, 1.6 cuts).
    const iso = isolationPlan(doc.process as Extract<DesignDoc['process'], { kind: 'end-mill' }>);
    expect(t.side!.gap).toBeCloseTo(0.4e-3 + (iso.passes - 1) * 0.6 * 0.4e-3, 12);
    expect(iso.passes).toBe(2);
    expect(t.trench!.depth).toBeCloseTo(80e-6 - 35e-6, 12);
    const plain = sizeDesign(plainDoc), made = sizeDesign(doc);
    expect(made.problems).toEqual([]);
    const line = made.pieces.find((p) => p.kind === 'line')!;
    const before = plain.pieces.find((p) => p.id === line.id)!;
    expect(line.width).toBeLessThan(before.width);
    expect(line.asMade).toBeDefined();
    expect(line.asMade!.z0).toBeCloseTo(line.z0, 9);
    expect(line.asMade!.z0Plain).toBeGreaterThan(line.z0); // the same copper as plain microstrip would be higher
    expect(line.asMade!.label).toContain('stitched side copper');
    // The network built with the sized design's line options sees the as-made Z0 at f0.
    const net = netlistFromSized(made, { line: made.lineOptions! });
    const el = net.elements.find((e) => e.kind === 'line' && e.id === line.id) as { model: (f: number) => { zc: { re: number } } };
    expect(el.model(made.f0).zc.re).toBeCloseTo(line.z0, 0);
    expect(JSON.parse(JSON.stringify(made)).lineOptions).toBeUndefined(); // the sized design stays plain data
    void sweepNetwork;
  }, 240_000); // builds one table (TABLE_POINTS solves): about a second of CPU, far longer on a shared test machine
  it('the via-fence check: λ/10 in the substrate at the top of the band, floating copper said to be floating', () => {
    const base = example('branchline-10g4.json');
    const limit = fencePitchLimit(base);
    expect(limit).toBeCloseTo(299792458 / (Math.max(base.frequency.f0, base.frequency.band.stop) * Math.sqrt(base.substrate.er)) / 10, 12);
    expect(fenceFindings({ ...base, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } })).toEqual([]);
    expect(fenceFindings({ ...base, asMade: { sizing: 'as-made', sideCopper: 'stitched' } })[0]!.severity).toBe('info');
    expect(fenceFindings({ ...base, asMade: { sizing: 'as-made', sideCopper: 'stitched', fencePitch: limit * 1.5 } })[0]!.severity).toBe('warning');
    expect(fenceFindings({ ...base, asMade: { sizing: 'as-made', sideCopper: 'stitched', fencePitch: limit * 0.5 } })).toEqual([]);
    expect(fenceFindings({ ...base, asMade: { sizing: 'as-made', sideCopper: 'floating' } })[0]!.message).toContain('floating');
  });
});

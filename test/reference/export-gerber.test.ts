/**
 * Gerber X2 and Excellon export, checked three ways (against the Gerber Layer Format Specification, Ucamco, and the Excellon format):
 * (a) our own rule checker written from the open Gerber Layer Format Specification (scripts/oracles/gerber-lint.ts);
 * (b) read-back through gerber-parser + gerber-plotter (units, exact image extent, no warnings);
 * (c) rendering through gerber-to-svg → resvg → pngjs: dark area within 0.5 % of the geometry's copper area,
 *     the check that catches region/polarity mistakes invisible to parsers.
 */
import { describe, expect, it } from 'vitest';
import { toGerber } from '../../core/export/gerber.ts';
import { toExcellon } from '../../core/export/excellon.ts';
import { lintExcellon, lintGerber } from '../../scripts/oracles/gerber-lint.ts';
import { gerberDarkArea, readBack } from '../../scripts/oracles/gerber-read.ts';
import { boardFixture, stripOnlyFixture, BEND_AREA_MM2, STRIP_AREA_MM2, GROUND_AREA_MM2 } from '../fixtures/export/hand-made.ts';

const COPPER_AREA = BEND_AREA_MM2 + STRIP_AREA_MM2 + GROUND_AREA_MM2; // worked out by hand in the fixture

describe('Gerber copper and profile: own rule checker (Gerber Layer Format Specification)', () => {
  const files = toGerber(boardFixture(), { version: '1.2.3' });
  it('copper passes every rule and says what it is', () => {
    const { problems, facts } = lintGerber(files.copper);
    expect(problems).toEqual([]);
    expect(facts.units).toBe('MM');
    expect(facts.format).toEqual({ int: 4, dec: 6 });
    expect(facts.fileFunction).toBe('Copper,L1,Top');
    expect(facts.regions).toBe(5); // ground outer + 2 cleared windows + 2 network regions
    expect(files.copper).toContain('%TF.GenerationSoftware,Stripwright,Stripwright,1.2.3*%');
    expect(files.copper).toContain('%TF.FilePolarity,Positive*%');
    expect(files.copper.trimEnd().endsWith('M02*')).toBe(true);
  });
  it('profile passes every rule', () => {
    const { problems, facts } = lintGerber(files.profile);
    expect(problems).toEqual([]);
    expect(facts.fileFunction).toBe('Profile,NP');
  });
  it('bottom copper is the ground plane over the whole board (Copper,L2,Bot)', async () => {
    const { problems, facts } = lintGerber(files.bottom);
    expect(problems).toEqual([]);
    expect(facts.fileFunction).toBe('Copper,L2,Bot');
    const r = await readBack(files.bottom);
    expect(r.warnings).toEqual([]);
    expect(r.box).toEqual([0, 0, 50, 40]); // the fixture's 50 × 40 mm outline
    const a = await gerberDarkArea(files.bottom, 10);
    expect(Math.abs(a.areaMm2 - 2000) / 2000).toBeLessThan(0.005);
  });
  it('the checker rejects broken variants (so a pass means something)', () => {
    const c = files.copper;
    const variants: [string, string, RegExp][] = [
      ['no MO', c.replace('%MOMM*%\n', ''), /MO must appear exactly once/],
      ['no M02', c.replace('M02*', ''), /does not end with M02/],
      ['open contour', c.replace(/(X2000000Y2000000D01\*\nG37\*)/, 'G37*'), /not closed/],
      ['missing G37', c.replace(/G37\*\n%LPC/, '%LPC'), /LP inside a region|G36 inside a region/],
      ['undefined aperture', files.profile.replace('D10*', 'D11*'), /D11 used but not defined/],
      ['deprecated G70', c.replace('G01*', 'G70*\nG01*'), /deprecated/],
      ['no FileFunction', c.replace('%TF.FileFunction,Copper,L1,Top*%\n', ''), /\.FileFunction missing/],
      ['modal arc', files.profile.replace('G01*', 'G75*\nG03*'), /arc segment without I\/J/],
    ];
    for (const [name, text, msg] of variants) {
      const { problems } = lintGerber(text);
      expect(problems.join('\n'), name).toMatch(msg);
    }
  });
});

describe('Gerber read back with gerber-parser + gerber-plotter', () => {
  it('copper: mm, extent equal to the ground copper box, no warnings except skipped X2 attributes', async () => {
    const r = await readBack(toGerber(boardFixture()).copper);
    expect(r.warnings).toEqual([]);
    expect(r.units).toBe('mm');
    expect(r.box).toEqual([2, 2, 48, 38]); // ground copper 2…48 × 2…38 mm in the fixture
    expect(r.done).toBe(true);
    expect(r.ignoredAttributes.length).toBeGreaterThan(0); // parser does not implement X2 attributes (Gerber Layer Format Specification, Ucamco)
  });
  it('profile: the outline drawn with the 0.1 mm line: extent grows by half the line width', async () => {
    const r = await readBack(toGerber(boardFixture()).profile);
    expect(r.warnings).toEqual([]);
    expect(r.box).toEqual([-0.05, -0.05, 50.05, 40.05]);
  });
  it('origin design keeps design coordinates (strip at 10…20 × 20…22 mm)', async () => {
    const r = await readBack(toGerber(stripOnlyFixture(), { origin: 'design' }).copper);
    expect(r.box).toEqual([10, 20, 20, 22]);
  });
});

describe('Gerber rendered by gerber-to-svg and rasterised by resvg', () => {
  it('copper dark area is within 0.5 % of the geometry (islands in ground windows kept, holes cleared)', async () => {
    const a = await gerberDarkArea(toGerber(boardFixture()).copper, 20);
    expect(Math.abs(a.areaMm2 - COPPER_AREA) / COPPER_AREA).toBeLessThan(0.005);
  });
  it('a wrong polarity order would be seen: clearing holes after the islands loses the network copper', async () => {
    // Same file with the network regions moved before the ground copper: the later %LPC clears them away.
    const text = toGerber(boardFixture()).copper;
    const lines = text.split('\n');
    const start = lines.indexOf('%TA.AperFunction,Conductor*%') + 1;
    const end = lines.indexOf('%TD*%');
    const body = lines.slice(start, end).join('\n');
    const groundEnd = body.indexOf('%LPD*%') + '%LPD*%'.length;
    const reordered = [...lines.slice(0, start), body.slice(groundEnd + 1), body.slice(0, groundEnd), ...lines.slice(end)].join('\n');
    const a = await gerberDarkArea(reordered, 20);
    expect(Math.abs(a.areaMm2 - GROUND_AREA_MM2) / GROUND_AREA_MM2).toBeLessThan(0.005);
  });
});

describe('Excellon drill files', () => {
  const g = boardFixture();
  const files = toExcellon(g);
  it('splits plated and non-plated holes, each passing our rule checker', () => {
    const p = lintExcellon(files.plated!), n = lintExcellon(files.nonPlated!);
    expect(p.problems).toEqual([]);
    expect(n.problems).toEqual([]);
    expect(p.facts.fileFunction).toBe('Plated,1,2,PTH');
    expect(n.facts.fileFunction).toBe('NonPlated,1,2,NPTH');
    expect([...p.facts.tools.values()]).toEqual([0.8, 1.3]);
    expect(p.facts.hits.length).toBe(3);
    expect(n.facts.hits).toEqual([{ tool: 1, x: 45, y: 35 }]);
  });
  it('reads back through gerber-parser/plotter as pads at the drilled positions, METRIC', async () => {
    const r = await readBack(files.plated!);
    expect(r.warnings).toEqual([]);
    expect(r.units).toBe('mm');
    const pads = r.objects.filter((o) => o.type === 'pad').map((o) => [o.x, o.y]);
    expect(pads.sort()).toEqual([[40, 30], [42, 30], [6, 10]].sort());
    // Extent: vias 0.8 mm at (40,30),(42,30) and the 1.3 mm pin at (6,10).
    expect(r.box).toEqual([5.35, 9.35, 42.4, 30.4]);
  });
  it('rendered holes (gerber-to-svg → resvg) cover Σ π·d²/4 within 1 % (pixel-limited at 40 px/mm)', async () => {
    const want = g.drills.filter((d) => d.plated).reduce((a, d) => a + Math.PI * (d.diameter * 1e3) ** 2 / 4, 0);
    const got = (await gerberDarkArea(files.plated!, 40)).areaMm2;
    expect(Math.abs(got - want) / want).toBeLessThan(0.01);
  });
  it('every drill centre lies inside the board outline', () => {
    const hits = [...lintExcellon(files.plated!).facts.hits, ...lintExcellon(files.nonPlated!).facts.hits];
    expect(hits.every((h) => h.x > 0 && h.x < 50 && h.y > 0 && h.y < 40)).toBe(true);
  });
  it('the drill checker rejects a file without units or with a hit before any tool', () => {
    expect(lintExcellon(files.plated!.replace('METRIC,TZ\n', '')).problems.join()).toMatch(/METRIC/);
    expect(lintExcellon(files.plated!.replace('T1\nX', 'X')).problems.join()).toMatch(/before a tool/);
  });
  it('writes no file for a kind of hole the board does not have', () => {
    expect(toExcellon(stripOnlyFixture())).toEqual({});
  });
});

/**
 * Golden files: every exporter's full text for the hand-made fixtures and each example design, compared in full
 * with test/fixtures/export/golden/ (regenerate with `npx tsx scripts/oracles/make-export-goldens.ts` and review
 * the diff). Each golden file is also run through the outside oracles, so what is frozen is a checked file:
 * ezdxf strict load + audit (DXF), our Gerber/Excellon rule checker and gerber-parser/plotter (Gerber, drill),
 * xmllint (SVG), poppler's pdfinfo (PDF), and the rendered copper area against the geometry within 0.5 % (the project's own rule).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { regionsArea } from '../../core/geometry/polygons.ts';
import { goldenFiles, goldenSources, type GoldenSource } from '../fixtures/export/golden-sources.ts';
import { lintExcellon, lintGerber } from '../../scripts/oracles/gerber-lint.ts';
import { gerberDarkArea, readBack } from '../../scripts/oracles/gerber-read.ts';
import { ezdxfAudit } from '../../scripts/oracles/dxf-audit.ts';

const DIR = join(import.meta.dirname, '..', 'fixtures', 'export', 'golden');
let sources: GoldenSource[] = [];
// Sizing the milled examples as made builds their cross-section tables first (seconds of CPU on a shared machine).
beforeAll(async () => { sources = await goldenSources(); }, 120_000);

describe('export golden files', () => {
  it('the golden folder holds exactly the files the sources produce', () => {
    const want = sources.flatMap((s) => Object.keys(goldenFiles(s.name, s.geometry))).sort();
    expect(readdirSync(DIR).sort()).toEqual(want);
  });

  it('every file matches its golden text in full', () => {
    for (const s of sources) {
      for (const [name, text] of Object.entries(goldenFiles(s.name, s.geometry))) {
        // On an intended change (an exporter, or the sizing/geometry behind an example), regenerate with
        // `npx tsx scripts/oracles/make-export-goldens.ts` and review the diff.
        expect(text, `${name} differs from its golden file; if intended, run npx tsx scripts/oracles/make-export-goldens.ts`).toBe(readFileSync(join(DIR, name), 'utf8'));
      }
    }
  });

  it('every golden file passes its outside oracle', async () => {
    for (const name of readdirSync(DIR)) {
      const text = readFileSync(join(DIR, name), 'utf8');
      if (name.endsWith('.dxf')) {
        const { code, report } = ezdxfAudit(text, name);
        expect([code, report.audit_errors, report.audit_fixes], name).toEqual([0, [], []]);
      } else if (name.endsWith('.gbr')) {
        expect(lintGerber(text).problems, name).toEqual([]);
        const r = await readBack(text);
        expect(r.warnings, name).toEqual([]);
        expect(r.units, name).toBe('mm');
      } else if (name.endsWith('.drl')) {
        expect(lintExcellon(text).problems, name).toEqual([]);
        expect((await readBack(text)).warnings, name).toEqual([]);
      } else if (name.endsWith('.pdf')) {
        const r = spawnSync('pdfinfo', ['-'], { input: text, encoding: 'utf8' }); // poppler-utils
        expect([r.status, r.stderr], name).toEqual([0, '']);
      } else if (name.endsWith('.svg')) {
        expect(spawnSync('xmllint', ['--noout', '-'], { input: text }).status, name).toBe(0);
      }
    }
  });

  it('every plated hole of every source lands on top copper, reading both files back (Gerber/Excellon cross-check)', async () => {
    for (const name of readdirSync(DIR).filter((n) => n.endsWith('-plated.drl'))) {
      const hits = lintExcellon(readFileSync(join(DIR, name), 'utf8')).facts.hits;
      expect(hits.length, name).toBeGreaterThan(0);
      const copper = await readBack(readFileSync(join(DIR, name.replace('-plated.drl', '-copper-top.gbr')), 'utf8'));
      for (const h of hits) {
        // The last fill containing the point decides: dark = copper there, clear = a hole in the copper.
        let dark = true, state = false;
        for (const o of copper.objects) {
          if (o.type === 'polarity') dark = o.polarity === 'dark';
          if (o.type === 'fill' && inside(h, (o.path as { start: number[] }[]).map((seg) => seg.start))) state = dark;
        }
        expect(state, `${name}: hole at (${h.x}, ${h.y}) mm is not on copper`).toBe(true);
      }
    }
  });

  it('the rendered copper of every source matches its geometry within 0.5 %', async () => {
    for (const s of sources) {
      const want = (regionsArea(s.geometry.copper) + regionsArea(s.geometry.groundCopper)) * 1e6;
      const text = readFileSync(join(DIR, `${s.name}-copper-top.gbr`), 'utf8');
      const got = (await gerberDarkArea(text, 20)).areaMm2;
      expect(Math.abs(got - want) / want, s.name).toBeLessThan(0.005);
    }
  });
});

/** Point in polygon by ray casting (even-odd). */
function inside(p: { x: number; y: number }, poly: number[][]): boolean {
  let c = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i], [xj, yj] = poly[j];
    if ((yi > p.y) !== (yj > p.y) && p.x < ((xj - xi) * (p.y - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}

/**
 * The files every example design exports through the one pipeline (exportDesign), stamped with the design's hash and
 * the version, read by the same outside readers as the golden files (export-golden.test.ts checks the unstamped
 * writers on fixtures):
 * - DXF R2007 and R12: ezdxf (Debian python3-ezdxf) strict loader + audit, zero errors and zero fixes; dxf-parser (npm)
 *   reads the same entities per layer as ezdxf (two readers agree);
 * - Gerber X2 and Excellon: our rule checker written from the Gerber Layer Format Specification (Ucamco) and
 *   gerber-parser + gerber-plotter (npm) with no warnings, units mm;
 * - SVG: xmllint well-formed, rendered by resvg (npm) with copper drawn.
 * And build and export agree: an example export refuses is exactly one whose shop check (what `build` prints) has errors.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import DxfParser from 'dxf-parser';
import { DesignPipeline, InputError, exportDesign, initPolygons, parseDesign, type DesignDoc, type ExportResult } from '../../core/index.ts';
import { ezdxfAudit } from '../../scripts/oracles/dxf-audit.ts';
import { lintExcellon, lintGerber } from '../../scripts/oracles/gerber-lint.ts';
import { readBack } from '../../scripts/oracles/gerber-read.ts';
import { darkArea } from '../../scripts/oracles/svg-raster.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const VERSION = '9.8.7-stamp';
const examples = readdirSync(EX).filter((f) => f.endsWith('.json')).sort();

interface Exported { name: string; revision: string; files: { name: string; text: string }[] }
const exported: Exported[] = [];
const refused: string[] = [];

beforeAll(async () => {
  await initPolygons();
  const pipeline = new DesignPipeline();
  for (const file of examples) {
    const parsed = parseDesign(readFileSync(join(EX, file), 'utf8'));
    if (!parsed.ok) throw new Error(`${file} is not a valid design`);
    const doc: DesignDoc = parsed.doc;
    const base = file.replace(/\.json$/, '');
    const errors = pipeline.check(doc).findings.filter((f) => f.severity === 'error');
    let main: ExportResult, r12: ExportResult;
    try {
      main = exportDesign(pipeline, doc, { formats: ['dxf', 'svg', 'gerber', 'drill'], base, version: VERSION });
      r12 = exportDesign(pipeline, doc, { formats: ['dxf'], base: `${base}-r12`, version: VERSION, dxfVersion: 'r12' });
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      refused.push(file);
      expect(errors.length, `${file}: export refused it, so build must list errors`).toBeGreaterThan(0);
      continue;
    }
    expect(errors, `${file}: export wrote it, so build must find no errors`).toEqual([]);
    exported.push({ name: file, revision: main.revision, files: [...main.files, ...r12.files] });
  }
}, 600_000);

describe('stamped exports of every example, read by outside parsers', () => {
  it('exports the examples build accepts (and refuses only those build refuses)', () => {
    expect(exported.length + refused.length).toBe(examples.length);
    expect(exported.length).toBeGreaterThan(0);
    expect(refused, "the examples are meant to build as drawn").toEqual([]);
  });

  it('stamps every DXF, Gerber, drill and SVG file with the design hash and the version', () => {
    for (const ex of exported) {
      for (const f of ex.files) {
        expect(f.text, f.name).toContain(ex.revision);
        expect(f.text, f.name).toContain(VERSION);
      }
    }
  });

  it('DXF (R2007 and R12): ezdxf strict load and audit clean; dxf-parser reads the same entities per layer', () => {
    for (const ex of exported) {
      for (const f of ex.files.filter((x) => x.name.endsWith('.dxf'))) {
        const { code, report } = ezdxfAudit(f.text, f.name);
        expect([code, report.strict, report.audit_errors, report.audit_fixes], `${f.name}: ${report.strict_error ?? ''}`).toEqual([0, true, [], []]);
        const parsed = new DxfParser().parseSync(f.text)!;
        const perLayer = (layers: string[]) => Object.fromEntries([...new Set(layers)].sort().map((l) => [l, layers.filter((x) => x === l).length]));
        expect(perLayer(parsed.entities.map((e) => e.layer)), f.name).toEqual(perLayer(report.entities.map((e) => e.layer)));
        expect(report.entities.length, f.name).toBeGreaterThan(0);
      }
    }
  }, 600_000);

  it('Gerber and Excellon: rule checker clean, gerber-parser/plotter read them in mm without warnings', async () => {
    for (const ex of exported) {
      for (const f of ex.files) {
        if (f.name.endsWith('.gbr')) {
          expect(lintGerber(f.text).problems, f.name).toEqual([]);
          const r = await readBack(f.text);
          expect([r.warnings, r.units], f.name).toEqual([[], 'mm']);
        } else if (f.name.endsWith('.drl')) {
          expect(lintExcellon(f.text).problems, f.name).toEqual([]);
          expect((await readBack(f.text)).warnings, f.name).toEqual([]);
        }
      }
    }
  }, 600_000);

  it('SVG: well-formed (xmllint) and rendered by resvg with copper on it', () => {
    for (const ex of exported) {
      for (const f of ex.files.filter((x) => x.name.endsWith('.svg'))) {
        expect(spawnSync('xmllint', ['--noout', '-'], { input: f.text }).status, f.name).toBe(0);
        expect(darkArea(f.text, 5).areaMm2, f.name).toBeGreaterThan(0);
      }
    }
  }, 600_000);
});

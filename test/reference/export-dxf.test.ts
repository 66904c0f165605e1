/**
 * DXF export checked by two outside readers:
 * - ezdxf (Debian python3-ezdxf), strict loader + audit: zero errors and zero fixes (scripts/oracles/audit_dxf.py);
 * - dxf-parser (npm): every vertex read back within 1 µm of the geometry (common practice: exported dimensions
 *   within 1 µm of the model after re-import), closed flags set, $INSUNITS = 4 (Autodesk DXF Reference: 4 = mm).
 */
import { describe, expect, it } from 'vitest';
import DxfParser from 'dxf-parser';
import { toDxf } from '../../core/export/dxf.ts';
import { toDxfR12 } from '../../core/export/dxf-r12.ts';
import { ezdxfAudit } from '../../scripts/oracles/dxf-audit.ts';
import { boardFixture, stripOnlyFixture, BEND_MM } from '../fixtures/export/hand-made.ts';

describe('DXF export (ezdxf strict load + audit)', () => {
  it('passes the strict loader and the audit with zero errors and zero fixes, in mm', () => {
    const { code, report } = ezdxfAudit(toDxf(boardFixture()));
    expect(report.strict, report.strict_error ?? '').toBe(true);
    expect(report.audit_errors).toEqual([]);
    expect(report.audit_fixes).toEqual([]);
    expect(code).toBe(0);
    expect(report.insunits).toBe(4); // Autodesk DXF Reference, $INSUNITS: 4 = millimetres
    expect(report.measurement).toBe(1); // $MEASUREMENT: 1 = metric
    expect(report.layers).toEqual(expect.arrayContaining(['COPPER', 'GROUND_COPPER', 'BOARD_EDGE', 'CLEAR_AREA', 'DRILLS', 'KEEPOUT']));
  });

  it('writes one closed polyline per outer ring and per hole, on the right layers, and circles for drills', () => {
    const g = boardFixture();
    const { report } = ezdxfAudit(toDxf(g));
    const count = (layer: string) => report.entities.filter((e) => e.layer === layer).length;
    expect(count('COPPER')).toBe(2);
    expect(count('GROUND_COPPER')).toBe(3); // outer + two windows
    expect(count('CLEAR_AREA')).toBe(6); // three regions, each with one hole
    expect(count('BOARD_EDGE')).toBe(1);
    const polys = report.entities.filter((e) => e.type === 'LWPOLYLINE');
    expect(polys.every((e) => e.closed)).toBe(true);
    const bend = polys.find((e) => e.layer === 'COPPER' && e.points!.length === 7)!;
    // Closed without a repeated last vertex (DXF reference, open format: LWPOLYLINE closed flag (from memory)), vertices as designed.
    expect(bend.points!.map((p) => [p[0], p[1]])).toEqual(BEND_MM);
    const circles = report.entities.filter((e) => e.type === 'CIRCLE');
    expect(circles.map((c) => c.radius).sort()).toEqual([0.4, 0.4, 0.65, 1.6]);
    expect(circles.every((c) => c.layer === 'DRILLS')).toBe(true);
  });

  it('is rejected by the same audit when truncated (the oracle can fail)', () => {
    const text = toDxf(boardFixture());
    const { code, report } = ezdxfAudit(text.slice(0, Math.floor(text.length / 2)), 'truncated.dxf');
    expect(report.strict).toBe(false);
    expect(code).not.toBe(0);
  });
});

describe('DXF export read back with dxf-parser', () => {
  const parse = (text: string) => new DxfParser().parseSync(text)!;

  it('gives every vertex within 1 µm of the geometry, origin at the board corner', () => {
    const g = boardFixture();
    const dxf = parse(toDxf(g));
    expect(dxf.header.$INSUNITS).toBe(4);
    const copper = dxf.entities.filter((e) => e.layer === 'COPPER') as unknown as { vertices: { x: number; y: number }[]; shape: boolean }[];
    const want = g.copper.map((r) => r.outer.map((p) => [p.x * 1e3, p.y * 1e3]));
    expect(copper.length).toBe(want.length);
    copper.forEach((e, i) => {
      expect(e.shape).toBe(true); // closed flag
      e.vertices.forEach((v, k) => {
        expect(Math.abs(v.x - want[i][k][0])).toBeLessThan(1e-3);
        expect(Math.abs(v.y - want[i][k][1])).toBeLessThan(1e-3);
      });
    });
  });

  it('moves the board corner to (0, 0) with origin board and keeps design coordinates with origin design', () => {
    const g = stripOnlyFixture(); // strip at x 10…20 mm, y 20…22 mm, no outline
    const xs = (text: string) => (parse(text).entities[0] as unknown as { vertices: { x: number; y: number }[] }).vertices;
    expect(xs(toDxf(g, { origin: 'board' })).map((v) => [v.x, v.y])).toEqual([[0, 0], [10, 0], [10, 2], [0, 2]]);
    expect(xs(toDxf(g, { origin: 'design' })).map((v) => [v.x, v.y])).toEqual([[10, 20], [20, 20], [20, 22], [10, 22]]);
  });

  it('mirrors left-right within the board box and keeps outer rings counter-clockwise', () => {
    const g = boardFixture();
    const dxf = parse(toDxf(g, { mirror: true, layers: ['copper'] }));
    const bend = (dxf.entities[0] as unknown as { vertices: { x: number; y: number }[] }).vertices;
    // Mirror of x about the 50 mm board: x' = 50 − x; order reversed so the signed area stays positive.
    const want = BEND_MM.map(([x, y]) => [50 - x, y]).reverse();
    expect(bend.map((v) => [v.x, v.y])).toEqual(want);
    let a = 0;
    bend.forEach((p, i) => { const q = bend[(i + 1) % bend.length]; a += p.x * q.y - q.x * p.y; });
    expect(a).toBeGreaterThan(0);
  });

  it('$HANDSEED is the next free handle, above every handle used (DXF Reference, HEADER: "Next available handle")', () => {
    const lines = toDxf(boardFixture()).split('\n');
    let max = 0, seed = -1;
    for (let i = 0; i + 1 < lines.length; i += 2) {
      const code = lines[i].trim();
      if (code === '9' && lines[i + 1] === '$HANDSEED') { seed = parseInt(lines[i + 3], 16); i += 2; continue; }
      if (code === '5' || code === '105') max = Math.max(max, parseInt(lines[i + 1], 16));
    }
    expect(max).toBeGreaterThan(0);
    expect(seed).toBe(max + 1);
  });
  it('is deterministic: the same geometry gives byte-identical text (handle counter reset)', () => {
    expect(toDxf(boardFixture())).toBe(toDxf(boardFixture()));
  });
});

describe('DXF R12 (AC1009) variant for cutters and older importers', () => {
  it('passes ezdxf strict load and audit with zero errors and zero fixes, same entities as the R2007 file', () => {
    const g = boardFixture();
    const r12 = ezdxfAudit(toDxfR12(g), 'r12.dxf');
    const r2007 = ezdxfAudit(toDxf(g), 'r2007.dxf');
    expect([r12.code, r12.report.strict, r12.report.audit_errors, r12.report.audit_fixes]).toEqual([0, true, [], []]);
    expect(r12.report.version).toBe('AC1009'); // DXF Reference: AC1009 = R11/R12
    expect(r12.report.entities.every((e) => e.type === 'POLYLINE' ? e.closed : e.type === 'CIRCLE')).toBe(true);
    // Same geometry as the LWPOLYLINE file: layer, closed flag and every vertex.
    const strip = (es: typeof r12.report.entities) => es.map((e) => [e.layer, e.closed ?? null, e.points?.map((p) => [p[0], p[1]]) ?? e.center, e.radius ?? null]);
    expect(strip(r12.report.entities)).toEqual(strip(r2007.report.entities));
  });
  it('reads back with dxf-parser as closed POLYLINEs', () => {
    const dxf = new DxfParser().parseSync(toDxfR12(stripOnlyFixture()))!;
    const e = dxf.entities[0] as unknown as { type: string; shape: boolean; vertices: { x: number; y: number }[] };
    expect(e.type).toBe('POLYLINE');
    expect(e.shape).toBe(true);
    expect(e.vertices.map((v) => [v.x, v.y])).toEqual([[0, 0], [10, 0], [10, 2], [0, 2]]);
  });
});

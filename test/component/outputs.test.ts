/**
 * The editor's outputs job (the same code the worker runs) read back by outside parsers:
 *  - dxf-parser 1.1.2 in Node: $INSUNITS 4 = millimetres (DXF reference, header variables),
 *    closed LWPOLYLINEs on the copper layer, the board's size and the copper's extent in mm;
 *  - ezdxf via Debian python3: the file reads and audits with no errors.
 * Mirror: left–right mirroring maps x to (board width − x) (our export frame, core/export/frame.ts).
 */
import { describe, expect, it } from 'vitest';
import DxfParser from 'dxf-parser';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { exportJob, geometryJob, checkJob, setPolygonInit } from '../../renderer/src/worker/jobs.ts';
import { initPolygons } from '../../core/geometry/index.ts';
import { parseDesign } from '../../core/design/index.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

// Under happy-dom the engine's loader believes it is in a page; hand it the wasm file's path on disk.
const wasm = join(process.cwd(), 'node_modules/clipper2-wasm/dist/es/clipper2z.wasm');
setPolygonInit(() => initPolygons({ locateFile: () => wasm }));

const demo = () => { const r = parseDesign(exampleText('demo')!); if (!r.ok) throw new Error('demo unreadable'); return r.doc; };

interface Ent { type: string; layer: string; shape?: boolean; vertices?: { x: number; y: number }[] }

describe('outputs from the editor', () => {
  it('writes a DXF in mm whose copper matches the board geometry, mirrored on request', async () => {
    const doc = demo();
    const g = await geometryJob({ doc });
    const plain = await exportJob({ doc, layers: ['copper', 'outline'], mirror: false, formats: ['dxf'], base: 'demo', version: 'test' });
    const mirrored = await exportJob({ doc, layers: ['copper', 'outline'], mirror: true, formats: ['dxf'], base: 'demo', version: 'test' });
    expect(plain.files.map((f) => f.name)).toEqual(['demo.dxf']);
    const read = (text: string) => new DxfParser().parseSync(text) as unknown as { header: Record<string, unknown>; entities: Ent[] };
    const a = read(plain.files[0]!.data), b = read(mirrored.files[0]!.data);
    expect(a.header.$INSUNITS).toBe(4);
    const copper = (d: typeof a) => d.entities.filter((e) => e.layer === 'COPPER');
    const rings = g.copper.reduce((n, r) => n + 1 + r.holes.length, 0);
    expect(copper(a).length).toBe(rings);
    expect(copper(a).every((e) => e.type === 'LWPOLYLINE' && e.shape === true)).toBe(true);
    // Board frame: the outline's lower-left corner is (0, 0); copper lies within the board.
    const ob = g.outline!.outer;
    const W = (Math.max(...ob.map((p) => p.x)) - Math.min(...ob.map((p) => p.x))) * 1000;
    const xs = (d: typeof a) => copper(d).flatMap((e) => e.vertices!.map((v) => v.x));
    expect(Math.min(...xs(a))).toBeGreaterThanOrEqual(-1e-6);
    expect(Math.max(...xs(a))).toBeLessThanOrEqual(W + 1e-6);
    // Mirror: every x becomes W − x, so the extremes swap.
    expect(Math.min(...xs(b))).toBeCloseTo(W - Math.max(...xs(a)), 5);
    expect(Math.max(...xs(b))).toBeCloseTo(W - Math.min(...xs(a)), 5);
    // The preview is the SVG of the same layers.
    expect(plain.preview).toMatch(/^<\?xml|^<svg/);
  });

  it('the DXF passes ezdxf audit (Debian python3-ezdxf)', async () => {
    const out = await exportJob({ doc: demo(), layers: ['copper', 'outline', 'drills'], mirror: false, formats: ['dxf'], base: 'demo', version: 'test' });
    const file = join(mkdtempSync(join(tmpdir(), 'sw-dxf-')), 'demo.dxf');
    writeFileSync(file, out.files[0]!.data);
    const py = 'import sys, ezdxf\nd = ezdxf.readfile(sys.argv[1])\na = d.audit()\nprint(len(a.errors), d.header.get("$INSUNITS"))';
    const res = execFileSync('python3', ['-c', py, file], { env: { ...process.env, PATH: execFileSync('getconf', ['PATH']).toString().trim() } }).toString().trim();
    expect(res).toBe('0 4');
  });

  it('writes Gerber, drill and mask files with the names the shop expects', async () => {
    const out = await exportJob({ doc: demo(), layers: ['copper'], mirror: false, formats: ['gerber', 'drill', 'mask'], base: 'demo', version: 'test' });
    const names = out.files.map((f) => f.name);
    expect(names).toContain('demo-copper-top.gbr');
    expect(names).toContain('demo-profile.gbr');
    expect(names).toContain('demo-mask.svg');
    // The same file set the CLI writes for a board with a ground plane (README export table): bottom copper too.
    expect(names).toContain('demo-copper-bottom.gbr');
    expect(out.files.find((f) => f.name === 'demo-copper-bottom.gbr')!.data).toMatch(/%TF\.FileFunction,Copper,L2,Bot\*%/);
    // Gerber X2 files end with M02 (Ucamco Gerber Layer Format Specification, end of file).
    expect(out.files.find((f) => f.name === 'demo-copper-top.gbr')!.data.trim().endsWith('M02*')).toBe(true);
  });

  it('the shop check trips the 1 dB loss budget on the FR-4 demo (common practice: ≈1.5–2 dB per path) and says what to fix', async () => {
    const { findings } = await checkJob({ doc: demo() });
    expect(findings.map((f) => f.code)).toContain('loss-budget');
    for (const f of findings) {
      expect(f.message.length).toBeGreaterThan(0);
      expect(f.fix.length).toBeGreaterThan(0);
    }
  });
});

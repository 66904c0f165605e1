/**
 * G-code read back by an independent reader (gcode-toolpath, npm) and re-traced against the board it was made for:
 * every example design, in mm and in inches, and the same checks failing on broken files (so a pass means something).
 * Checks and tolerances: test/reference/gcode-oracle-checks.ts.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { exportGcode, initPolygons, parseDesign, PROCESS_DEFAULT, type DesignDoc } from '../../core/index.ts';
import { checkExport, fileFrame } from './gcode-oracle-checks.ts';

const fileFrameOf = (ex: ReturnType<typeof exportGcode>) => fileFrame(ex.geometry);
import { retrace } from '../../scripts/oracles/gcode-retrace.ts';

const DIR = join(import.meta.dirname, '../../assets/examples');
const INFO = { application: 'Stripwright', version: '0.1.0' };
const CHECK = { workArea: [200, 150] as [number, number], boardAt: [5, 5] as [number, number], breakthrough: 0.3, cutoutTool: 1 };

function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(DIR, name), 'utf8'));
  if (!r.ok) throw new Error(`${name} does not load`);
  return r.doc;
}

beforeAll(() => initPolygons());

describe('every example re-traced through gcode-toolpath', () => {
  for (const name of readdirSync(DIR).filter((f) => f.endsWith('.json')).sort()) {
    it(`${name}: isolated, on its holes, true scale, inside the work area (mm and inch)`, () => {
      const doc = example(name);
      // An etched example is milled with the default V-bit (the user switches the process; as-is it is refused below).
      const millable: DesignDoc = doc.process.kind === 'etch' ? { ...doc, process: { ...PROCESS_DEFAULT } } : doc;
      const mm = exportGcode(millable, {}, { base: 'b', ...INFO });
      const r = checkExport(millable, mm, 'mm', CHECK);
      expect(r.problems).toEqual([]);
      const inch = exportGcode(millable, { units: 'inch' }, { base: 'b', ...INFO });
      const ri = checkExport(millable, inch, 'inch', CHECK);
      expect(ri.problems).toEqual([]);
      // True scale across units: the same moves, inch files read back ×25.4 by the reader, within the inch rounding.
      r.traced.forEach((t, i) => {
        const u = ri.traced[i]!;
        expect(u.moves.length).toBe(t.moves.length);
        let worst = 0;
        t.moves.forEach((m, k) => { const n = u.moves[k]!; worst = Math.max(worst, Math.abs(m.b.x - n.b.x), Math.abs(m.b.y - n.b.y), Math.abs(m.b.z - n.b.z)); });
        expect(worst).toBeLessThan(0.0013 + 0.0005); // half of 0.1 thou plus half of 1 µm
      });
    }, 240_000); // the raster of the 140 mm demo board takes a while on a busy machine
  }
  it('an etch process is refused with the way out', () => {
    const doc = example('wilkinson-2g45.json');
    expect(doc.process.kind).toBe('etch');
    expect(() => exportGcode(doc, {}, { base: 'b', ...INFO })).toThrow(/process\.kind.*V-bit or an end mill/);
  });
});

describe('the checks catch broken files', () => {
  const doc = example('shorted-stub-match.json');
  let good: ReturnType<typeof exportGcode>;
  // One isolation pass, so leaving a loop out leaves the island open.
  beforeAll(() => { good = exportGcode(doc, { passes: 1 }, { base: 'b', ...INFO }); });
  const broken = (edit: (files: typeof good.files) => void) => {
    const files = good.files.map((f) => ({ ...f }));
    edit(files);
    return checkExport(doc, { ...good, files }, 'mm', CHECK).problems.join('\n');
  };
  it('the good export passes', () => expect(checkExport(doc, good, 'mm', CHECK).problems).toEqual([]));
  it('a cut moved 20 µm into the copper', () => {
    expect(broken((f) => { f[0]!.text = f[0]!.text.replace(/^G1 X([\d.]+) Y([\d.]+)$/gm, (_, x: string, y: string) => `G1 X${(Number(x) + 0.02).toFixed(3)} Y${y}`); })).toMatch(/into copper|joined|enclosed/);
  });
  it('an isolation loop left out', () => {
    expect(broken((f) => { f[0]!.text = f[0]!.text.replace(/G1 Z-0\.05 F50\n(G1 [^\n]*\n)+/g, ''); })).toMatch(/not enclosed|joined/);
  });
  it('a drill moved by 0.1 mm', () => {
    expect(broken((f) => { const d = f.find((x) => x.name.includes('drill'))!; d.text = d.text.replace(/^G0 X([\d.]+) Y/m, (_, x: string) => `G0 X${(Number(x) + 0.1).toFixed(3)} Y`); })).toMatch(/no 0\.80 mm drill|no hole/);
  });
  it('a scale error (mm written as inch)', () => {
    expect(broken((f) => { for (const x of f) x.text = x.text.replace(/^G90 G17 G21$/m, 'G90 G17 G20'); })).toMatch(/units G20|outside the work area|cutout spans/);
  });
  it('the reader flattens arcs and converts inches (a full circle of radius 1 in)', () => {
    const t = retrace('G90 G17 G20\nG0 X1 Y0\nG1 Z-0.01 F10\nG2 X-1 Y0 I-1 J0\nG2 X1 Y0 I1 J0\nM2\n');
    const far = Math.max(...t.moves.map((m) => Math.hypot(m.b.x, m.b.y)));
    expect(t.arcs).toBe(2);
    expect(far).toBeCloseTo(25.4, 6);
    expect(Math.min(...t.moves.filter((m) => !m.rapid).map((m) => m.b.y))).toBeCloseTo(-25.4, 2); // clockwise from (1, 0) passes (0, −1)
  });
});

describe('holes larger than the largest drill, milled with arcs', () => {
  it('the 0.8 mm vias milled by a 0.5 mm end mill: G2 circles whose swept edge is the hole (read back by gcode-toolpath)', () => {
    const doc = example('shorted-stub-match.json');
    const ex = exportGcode(doc, { maxDrill: 0.6e-3, cutoutTool: 0.5e-3, toolChange: true }, { base: 'b', ...INFO });
    expect(ex.files.map((f) => f.name)).toEqual(['b-T1-isolation.nc', 'b-T2-cutout.nc']);
    const text = ex.files[1]!.text;
    expect(text).toMatch(/^T2 M6$/m); // the optional tool change
    const t = retrace(text);
    expect(t.arcs).toBeGreaterThan(0);
    const F = fileFrameOf(ex);
    for (const d of F.drills) {
      // Cutting moves within the hole's reach, at full depth: their farthest point from the centre plus the tool
      // radius is the hole's radius (within the 1 µm coordinate rounding and the reader's 0.5 µm arc flattening).
      const deep = t.moves.filter((m) => !m.rapid && m.b.z <= -(doc.substrate.h + doc.substrate.t) * 1e3 && Math.hypot(m.b.x - d.x, m.b.y - d.y) < d.d);
      expect(deep.length).toBeGreaterThan(8);
      const far = Math.max(...deep.map((m) => Math.hypot(m.b.x - d.x, m.b.y - d.y)));
      const near = Math.min(...deep.map((m) => Math.hypot(m.b.x - d.x, m.b.y - d.y)));
      expect(Math.abs(far + 0.25 - d.d / 2)).toBeLessThan(0.0015);
      expect(Math.abs(near + 0.25 - d.d / 2)).toBeLessThan(0.0015);
    }
  });
});

/**
 * The two faces of export share one core pipeline (core/pipeline exportDesign), so:
 *  - for every example design and the same options, `stripwright export` (run in-process through the CLI's own
 *    dispatcher, writing real files) and the app's worker job (renderer/src/worker/jobs.ts exportJob, the code the
 *    compute worker runs) give the same file names and byte-identical files;
 *  - `export` refuses (exit 1, no file written, the reason on stderr) every design `build` refuses.
 * The checks compare the two faces with each other and with `build`; the files' contents are checked against outside
 * oracles in test/cli/export.test.ts and test/reference/export-*.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../cli/main.ts';
import { exportJob } from '../../renderer/src/worker/jobs.ts';
import { parseDesign, exportBase, processCut, type DesignDoc } from '../../core/index.ts';
import { VERSION } from '../../cli/version.ts';

const EXAMPLES = join(import.meta.dirname, '..', '..', 'assets', 'examples');
const examples = readdirSync(EXAMPLES).filter((f) => f.endsWith('.json')).sort();

async function cli(args: string[], cwd: string) {
  const out: string[] = [], err: string[] = [];
  const code = await runCli(args, { out: (t) => out.push(t), err: (t) => err.push(t), cwd });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}
const load = (text: string): DesignDoc => { const r = parseDesign(text); if (!r.ok) throw new Error(r.errors[0]!.message); return r.doc; };
const filesIn = (dir: string) => Object.fromEntries(readdirSync(dir).sort().map((n) => [n, readFileSync(join(dir, n), 'utf8')]));

/** Two option sets: the defaults, and every option changed (R12, mirror, design origin, bias, layers with isolation, mask on Letter, negative). */
const OPTION_SETS = [
  { name: 'defaults', flags: [] as string[], request: {} },
  {
    name: 'every option',
    flags: ['--mirror', '--origin', 'design', '--bias', '0.035mm', '--dxf-version', 'r12', '--layers', 'copper,outline,drills,isolation', '--style', 'outline', '--page', 'letter', '--polarity', 'negative'],
    request: { mirror: true, origin: 'design' as const, bias: 0.035e-3, dxfVersion: 'r12' as const, layers: ['copper', 'outline', 'drills', 'isolation'], svgStyle: 'outline' as const, maskPage: 'letter' as const, maskPolarity: 'negative' as const },
  },
];

describe('export: the CLI and the app give the same bytes', () => {
  for (const f of examples) {
    it(`${f}: every format, default and changed options`, { timeout: 120_000 }, async () => {
      const text = readFileSync(join(EXAMPLES, f), 'utf8');
      const doc = load(text);
      const milled = processCut(doc.process) !== null;
      // An etched design has no isolation width of its own: the override is the CLI's --tool and the app's field.
      const formats = ['dxf', 'svg', 'gerber', 'drill', 'mask', 'mask-pdf', ...(milled ? ['gcode'] : [])];
      for (const set of OPTION_SETS) {
        const dir = mkdtempSync(join(tmpdir(), 'sw-faces-'));
        const stem = exportBase(doc.name);
        writeFileSync(join(dir, `${stem}.json`), text);
        const tool = !milled && set.name !== 'defaults' ? { flags: ['--tool', '0.2mm'], request: { tool: 0.2e-3 } } : { flags: [], request: {} };
        const r = await cli(['export', `${stem}.json`, '--format', formats.join(','), '--out', 'out/', ...set.flags, ...tool.flags], dir);
        expect(r.code, r.stderr).toBe(0);
        const fromCli = filesIn(join(dir, 'out'));
        const app = await exportJob({ doc, formats, base: stem, version: VERSION, ...set.request, ...tool.request });
        const fromApp = Object.fromEntries(app.files.map((x) => [x.name, x.data]).sort(([a], [b]) => (a! < b! ? -1 : 1)));
        expect(Object.keys(fromApp)).toEqual(Object.keys(fromCli));
        for (const name of Object.keys(fromCli)) expect(fromApp[name], `${set.name}: ${name}`).toBe(fromCli[name]);
        // The design's hash and the version are written; no date or time is.
        const gerber = Object.entries(fromCli).find(([n]) => n.endsWith('-copper-top.gbr'))![1];
        expect(gerber).toMatch(new RegExp(`G04 design [0-9a-f]{8}:[0-9a-z]+\\*`));
        expect(gerber).toContain(VERSION);
        const dxf = Object.entries(fromCli).find(([n]) => n.endsWith('.dxf'))![1];
        expect(dxf).toMatch(new RegExp(`999\nMade by design [0-9a-f]{8}:[0-9a-z]+, Stripwright ${VERSION.replace(/\./g, '\\.')}`));
        for (const t of Object.values(fromCli)) expect(t).not.toMatch(/20\d\d-\d\d-\d\d|\d\d:\d\d:\d\d/);
      }
    });
  }
});

/** Designs `build` refuses, made from the examples (each change says what it breaks). */
function refusedDesigns(): { why: string; text: string }[] {
  const base = JSON.parse(readFileSync(join(EXAMPLES, 'open-stub-match.json'), 'utf8'));
  const shortStub = structuredClone(base);
  shortStub.segments.find((s: { id: string }) => s.id === 'stub').length = { by: 'length', length: 0.0001 };
  const unfinished = structuredClone(base);
  // Drop the stub: its open end is left with no segment (an unfinished network, kept as drawn on load).
  unfinished.segments = unfinished.segments.filter((s: { id: string }) => s.id !== 'stub');
  const demo = JSON.parse(readFileSync(join(EXAMPLES, 'demo.json'), 'utf8'));
  const tooLarge = structuredClone(demo);
  tooLarge.frequency = { f0: 20e6, band: { start: 10e6, stop: 30e6 } };
  return [
    { why: 'a stub shorter than its end correction', text: JSON.stringify(shortStub) },
    { why: 'an unfinished network', text: JSON.stringify(unfinished) },
    { why: 'a board larger than the layout limit', text: JSON.stringify(tooLarge) },
  ];
}

describe('export refuses what build refuses', () => {
  for (const d of refusedDesigns()) {
    it(`${d.why}: build exits 1, export exits 1, writes nothing and says why`, { timeout: 120_000 }, async () => {
      const dir = mkdtempSync(join(tmpdir(), 'sw-refuse-'));
      writeFileSync(join(dir, 'd.json'), d.text);
      const b = await cli(['build', 'd.json'], dir);
      expect(b.code).toBe(1);
      const e = await cli(['export', 'd.json', '--format', 'dxf,gerber,drill,mask-pdf', '--out', 'out/'], dir);
      expect(e.code).toBe(1);
      expect(e.stderr).toMatch(/cannot be exported as drawn; nothing was written/);
      expect(readdirSync(dir)).toEqual(['d.json']);
      // The app's export job refuses the same design with the same reason.
      const doc = load(d.text);
      await expect(exportJob({ doc, formats: ['dxf'], base: 'd', version: VERSION })).rejects.toThrow();
    });
  }
  it('every example builds and exports (exit 0 both)', { timeout: 300_000 }, async () => {
    for (const f of examples) {
      const dir = mkdtempSync(join(tmpdir(), 'sw-ok-'));
      writeFileSync(join(dir, 'd.json'), readFileSync(join(EXAMPLES, f), 'utf8'));
      expect((await cli(['build', 'd.json'], dir)).code, f).toBe(0);
      expect((await cli(['export', 'd.json', '--format', 'gerber', '--out', 'out/'], dir)).code, f).toBe(0);
    }
  });
});

import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cli } from './cli-basics.test.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');

describe('stripwright build', () => {
  it('prints the sized pieces, paths and findings for a valid design and exits 0', () => {
    const r = cli(['build', join(EX, 'wilkinson-2g45.json')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/piece\s+kind\s+Z0 Ω\s+W mm\s+L mm\s+deg/);
    expect(r.stdout).toMatch(/arm a, first leg\s+line\s+70\.71/); // pieces by their labels
    expect(r.stdout).toMatch(/Paths: Outputs balanced/);
    expect(r.stdout).toMatch(/va\s+90\.0° bend\s+arc R 2\.000 mm/);
    expect(r.stdout).toMatch(/Result: can be built as drawn\./);
  });
  it('--json gives the documented fields', () => {
    const r = cli(['build', join(EX, 'open-stub-match.json'), '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.ok).toBe(true);
    const stub = j.pieces.find((p: { id: string }) => p.id === 'stub');
    for (const k of ['id', 'kind', 'z0_ohm', 'width_m', 'length_m', 'deg_at_f0', 'compensations']) expect(stub).toHaveProperty(k);
    expect(stub.compensations.some((c: { model: string; applied: boolean }) => c.model === 'open-end' && c.applied)).toBe(true);
    expect(j.paths[0].paths[0].to).toBe('load');
    const end = j.nodes.find((n: { id: string }) => n.id === 'stubend');
    expect(end.open_dl_m).toBeCloseTo(stub.compensations.find((c: { model: string }) => c.model === 'open-end').amount_m, 12);
    expect(Array.isArray(j.findings)).toBe(true);
  });
  it('exits 1 and lists the errors for a design that cannot be built', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-build-'));
    const file = join(dir, 'bad.json');
    const doc = JSON.parse(readFileSync(join(EX, 'open-stub-match.json'), 'utf8'));
    // Make the stub far shorter than its open-end correction.
    const stub = doc.segments.find((s: { id: string }) => s.id === 'stub');
    stub.length = { by: 'length', length: 0.0001 };
    writeFileSync(file, JSON.stringify(doc));
    const r = cli(['build', file]);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/ERROR\s+layout: piece stub is 0\.100 mm long/);
    expect(r.stderr).toMatch(/cannot be built as drawn/);
    const j = JSON.parse(cli(['build', file, '--json']).stdout);
    expect(j.ok).toBe(false);
    expect(j.findings.find((f: { severity: string }) => f.severity === 'error').subjects).toEqual(['stub']);
  });
  it('the demo with its quarter-wave piece made an 0805 part builds (no internal geometry message)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-build-'));
    const file = join(dir, 'part.json');
    const doc = JSON.parse(readFileSync(join(EX, 'demo.json'), 'utf8'));
    const i = doc.segments.findIndex((s: { id: string }) => s.id === 'qwl');
    const q = doc.segments[i];
    doc.segments[i] = { id: q.id, kind: 'lumped', a: q.a, b: q.b, part: 'resistor', value: 100, size: '0805', width: q.width };
    writeFileSync(file, JSON.stringify(doc));
    const r = cli(['build', file]);
    expect(`${r.stdout}${r.stderr}`).not.toMatch(/regions\[|ring of at least/);
    expect(r.stdout).toMatch(/qwl\s+lumped/);
  });
  it('reports sizing problems, not geometry, for an impedance out of range and a board beyond the size limit', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-build-'));
    const doc = JSON.parse(readFileSync(join(EX, 'demo.json'), 'utf8'));
    doc.segments.find((s: { id: string }) => s.id === 'qwl').width = { by: 'z0', z0: 5000 };
    writeFileSync(join(dir, 'z.json'), JSON.stringify(doc));
    const z = cli(['build', join(dir, 'z.json')]);
    expect(z.code).toBe(1);
    expect(z.stdout).toMatch(/ERROR\s+layout: piece qwl/);
    expect(`${z.stdout}${z.stderr}`).not.toMatch(/regions\[|ring of at least/);
    const low = JSON.parse(readFileSync(join(EX, 'wilkinson-2g45.json'), 'utf8'));
    low.frequency = { f0: 1e6, band: { start: 1e6, stop: 2e6 } };
    writeFileSync(join(dir, 'low.json'), JSON.stringify(low));
    const j = JSON.parse(cli(['build', join(dir, 'low.json'), '--json']).stdout);
    expect(j.ok).toBe(false);
    expect(j.findings[0].message).toMatch(/more than the 1000 mm a side/);
    const ex = cli(['export', join(dir, 'low.json'), '--format', 'svg', '--out', join(dir, 'low.svg')]);
    expect(ex.code).toBe(1);
    expect(ex.stderr).toMatch(/more than the 1000 mm a side/);
  });
  it('exits 1 with the parser’s messages for a file that is not a design', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-build-'));
    const file = join(dir, 'junk.json');
    writeFileSync(file, '{"format": "something-else"}');
    const r = cli(['build', file]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/is not a valid design/);
    expect(cli(['build', join(dir, 'missing.json')]).stderr).toMatch(/no such file/);
  });
  it('--from/--to reports chosen paths as a matched group; an unknown port is an error naming the ports', () => {
    const r = cli(['build', join(EX, 'branchline-10g4.json'), '--from', 'p1', '--to', 'p2,p4', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.paths).toHaveLength(1);
    expect(j.paths[0].matched).toBe(true);
    expect(j.paths[0].paths.map((p: { to: string }) => p.to)).toEqual(['p2', 'p4']);
    const bad = cli(['build', join(EX, 'branchline-10g4.json'), '--from', 'nope', '--to', 'p2']);
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/from: expected a port of this design \(input, through, coupled, isolated; a label or an id\)/);
    expect(cli(['build', join(EX, 'branchline-10g4.json'), '--from', 'p1']).code).toBe(2);
  });
  it('exits 2 for a bad command line', () => {
    expect(cli(['build']).code).toBe(2);
    expect(cli(['build', 'a.json', 'b.json']).code).toBe(2);
    const r = cli(['build', join(EX, 'demo.json'), '--tolerance', 'lots']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--tolerance: expected an angle/);
    expect(cli(['build', join(EX, 'demo.json'), '--frobnicate']).code).toBe(2);
  });
  it('reports every junction per piece (model, in the sweep, validity, residual) and takes --junctions ideal|modelled', () => {
    const file = join(EX, 'branchline-10g4.json');
    const r = cli(['build', file]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Junctions \(modelled;/);
    expect(r.stdout).toMatch(/shunt arm \(shunt1\)\s+j1\s+tee \(Hammerstad\)\s+branch\s+0\.\d{3}\s+yes\s+0\.00°, -\d+\.\d dB/);
    const j = JSON.parse(cli(['build', file, '--json']).stdout);
    expect(j.junctions).toBe('modelled');
    const tee = j.pieces.find((p: { id: string }) => p.id === 'shunt1').compensations.filter((c: { model: string }) => c.model === 'tee-planes');
    expect(tee).toHaveLength(2);
    for (const c of tee) expect(c).toMatchObject({ applied: true, junction: { kind: 'tee', role: 'branch', modelled: true, inRange: true } });
    expect(j.nodes.find((n: { id: string }) => n.id === 'j1').tee).toMatchObject({ branch: 'shunt1', modelled: true });
    const ideal = JSON.parse(cli(['build', file, '--json', '--junctions', 'ideal']).stdout);
    expect(ideal.junctions).toBe('ideal');
    const shunt = (x: typeof j) => x.pieces.find((p: { id: string }) => p.id === 'shunt1');
    // Modelled: the shunt arm's copper runs past both junction centres by its plane shift.
    expect(shunt(j).span_m - shunt(ideal).span_m).toBeCloseTo(-2 * tee[0].amount_m, 9);
    const bad = cli(['build', file, '--junctions', 'sometimes']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--junctions must be modelled or ideal/);
  });
});

describe('build --proximity-limit', () => {
  it('flags two runs 0.8 mm apart at the default 3h, not at 0.3h; a bad limit is refused naming the option', async () => {
    const { newDesign, serializeDesign } = await import('../../core/index.ts');
    const doc = newDesign({ name: 'two runs', substrate: { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 }, f0: 2.45e9, process: { kind: 'etch', edgeBias: 0, minFeature: 0.1e-3 } });
    const port = (id: string, x: number, y: number, heading: number) => ({ id, kind: 'port' as const, zRef: 50, heading, at: { x, y } });
    doc.nodes = [port('a1', 0, 0, 0), port('a2', 0.015, 0, Math.PI), port('b1', 0, -3.8e-3, 0), port('b2', 0.015, -3.8e-3, Math.PI)];
    const seg = (id: string, a: string, b: string) => ({ id, kind: 'line' as const, a, b, width: { by: 'width' as const, width: 3e-3 }, length: { by: 'length' as const, length: 0.015 } });
    doc.segments = [seg('run-a', 'a1', 'a2'), seg('run-b', 'b1', 'b2')];
    const file = join(mkdtempSync(join(tmpdir(), 'sw-near-')), 'near.json');
    writeFileSync(file, serializeDesign(doc));
    const near = (extra: string[]) => JSON.parse(cli(['build', file, '--json', ...extra]).stdout).findings.filter((f: { code: string }) => f.code === 'proximity').length;
    expect(near([])).toBe(1);
    expect(near(['--proximity-limit', '0.3h'])).toBe(0);
    expect(near(['--proximity-limit', '1mm'])).toBe(1);
    const bad = cli(['build', file, '--proximity-limit', '3 furlongs']);
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toMatch(/proximity-limit/);
  });
  it('reads the design\'s own limit (format 11) without the option; the option overrides it', async () => {
    const { newDesign, serializeDesign } = await import('../../core/index.ts');
    const doc = newDesign({ name: 'two runs', substrate: { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 }, f0: 2.45e9, process: { kind: 'etch', edgeBias: 0, minFeature: 0.1e-3 } });
    const port = (id: string, x: number, y: number, heading: number) => ({ id, kind: 'port' as const, zRef: 50, heading, at: { x, y } });
    doc.nodes = [port('a1', 0, 0, 0), port('a2', 0.015, 0, Math.PI), port('b1', 0, -3.8e-3, 0), port('b2', 0.015, -3.8e-3, Math.PI)];
    const seg = (id: string, a: string, b: string) => ({ id, kind: 'line' as const, a, b, width: { by: 'width' as const, width: 3e-3 }, length: { by: 'length' as const, length: 0.015 } });
    doc.segments = [seg('run-a', 'a1', 'a2'), seg('run-b', 'b1', 'b2')];
    const file = join(mkdtempSync(join(tmpdir(), 'sw-near-')), 'near.json');
    writeFileSync(file, serializeDesign({ ...doc, proximityLimit: { by: 'heights', heights: 0.3 } }));
    const near = (extra: string[]) => JSON.parse(cli(['build', file, '--json', ...extra]).stdout).findings.filter((f: { code: string }) => f.code === 'proximity').length;
    expect(near([])).toBe(0);
    expect(near(['--proximity-limit', '3h'])).toBe(1);
  }, 120_000);
});

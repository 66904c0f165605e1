/** `stripwright block`: writes a complete design that build and sweep take as is; refusals in words. */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, existsSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../cli/main.ts';
import { parseDesign, newDesign, serializeDesign } from '../../core/index.ts';

async function run(args: string[], cwd: string) {
  const out: string[] = []; const err: string[] = [];
  const code = await runCli(args, { out: (t) => out.push(t), err: (t) => err.push(t), cwd });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}

describe('stripwright block', () => {
  it('coupler: writes a valid design with four ports that build accepts and sweep solves', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'coupler', '--coupling-db', '10', '--f0', '2.45GHz', '--er', '3.66', '--h', '0.508mm', '--tand', '0.0037', '--min-gap', '0.05mm', '--out', 'c.json'], dir);
    expect(r.code).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 'c.json'), 'utf8'));
    expect(p.ok).toBe(true);
    if (p.ok) expect(p.doc.nodes.filter((n) => n.kind === 'port').map((n) => n.id).sort()).toEqual(['coupled', 'in', 'isolated', 'through']);
    expect((await run(['build', 'c.json'], dir)).code).toBe(0);
    const s = await run(['sweep', 'c.json', '--from', '2.45GHz', '--to', '2.45GHz', '--points', '1', '--json'], dir);
    expect(s.code).toBe(0);
  });
  it('bandpass: order, bw in percent and ripple; the design builds', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'bandpass', '--order', '3', '--f0', '2.45GHz', '--bw', '10%', '--ripple-db', '0.5', '--er', '3.66', '--h', '0.508mm', '--min-gap', '0.03mm', '--out', 'f.json'], dir);
    expect(r.code).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 'f.json'), 'utf8'));
    expect(p.ok && p.doc.segments.filter((x) => x.kind === 'coupled').length).toBe(4);
    expect((await run(['build', 'f.json'], dir)).code).toBe(0);
  });
  it('refuses a gap below the process minimum (exit 1, no file) and a bad command line (exit 2)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'coupler', '--coupling-db', '6', '--f0', '2.45GHz', '--out', 'x.json'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/tightest coupling/);
    expect(existsSync(join(dir, 'x.json'))).toBe(false);
    expect((await run(['block', 'ladder', '--f0', '1GHz', '--out', 'y.json'], dir)).code).toBe(2);
  });
});

describe('stripwright block (registry)', () => {
  it('list names every block; KIND --help lists its parameters with unit, range and default', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const l = await run(['block', 'list'], dir);
    expect(l.code).toBe(0);
    for (const k of ['corporate', 'wilkinson', 'branchline', 'ratrace', 'transformer', 'taper', 'stub-match', 'lowpass', 'bandstop', 'launch']) expect(l.stdout).toContain(k);
    const h = await run(['block', 'transformer', '--help'], dir);
    expect(h.stdout).toMatch(/--sections VALUE\s+Number of quarter-wave sections \(1 to 8; default 3\)/);
    expect(h.stdout).toContain('Pozar');
  });
  it('launch: --help lists the pin, pad and taper with units and what an empty one means; the default builds; a pad that misses −25 dB is refused naming the nearest', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const h = await run(['block', 'launch', '--help'], dir);
    expect(h.stdout).toMatch(/--pin-width VALUE\s+Width of the connector's centre pin on the pad .*\(0\.2 to 5 mm; default 1\.27 mm\)/);
    expect(h.stdout).toMatch(/--pad-width VALUE\s+Width of the connector pad \(not given: the wider of the line and the pin\) \(0\.3 to 10 mm\)/);
    expect(h.stdout).toMatch(/--taper-length VALUE\s+.*not given: a 30° flare/);
    expect((await run(['block', 'launch', '--f0', '2.45GHz', '--er', '4.4', '--h', '1.6mm', '--out', 'l.json'], dir)).code).toBe(0);
    expect((await run(['build', 'l.json'], dir)).code).toBe(0);
    // A 1.5 mm pad, 3 mm long, on the ~3 mm line: a short high-impedance section (Pozar §5.5), about −23 dB with a
    // 3 mm taper: the asked taper is kept and the launch refused, naming the nearest that meets −25 dB.
    const r = await run(['block', 'launch', '--pad-width', '1.5mm', '--taper-length', '3mm', '--f0', '2.45GHz', '--er', '4.4', '--h', '1.6mm', '--out', 'n.json'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/launch\.padWidth/);
    expect(r.stderr).toMatch(/the nearest that meets it: no taper length \(the generator's [\d.]+ mm flare, or its compensating section\); or a pad at most [\d.]+ mm long at 1\.5 mm wide/);
    expect(existsSync(join(dir, 'n.json'))).toBe(false);
    // Left to the generator, the same pad gets its compensating section (Z0²/Zp, Pozar §5.5), and builds.
    expect((await run(['block', 'launch', '--pad-width', '1.5mm', '--f0', '2.45GHz', '--er', '4.4', '--h', '1.6mm', '--out', 'c.json'], dir)).code).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 'c.json'), 'utf8'));
    if (!p.ok) throw new Error('refused');
    expect(p.doc.segments.map((x) => x.id)).toContain('b1.comp');
    expect((await run(['build', 'c.json'], dir)).code).toBe(0);
  });
  it('--out writes a complete design that build accepts; --into … --at adds a block to a copy', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'corporate', '--outputs', '3', '--f0', '2.45GHz', '--er', '4.4', '--h', '1.6mm', '--out', 'feed.json'], dir);
    expect(r.code).toBe(0);
    expect((await run(['build', 'feed.json'], dir)).code).toBe(0);
    const i = await run(['block', 'stub-match', '--load', '30-20j', '--into', 'feed.json', '--at', '120mm,0mm', '--out', 'both.json'], dir);
    expect(i.code).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 'both.json'), 'utf8'));
    if (!p.ok) throw new Error('refused');
    expect(p.doc.blocks?.map((b) => b.kind)).toEqual(['corporate', 'stub-match']);
    expect(p.doc.nodes.find((n) => n.id === 'b2.src')!.at).toEqual({ x: 0.12, y: 0 });
  });
  it('a milled block is written sized as made; --clearance sets the isolation, and a narrow one takes the low tee level', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const read = (f: string) => { const p = parseDesign(readFileSync(join(dir, f), 'utf8')); if (!p.ok) throw new Error('refused'); return p.doc; };
    expect((await run(['block', 'corporate', '--outputs', '4', '--f0', '2.45GHz', '--out', 'wide.json'], dir)).code).toBe(0);
    const wide = read('wide.json');
    expect(wide.asMade).toEqual({ sizing: 'as-made', sideCopper: 'stitched' });
    expect(wide.process).toMatchObject({ kind: 'v-bit', clearance: 0.7e-3 });
    const r = await run(['block', 'corporate', '--outputs', '4', '--f0', '2.45GHz', '--clearance', '0.1mm', '--out', 'narrow.json'], dir);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Tee splits at the low level.*about \d+\.\d Ω on this laminate beside its isolation channel/);
    expect(read('narrow.json').process).toMatchObject({ kind: 'v-bit', clearance: 0.1e-3 });
    expect((await run(['build', 'narrow.json'], dir)).code).toBe(0);
    const bad = await run(['block', 'corporate', '--f0', '2.45GHz', '--min-gap', '0.2mm', '--clearance', '1mm', '--out', 'x.json'], dir);
    expect(bad.code).toBe(2);
  }, 240_000);
  it('a bad value is refused naming the field, what was expected and the fix (exit 1, no file)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'corporate', '--outputs', '65', '--f0', '2.45GHz', '--out', 'x.json'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/corporate\.outputs: expected a whole number from 2 to 64, got "65"/);
    expect(existsSync(join(dir, 'x.json'))).toBe(false);
    const u = await run(['block', 'wilkinson', '--ratio', '3', '--f0', '2.45GHz', '--out', 'x.json'], dir);
    expect(u.code).toBe(2);
  });
  it('--footprint folds a long row to fit, and refuses a block with branches that cannot, naming the footprint it needs', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'transformer', '--z1', '50', '--z2', '100', '--footprint', '30mm,40mm', '--sizing', 'microstrip', '--f0', '2.45GHz', '--out', 't.json'], dir);
    expect(r.code).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 't.json'), 'utf8'));
    expect(p.ok && p.doc.nodes.some((n) => n.id.includes('.turn'))).toBe(true);
    expect((await run(['build', 't.json'], dir)).code).toBe(0);
    const no = await run(['block', 'corporate', '--outputs', '4', '--footprint', '20mm,20mm', '--f0', '2.45GHz', '--out', 'c.json'], dir);
    expect(no.code).toBe(1);
    expect(no.stderr).toMatch(/footprint of at least/);
    expect(existsSync(join(dir, 'c.json'))).toBe(false);
  });
  it('--footprint folds a branched block too (a feed of 20 mm lines into 200 × 80 mm), and build takes it as is', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    const r = await run(['block', 'corporate', '--outputs', '4', '--feed', '20mm', '--footprint', '200mm,80mm', '--sizing', 'microstrip', '--f0', '2.45GHz', '--out', 'f.json'], dir);
    expect(r.code, r.stderr).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 'f.json'), 'utf8'));
    expect(p.ok && p.doc.nodes.some((n) => n.id.includes('.fold'))).toBe(true);
    expect(p.ok && String(p.doc.notes ?? '')).toMatch(/Folded \d+ lines? \(mitered bends/);
    expect((await run(['build', 'f.json'], dir)).code).toBe(0);
  });
  it('a block design carries default tolerances, so `stripwright yield` on it shows a spread (common practice defaults, core/blocks/tolerance-defaults.ts)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    expect((await run(['block', 'wilkinson', '--f0', '2.45GHz', '--er', '4.4', '--h', '1.6mm', '--sizing', 'microstrip', '--out', 'w.json'], dir)).code).toBe(0);
    const y = await run(['yield', 'w.json', '--samples', '20', '--seed', '5', '--ranking', '0', '--points', '11', '--json'], dir);
    expect(y.code, y.stderr).toBe(0);
    const r = JSON.parse(y.stdout) as { tolerances: unknown[]; targets: { stats: { sd: number } }[] };
    expect(r.tolerances.length).toBeGreaterThan(3);
    expect(Math.max(...r.targets.map((t) => t.stats.sd))).toBeGreaterThan(0);
  }, 60_000);
  it('--into widens the host design\'s band to cover the block\'s and says so; a block inside the band changes nothing', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    expect((await run(['block', 'wilkinson', '--f0', '2.45GHz', '--sizing', 'microstrip', '--out', 'w.json'], dir)).code).toBe(0);
    const host = parseDesign(readFileSync(join(dir, 'w.json'), 'utf8'));
    if (!host.ok) throw new Error('refused');
    const i = await run(['block', 'lowpass', '--cutoff', '2GHz', '--into', 'w.json', '--at', '0mm,40mm', '--out', 'both.json'], dir);
    expect(i.code, i.stderr).toBe(0);
    expect(i.stdout).toMatch(/Design band widened from [\d.]+ GHz–[\d.]+ GHz to [\d.]+ GHz–[\d.]+ GHz, to cover the block's band/);
    const p = parseDesign(readFileSync(join(dir, 'both.json'), 'utf8'));
    if (!p.ok) throw new Error('refused');
    expect(p.doc.frequency.band.start).toBeLessThan(host.doc.frequency.band.start);
    expect(p.doc.frequency.band.stop).toBeGreaterThanOrEqual(host.doc.frequency.band.stop);
    const same = await run(['block', 'wilkinson', '--into', 'w.json', '--at', '0mm,60mm', '--out', 'two.json'], dir);
    expect(same.stdout).not.toMatch(/widened/);
  });
  it('--into an empty design nobody named names it after the block and f0, as the app does; a named host keeps its name', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sw-block-'));
    writeFileSync(join(dir, 'empty.json'), serializeDesign(newDesign({ name: 'Untitled feed', asMade: { sizing: 'microstrip', sideCopper: 'stitched' } })));
    const i = await run(['block', 'branchline', '--into', 'empty.json', '--at', '0mm,0mm', '--out', 'named.json'], dir);
    expect(i.code, i.stderr).toBe(0);
    const p = parseDesign(readFileSync(join(dir, 'named.json'), 'utf8'));
    if (!p.ok) throw new Error('refused');
    expect(p.doc.name).toBe('Branch-line hybrid 2.45 GHz');
    writeFileSync(join(dir, 'mine.json'), serializeDesign(newDesign({ name: 'Mast feed', asMade: { sizing: 'microstrip', sideCopper: 'stitched' } })));
    expect((await run(['block', 'branchline', '--into', 'mine.json', '--at', '0mm,0mm', '--out', 'kept.json'], dir)).code).toBe(0);
    const k = parseDesign(readFileSync(join(dir, 'kept.json'), 'utf8'));
    if (!k.ok) throw new Error('refused');
    expect(k.doc.name).toBe('Mast feed');
  });
});

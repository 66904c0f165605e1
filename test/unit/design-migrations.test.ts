/**
 * Migrations of the design file (project rule: every migration is exercised by a test, common practice). Fixtures under test/fixtures/design/vN/ are files as version N wrote
 * them.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { DESIGN_VERSION, MIGRATIONS, asMadeOf, migrate, newDesign, parseDesign, serializeDesign, validateDesign } from '../../core/index.ts';

const FIX = join(import.meta.dirname, '..', 'fixtures', 'design');
const fixtures = readdirSync(FIX).filter((d) => /^v\d+$/.test(d))
  .flatMap((d) => readdirSync(join(FIX, d)).filter((f) => f.endsWith('.json')).map((f) => ({ version: Number(d.slice(1)), name: `${d}/${f}`, text: readFileSync(join(FIX, d, f), 'utf8') })));

describe('migration list', () => {
  it('is consecutive from 1 and ends one below DESIGN_VERSION', () => {
    expect(MIGRATIONS.map((m) => m.from)).toEqual(Array.from({ length: DESIGN_VERSION - 1 }, (_, i) => i + 1));
  });
  it('every migration is exercised by at least one fixture (fails when a vN/ fixture folder is missing)', () => {
    const exercised = new Set<number>();
    for (const f of fixtures) {
      const r = parseDesign(f.text);
      expect(r.ok, f.name).toBe(true);
      if (r.ok) for (const m of r.migrations ?? []) exercised.add(m);
    }
    const missing = MIGRATIONS.map((m) => m.from).filter((from) => !exercised.has(from));
    expect(missing).toEqual([]);
  });
  it('is a no-op on a current file', () => {
    const doc = { format: 'stripwright-design', version: DESIGN_VERSION, name: 'x' };
    expect(migrate(doc, DESIGN_VERSION)).toEqual({ doc, applied: [] });
  });
});

/** A file as it read before format 13, which wrote a milled process's isolation clearance in (the only field it adds). */
function beforeV13<T extends object>(doc: T): T {
  const p = (doc as { process?: Record<string, unknown> }).process;
  if (!p || !('clearance' in p)) return doc;
  const { clearance: _c, ...process } = p;
  return { ...doc, process };
}

/** A file as it reads after format 7, which moved display units out of the design (the only field it drops). */
function withoutUnits(doc: Record<string, unknown>): Record<string, unknown> {
  const view = doc.view as Record<string, unknown> | undefined;
  if (!view || !('units' in view)) return doc;
  const { units: _u, ...rest } = view;
  return { ...doc, view: rest };
}

describe('fixtures of older versions', () => {
  it('there is at least one fixture per older version', () => {
    for (let v = 1; v < DESIGN_VERSION; v++) expect(fixtures.some((f) => f.version === v), `v${v}`).toBe(true);
  });
  for (const f of fixtures) {
    it(`${f.name}: migrates to the current version, validates, and re-saves to a file that loads identically`, () => {
      const r = parseDesign(f.text);
      if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
      expect(r.migratedFrom).toBe(f.version);
      expect(r.doc.version).toBe(DESIGN_VERSION);
      expect(validateDesign(r.doc).ok).toBe(true);
      const saved = serializeDesign(r.doc);
      const again = parseDesign(saved);
      expect(again.ok && again.migratedFrom).toBe(undefined);
      expect(again.ok && again.doc).toEqual(r.doc);
      expect(again.ok && serializeDesign(again.doc)).toBe(saved);
    });
  }
});

describe('v1 → v2', () => {
  it('keeps the name and fills the documented defaults (glass-epoxy FR-4 1.6 mm, 2.45 GHz, V-bit, empty network)', () => {
    const r = parseDesign(readFileSync(join(FIX, 'v1', 'first-slice-demo.json'), 'utf8'));
    if (!r.ok) throw new Error('refused');
    // Later migrations add their own fields (format 3: junctions); this checks what 1 → 2 filled.
    expect(r.doc).toMatchObject({
      format: 'stripwright-design', version: DESIGN_VERSION, name: 'Four-way patch row feed, 5.8 GHz',
      substrate: { preset: 'glass-epoxy', er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 },
      frequency: { f0: 2.45e9, band: { start: 2.4e9, stop: 2.5e9 } },
      process: { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 },
      nodes: [], segments: [], board: null, areas: [], phaseGroups: [], targets: [], tolerances: [],
    });
    expect(r.migrations?.[0]).toBe(1);
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]!.message).toContain('This file was written in format 1 and was upgraded to format ');
    expect(r.warnings[0]!.message).toContain('1→2: added substrate (glass-epoxy FR-4 1.6 mm), frequency (2.45 GHz, 2.4–2.5 GHz), process: 30° V-bit, and an empty network');
  });
  it('keeps fields version 1 did not know', () => {
    const r = parseDesign(readFileSync(join(FIX, 'v1', 'unknown-fields.json'), 'utf8'));
    if (!r.ok) throw new Error('refused');
    expect(r.doc.author).toEqual({ initials: 'KM', bench: 3 });
    expect(r.doc.tags).toEqual(['bench', 'v1']);
    expect(JSON.parse(serializeDesign(r.doc)).author).toEqual({ initials: 'KM', bench: 3 });
  });
  it('a v1 file with a bad name is refused after migration, with the path', () => {
    const r = parseDesign('{"format": "stripwright-design", "version": 1, "name": 42}');
    expect(r.ok ? [] : r.errors.map((e) => e.message)).toEqual(['name: expected a design name of at most 200 characters, found 42, fix: give text in quotes']);
  });
  it('does not change the input object (migrations are pure)', () => {
    const v1 = { format: 'stripwright-design', version: 1, name: 'pure' };
    const copy = structuredClone(v1);
    migrate(v1, 1);
    expect(v1).toEqual(copy);
  });
});

describe('v2 → v3', () => {
  it('adds empty targets and tolerances and keeps everything else as written', () => {
    const text = readFileSync(join(FIX, 'v2', 'wilkinson-as-written.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations?.[0]).toBe(2);
    expect(r.doc.targets).toEqual([]);
    expect(r.doc.tolerances).toEqual([]);
    const { version: _v, ...before } = withoutUnits(JSON.parse(text) as Record<string, unknown>);
    const { version: _w, targets: _t, tolerances: _x, junctions: _j, asMade: _m, ...after } = r.doc;
    expect(after).toEqual(before);
  });
});

describe('v3 → v4 (junction models)', () => {
  it('a format-2 design gains junctions "modelled", keeps everything else, and its tee arms then size longer', async () => {
    const { sizeDesign } = await import('../../core/layout/index.ts');
    const text = readFileSync(join(FIX, 'v2', 'open-stub-v2.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toContain(3);
    expect(r.doc.junctions).toBe('modelled');
    const { version: _v, junctions: _j, targets: _t, tolerances: _x, asMade: _m, ...rest } = beforeV13(r.doc);
    const { version: _w, ...before } = withoutUnits(JSON.parse(text) as Record<string, unknown>);
    expect(rest).toEqual(before);
    expect(r.warnings[0]!.message).toContain('3→4: junctions');
    // What the migration's note promises: arms grow by their tee plane shifts; "ideal" sizes as before.
    const stub = (junctions: 'modelled' | 'ideal') => sizeDesign({ ...r.doc, junctions }).pieces.find((p) => p.id === 'stub')!;
    expect(stub('modelled').span).toBeGreaterThan(stub('ideal').span);
  });
  it('a format-3 file (targets, no junctions field) gains junctions "modelled" and keeps its targets', () => {
    const text = readFileSync(join(FIX, 'v3', 'wilkinson-with-targets.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations?.[0]).toBe(3);
    expect(r.doc.junctions).toBe('modelled');
    expect(r.doc.targets.length).toBeGreaterThan(0);
  });
  it('keeps a junctions field already present', () => {
    expect(migrate({ format: 'stripwright-design', version: 3, name: 'x', junctions: 'ideal' }, 3).doc.junctions).toBe('ideal');
  });
});

describe('v4 → v5 (asMade)', () => {
  it('an older file keeps plain microstrip sizing with stitched side copper, and keeps everything else', () => {
    const text = readFileSync(join(FIX, 'v4', 'open-stub-with-junctions.json'), 'utf8');
    const before = JSON.parse(text) as Record<string, unknown>;
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.doc.asMade).toEqual({ sizing: 'microstrip', sideCopper: 'stitched' });
    expect(r.doc.segments).toEqual(before.segments);
    expect(r.migrations?.[0]).toBe(4);
  });
  it('a file that already says how it is sized keeps its choice', () => {
    const up = MIGRATIONS.find((m) => m.from === 4)!.up;
    expect(up({ version: 4, asMade: { sizing: 'as-made', sideCopper: 'floating' } }).asMade).toEqual({ sizing: 'as-made', sideCopper: 'floating' });
  });
});

describe('v5 → v6 (coupled pairs)', () => {
  it('moves only the version: an older file has no coupled pairs', () => {
    const text = readFileSync(join(FIX, 'v5', 'wilkinson-as-made-field.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([5, 6, 7, 8, 9, 10, 11, 12]);
    expect({ ...beforeV13(r.doc), version: 5 }).toEqual(withoutUnits(JSON.parse(text) as Record<string, unknown>));
  });
});

describe('v6 → v7', () => {
  it('drops the display units from the file (an app setting now) and keeps the snap grid and everything else', () => {
    const text = readFileSync(join(FIX, 'v6', 'open-stub-with-units.json'), 'utf8');
    const raw = JSON.parse(text) as { view: { units?: string; grid: number }; nodes: unknown[] };
    expect(raw.view.units).toBe('mm');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migratedFrom).toBe(6);
    expect(r.doc.view).toEqual({ grid: raw.view.grid });
    expect(r.doc.nodes).toEqual(raw.nodes);
  });
});

describe('v7 → v8 (placed blocks)', () => {
  it('7 → 8 moves only the version: an older file placed no blocks (the list is optional)', () => {
    const text = readFileSync(join(FIX, 'v7', 'open-stub-match.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations?.[0]).toBe(7);
    expect(r.doc.blocks).toBeUndefined();
    expect({ ...beforeV13(r.doc), version: 7 }).toEqual(JSON.parse(text));
  });
});

describe('v8 → v9 (a design\'s own sweep settings)', () => {
  it('moves only the version: an older file has no settings and keeps being swept over its band', () => {
    const text = readFileSync(join(FIX, 'v8', 'open-stub-no-sweep.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([8, 9, 10, 11, 12]);
    expect({ ...beforeV13(r.doc), version: 8 }).toEqual(JSON.parse(text));
    expect(r.doc.sweep).toBeUndefined();
  });
});

describe('v9 → v10 (measured data)', () => {
  it('moves only the version: an older file has no measured files (the list is optional)', () => {
    const text = readFileSync(join(FIX, 'v9', 'wilkinson-2g45.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([9, 10, 11, 12]);
    expect(r.doc.measured).toBeUndefined();
    expect({ ...beforeV13(r.doc), version: 9 }).toEqual(JSON.parse(text));
  });
  it('keeps measured files through save and load, and refuses a malformed one with its field named', () => {
    const r = parseDesign(readFileSync(join(FIX, 'v9', 'wilkinson-2g45.json'), 'utf8'));
    if (!r.ok) throw new Error('refused');
    const m = { id: 'm1', name: 'board 3.s3p', ports: ['in', 'o1', 'o2'], touchstone: '# GHz S RI R 50\n2.45 0 0 0.7 0 0.7 0 0.7 0 0 0 0 0 0.7 0 0 0 0 0\n' };
    const again = parseDesign(serializeDesign({ ...r.doc, measured: [m] }));
    if (!again.ok) throw new Error(again.errors.map((e) => e.message).join('; '));
    expect(again.doc.measured).toEqual([m]);
    const bad = parseDesign(serializeDesign({ ...r.doc, measured: [{ ...m, ports: ['no spaces'] }] }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]!.path).toMatch(/measured/);
  });
});

describe('v10 → v11 (a design\'s own proximity limit)', () => {
  it('moves only the version: an older file has no limit and is checked at three substrate heights as before', async () => {
    const { proximityLimitFor } = await import('../../core/index.ts');
    const text = readFileSync(join(FIX, 'v10', 'branchline-10g4.json'), 'utf8');
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([10, 11, 12]); // v11 → v12 keeps its asMade
    expect(r.doc.proximityLimit).toBeUndefined();
    expect({ ...beforeV13(r.doc), version: 10 }).toEqual(JSON.parse(text));
    expect(proximityLimitFor(r.doc)).toBeCloseTo(3 * r.doc.substrate.h, 15);
  });
  it('keeps a limit through save and load, and refuses a malformed one with its field named', () => {
    const r = parseDesign(readFileSync(join(FIX, 'v10', 'branchline-10g4.json'), 'utf8'));
    if (!r.ok) throw new Error('refused');
    for (const limit of [{ by: 'heights', heights: 7 }, { by: 'length', length: 1.5e-3 }] as const) {
      const again = parseDesign(serializeDesign({ ...r.doc, proximityLimit: limit }));
      if (!again.ok) throw new Error(again.errors.map((e) => e.message).join('; '));
      expect(again.doc.proximityLimit).toEqual(limit);
    }
    const bad = parseDesign(serializeDesign({ ...r.doc, proximityLimit: { by: 'heights', heights: -1 } }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]!.path).toMatch(/proximityLimit/);
  });
});

describe('v11 → v12 (every file says how its lines are sized)', () => {
  const text = readFileSync(join(FIX, 'v10', 'milled-without-as-made.json'), 'utf8');
  it('writes the old meaning into a file that left asMade out: plain microstrip, stitched (nothing changes silently)', () => {
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([10, 11, 12]);
    expect(r.doc.process.kind).toBe('v-bit');
    expect(r.doc.asMade).toEqual({ sizing: 'microstrip', sideCopper: 'stitched' });
    expect(asMadeOf(r.doc).sizing).toBe('microstrip');
    const { asMade: _a, ...rest } = beforeV13(r.doc);
    expect({ ...rest, version: 10 }).toEqual(JSON.parse(text));
    expect(r.warnings.map((w) => w.message).join(' ')).toMatch(/says how its lines are sized/);
  });
  it('a format-11 file (proximity limit known, before the as-made default) without asMade gets the same: one step, microstrip written in', () => {
    const r = parseDesign(readFileSync(join(FIX, 'v11', 'milled-without-as-made.json'), 'utf8'));
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([11, 12]);
    expect(r.doc.asMade).toEqual({ sizing: 'microstrip', sideCopper: 'stitched' });
  });
  it('keeps a choice the file made', () => {
    const doc = JSON.parse(text);
    const r = parseDesign(JSON.stringify({ ...doc, asMade: { sizing: 'as-made', sideCopper: 'floating' } }));
    expect(r.ok && r.doc.asMade).toEqual({ sizing: 'as-made', sideCopper: 'floating' });
  });
  it('a current file without asMade is sized as made when milled, as plain microstrip when etched; a new design writes its choice in', () => {
    const base = { ...JSON.parse(text), version: DESIGN_VERSION };
    const sizing = (process: unknown) => { const r = parseDesign(JSON.stringify({ ...base, process })); if (!r.ok) throw new Error('refused'); return asMadeOf(r.doc).sizing; };
    expect(sizing({ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 })).toBe('as-made');
    expect(sizing({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3 })).toBe('as-made');
    expect(sizing({ kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 })).toBe('microstrip');
    expect(newDesign().asMade).toEqual({ sizing: 'as-made', sideCopper: 'stitched' });
    expect(newDesign({ process: { kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 } }).asMade).toEqual({ sizing: 'microstrip', sideCopper: 'stitched' });
  });
});

describe('v12 → v13 (a milled process says how wide its isolation is)', () => {
  // The channel format 12's G-code milled: two isolation passes overlapping 0.4 of the cut (core/toolpath defaults
  // then), cut + 0.6·cut; the cut of a V-bit is tip + 2·depth·tan(angle/2) (plain geometry).
  const v12 = readFileSync(join(FIX, 'v12', 'vbit-as-made.json'), 'utf8');
  it('writes the two-pass channel into a V-bit file, and nothing else changes', () => {
    const r = parseDesign(v12);
    if (!r.ok) throw new Error('refused');
    expect(r.migrations).toEqual([12]);
    const before = JSON.parse(v12) as { process: { tipWidth: number; depth: number; angleDeg: number } };
    const cut = before.process.tipWidth + 2 * before.process.depth * Math.tan((before.process.angleDeg / 2) * Math.PI / 180);
    expect(r.doc.process.kind === 'v-bit' && r.doc.process.clearance).toBeCloseTo(1.6 * cut, 9);
    expect({ ...beforeV13(r.doc), version: 12 }).toEqual(before);
    expect(r.warnings.map((w) => w.message).join(' ')).toMatch(/isolation is \(clearance\)/);
  });
  it('the toolpaths of that file keep their two passes (the clearance gives the same count)', async () => {
    const { isolationPlan } = await import('../../core/layout/index.ts');
    const r = parseDesign(v12);
    if (!r.ok || r.doc.process.kind !== 'v-bit') throw new Error('refused');
    expect(isolationPlan(r.doc.process).passes).toBe(2);
  });
  it('an end-mill file gets 1.6 tool diameters; an etched file and a file that says its clearance are left alone', () => {
    const doc = JSON.parse(v12);
    const up = (process: unknown) => { const r = parseDesign(JSON.stringify({ ...doc, process })); if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('; ')); return r.doc.process; };
    expect(up({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3 })).toEqual({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3, clearance: 0.64e-3 });
    expect(up({ kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 })).toEqual({ kind: 'etch', edgeBias: 0, minFeature: 0.2e-3 });
    expect(up({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3, clearance: 1e-3 })).toEqual({ kind: 'end-mill', toolDiameter: 0.4e-3, depth: 0.1e-3, clearance: 1e-3 });
  });
});

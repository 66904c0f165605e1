/**
 * Migrations of the design file (reliability.md §3.3; the "every migration exercised" guard follows the practice
 * described in style.md rule 8). Fixtures under test/fixtures/design/vN/ are files as version N wrote
 * them.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { DESIGN_VERSION, MIGRATIONS, migrate, parseDesign, serializeDesign, validateDesign } from '../../core/index.ts';

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
    // The first step alone (later steps add their own fields and are checked below).
    const v1 = JSON.parse(readFileSync(join(FIX, 'v1', 'first-slice-demo.json'), 'utf8')) as Record<string, unknown>;
    expect(MIGRATIONS[0]!.up(v1)).toEqual({
      format: 'stripwright-design', version: 2, name: 'Four-way patch row feed, 5.8 GHz',
      substrate: { preset: 'glass-epoxy', er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 },
      frequency: { f0: 2.45e9, band: { start: 2.4e9, stop: 2.5e9 } },
      process: { kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3 },
      nodes: [], segments: [], board: null, areas: [], phaseGroups: [],
    });
    expect(r.doc.name).toBe('Four-way patch row feed, 5.8 GHz');
    expect(r.migrations?.[0]).toBe(1);
    expect(r.warnings.map((w) => w.message)[0]).toContain('This file was written in format 1 and was upgraded to format ' + DESIGN_VERSION + ' (1→2: added substrate (glass-epoxy FR-4 1.6 mm), frequency (2.45 GHz, 2.4–2.5 GHz), process: 30° V-bit, and an empty network');
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
    expect(r.ok ? [] : r.errors.map((e) => e.message)).toEqual(['name: expected a design name of at most 200 characters, found 42']);
  });
  it('does not change the input object (migrations are pure)', () => {
    const v1 = { format: 'stripwright-design', version: 1, name: 'pure' };
    const copy = structuredClone(v1);
    migrate(v1, 1);
    expect(v1).toEqual(copy);
  });
});

describe('v2 → v3 (asMade)', () => {
  it('an older file keeps plain microstrip sizing with stitched side copper, and keeps everything else', () => {
    const text = readFileSync(join(FIX, 'v2', 'open-stub-match.json'), 'utf8');
    const before = JSON.parse(text) as Record<string, unknown>;
    const r = parseDesign(text);
    if (!r.ok) throw new Error('refused');
    expect(r.doc.asMade).toEqual({ sizing: 'microstrip', sideCopper: 'stitched' });
    expect(r.doc.segments).toEqual(before.segments);
    expect(r.migrations ?? []).toContain(2);
  });
  it('a file that already says how it is sized keeps its choice', () => {
    const up = MIGRATIONS.find((m) => m.from === 2)!.up;
    expect(up({ version: 2, asMade: { sizing: 'as-made', sideCopper: 'floating' } }).asMade).toEqual({ sizing: 'as-made', sideCopper: 'floating' });
  });
});

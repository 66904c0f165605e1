/**
 * The design file: round trip, unknown fields, the project's bad-input catalogue (each
 * with its exact message), version refusal and size limits. The messages are our own wording, so they are checked
 * word for word: a face shows them as they are.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { DESIGN_LIMITS, DESIGN_VERSION, newDesign, parseDesign, serializeDesign, validateDesign, type DesignDoc } from '../../core/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const EXAMPLES = join(ROOT, 'assets', 'examples');
const FIXTURES = join(ROOT, 'test', 'fixtures', 'design');
const example = (name: string) => readFileSync(join(EXAMPLES, name), 'utf8');

function errorsOf(text: string): string[] {
  const r = parseDesign(text);
  if (r.ok) throw new Error('expected the file to be refused');
  return r.errors.map((e) => e.message);
}
function firstError(text: string): string { return errorsOf(text)[0]!; }
function okDoc(text: string): DesignDoc {
  const r = parseDesign(text);
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('\n'));
  return r.doc;
}
/** A valid file with one small network, to break in specific ways. */
const BASE = example('open-stub-match.json');
const withDoc = (edit: (d: Record<string, any>) => void): string => {
  const d = JSON.parse(BASE);
  edit(d);
  return JSON.stringify(d, null, 2);
};

describe('round trip', () => {
  const names = readdirSync(EXAMPLES).filter((n) => n.endsWith('.json'));
  it('covers all example files', () => expect(names.length).toBeGreaterThanOrEqual(6));
  for (const name of names) {
    it(`${name}: parse → serialize gives the file back byte for byte, and parses equal`, () => {
      const text = example(name);
      const doc = okDoc(text);
      const out = serializeDesign(doc);
      expect(out).toBe(text);
      expect(okDoc(out)).toEqual(doc);
    });
  }
  it('writes 2-space indent, a trailing newline and known keys in a fixed order', () => {
    const d = newDesign({ name: 'Order' });
    // Build the same design with keys in a scrambled order: the text must not change.
    const scrambled = Object.fromEntries(Object.entries(d).reverse()) as DesignDoc;
    scrambled.substrate = Object.fromEntries(Object.entries(d.substrate).reverse()) as DesignDoc['substrate'];
    const a = serializeDesign(d), b = serializeDesign(scrambled);
    expect(b).toBe(a);
    expect(a.endsWith('}\n')).toBe(true);
    expect(a.split('\n')[1]).toBe('  "format": "stripwright-design",');
    expect(Object.keys(JSON.parse(a))).toEqual(['format', 'version', 'name', 'substrate', 'frequency', 'process', 'board', 'nodes', 'segments', 'areas', 'phaseGroups', 'targets', 'tolerances', 'asMade']);
  });
  it('keeps unknown fields at the top level and inside records (written after the known keys, sorted)', () => {
    const text = withDoc((d) => {
      d.zExtra = { anything: [1, 2, { deep: true }] };
      d.aExtra = 'first';
      d.nodes[0].vendorNote = 'keep me';
      d.segments[1].width.tolerance = 0.05;
      d.substrate.lot = 'A-17';
    });
    const doc = okDoc(text);
    const back = JSON.parse(serializeDesign(doc));
    expect(back.zExtra).toEqual({ anything: [1, 2, { deep: true }] });
    expect(back.nodes[0].vendorNote).toBe('keep me');
    expect(back.segments[1].width.tolerance).toBe(0.05);
    expect(back.substrate.lot).toBe('A-17');
    const keys = Object.keys(back);
    expect(keys.slice(-2)).toEqual(['aExtra', 'zExtra']);
  });
  it('refuses to write a number that is not finite (JSON would turn it into null)', () => {
    const d = newDesign();
    d.substrate.er = Number.NaN;
    expect(() => serializeDesign(d)).toThrow('substrate.er: expected a finite number (the design cannot be saved with it), got NaN');
  });
  it('writes -0 as 0', () => {
    const d = newDesign();
    d.substrate.roughness = -0;
    expect(serializeDesign(d)).toContain('"roughness": 0\n');
  });
  it('newDesign gives the documented defaults and a valid file', () => {
    const d = newDesign();
    // FR-4 preset values of the brief: εr 4.4, h 1.6 mm, t 35 µm, tanδ 0.02, σ 5.8e7 S/m; f0 2.45 GHz (ISM, ITU RR 5.150).
    expect(d.substrate).toMatchObject({ er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7 });
    expect(d.frequency.f0).toBe(2.45e9);
    expect(d.version).toBe(DESIGN_VERSION);
    expect(validateDesign(d).ok).toBe(true);
    expect(newDesign({ f0: 10e9 }).frequency.band).toEqual({ start: 9.8e9, stop: 10.2e9 });
  });
});

describe('bad-input catalogue', () => {
  it('empty file, whitespace only, one byte', () => {
    expect(firstError('')).toBe('file: expected a Stripwright design (JSON text starting with {), found an empty file, fix: open the design file itself, or its backup copy');
    expect(firstError(' \n\t ')).toBe('file: expected a Stripwright design (JSON text starting with {), found only blank space, fix: open the design file itself, or its backup copy');
    expect(firstError('x')).toBe('file: expected a JSON value: a design file starts with {, found "x" (line 1, column 1), fix: correct the text there, or open the backup copy');
    expect(firstError('{')).toBe('file: expected the rest of an object, found the end of the text at line 1, column 2 (it looks cut short; nothing was loaded), fix: open the backup copy or a recovery snapshot');
  });
  it('a UTF-8 byte-order mark is accepted with a note, and not written back', () => {
    const r = parseDesign('\uFEFF' + BASE);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.warnings.map((w) => w.message)).toContain('The file starts with a byte-order mark; it was ignored and is not written back.');
      expect(serializeDesign(r.doc)).toBe(BASE);
    }
  });
  it('UTF-16 text, binary garbage and NUL bytes', () => {
    // A UTF-16LE file read as UTF-8: a mangled BOM, then a NUL after every ASCII character.
    const utf16 = '\uFFFD\uFFFD' + [...'{"format"'].map((c) => c + '\u0000').join('');
    expect(firstError(utf16)).toBe('file: expected UTF-8 text, found UTF-16 text or binary data (NUL bytes) (line 1, column 1), fix: save the file as UTF-8');
    expect(firstError('\uFFFDPNG\r\n\u001a\nIHDR\u0000\u0000')).toBe('file: expected UTF-8 text, found binary data (NUL bytes): this is not a design file (line 3, column 1), fix: open a design file');
    expect(firstError('\u001f\uFFFD\b\u0008garbage')).toBe('file: expected a JSON value: a design file starts with {, found control character U+001F (line 1, column 1), fix: correct the text there, or open the backup copy');
  });
  it('truncated at every 10 % of the length: always "cut short", never a crash', () => {
    for (let k = 1; k < 10; k++) {
      const msg = firstError(BASE.slice(0, Math.floor((BASE.length * k) / 10)));
      expect(msg).toMatch(/^file: expected .+, found the end of the text at line \d+, column \d+ \(it looks cut short; nothing was loaded\), fix: open the backup copy or a recovery snapshot$/);
    }
  });
  it('valid JSON but not an object', () => {
    expect(firstError('[1, 2]')).toBe('file: expected a JSON object with "format": "stripwright-design", found a list of 2, fix: open a Stripwright design file');
    expect(firstError('42')).toBe('file: expected a JSON object with "format": "stripwright-design", found 42, fix: open a Stripwright design file');
    expect(firstError('null')).toBe('file: expected a JSON object with "format": "stripwright-design", found null, fix: open a Stripwright design file');
  });
  it('wrong or missing format id', () => {
    expect(firstError('{"format": "something-else", "version": 2}')).toBe('format: expected "stripwright-design" (this file is not a Stripwright design), found "something-else", fix: open a Stripwright design file');
    expect(firstError('{"version": 2}')).toBe('format: expected "stripwright-design" (this file is not a Stripwright design), found nothing (the field is missing), fix: open a Stripwright design file');
  });
  it('missing or malformed version: 0, -1, 1.5, "1"', () => {
    const v = (x: string) => firstError(`{"format": "stripwright-design"${x}}`);
    const expected = (found: string) => `version: expected a whole format number from 1 to ${DESIGN_VERSION}, found ${found}, fix: set "version" to the format the file was written in`;
    expect(v('')).toBe(expected('nothing (the field is missing)'));
    expect(v(', "version": 0')).toBe(expected('0'));
    expect(v(', "version": -1')).toBe(expected('-1'));
    expect(v(', "version": 1.5')).toBe(expected('1.5'));
    expect(v(', "version": "1"')).toBe(expected('"1"'));
  });
  it('a file from a newer app is refused, naming both versions', () => {
    const r = parseDesign(`{"format": "stripwright-design", "version": 99, "name": "future"}`);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors[0]!.code).toBe('unsupported-version');
      expect(r.errors[0]!.message).toBe(`version: expected format ${DESIGN_VERSION} or older (the format this version reads), found 99 (made by a newer Stripwright), fix: update the app`);
    }
    expect(firstError(withDoc((d) => { d.version = DESIGN_VERSION + 1; }))).toBe(`version: expected format ${DESIGN_VERSION} or older (the format this version reads), found ${DESIGN_VERSION + 1} (made by a newer Stripwright), fix: update the app`);
  });
  it('a huge list (10⁶ items) and nesting 10⁴ deep are refused before any work on them', () => {
    expect(firstError('[' + '1,'.repeat(1e6) + '1]')).toBe(`file: expected at most ${DESIGN_LIMITS.listItems} items in one list, found more (line 1, column 200002), fix: correct the text there, or open the backup copy`);
    expect(firstError('['.repeat(1e4) + ']'.repeat(1e4))).toBe(`file: expected nesting at most ${DESIGN_LIMITS.depth} levels deep, found a deeper list (line 1, column 33), fix: correct the text there, or open the backup copy`);
  });
  it('__proto__ and constructor.prototype keys are refused (prototype pollution)', () => {
    expect(firstError('{"__proto__": {"polluted": true}}')).toBe('file: expected no field named __proto__ (refused: it could alter objects when the file is loaded), found "__proto__" (line 1, column 2), fix: correct the text there, or open the backup copy');
    expect(firstError('{"constructor": {"prototype": {"x": 1}}}')).toBe('file: expected no constructor.prototype field (refused: it could alter objects when the file is loaded), found "prototype" (line 1, column 18), fix: correct the text there, or open the backup copy');
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
  it('duplicate keys are refused (JSON.parse would keep the last one silently)', () => {
    expect(firstError('{"format": "stripwright-design", "format": "x"}')).toBe('file: expected each field once per object; "format" appears twice, found a duplicate field name (line 1, column 34), fix: correct the text there, or open the backup copy');
  });
  it('1e309 (Infinity), NaN as text, NaN as a bare word; -0 reads as 0', () => {
    expect(firstError(BASE.replace('"er": 4.4', '"er": 1e309'))).toMatch(/^file: expected a number that fits a double \(magnitude below 1\.8e308\), found 1e309 \(line \d+, column \d+\), fix: correct the text there, or open the backup copy$/);
    expect(firstError(BASE.replace('"er": 4.4', '"er": "NaN"'))).toBe('substrate.er: expected a relative permittivity εr from 1 to 100, found "NaN", fix: change the number to fit (SI units: metres, hertz, ohms)');
    expect(firstError(BASE.replace('"er": 4.4', '"er": NaN'))).toMatch(/^file: expected a number \(JSON has no NaN\), found NaN \(line \d+, column \d+\), fix: correct the text there, or open the backup copy$/);
    const d = okDoc(BASE.replace('"roughness": 0.0000015', '"roughness": -0'));
    expect(Object.is(d.substrate.roughness, -0) || d.substrate.roughness === 0).toBe(true);
    expect(serializeDesign(d)).toContain('"roughness": 0\n');
  });
  it('negative and zero widths, εr below 1, unit slips (mm for m, GHz for Hz)', () => {
    expect(firstError(withDoc((d) => { d.segments[1].width = { by: 'z0', z0: -50 }; }))).toBe('segments[1].width.z0: expected an impedance in ohms above 0, found -50, fix: change the number to fit (SI units: metres, hertz, ohms)');
    expect(firstError(withDoc((d) => { d.segments[0].width = { by: 'width', width: 0 }; }))).toBe('segments[0].width.width: expected a strip width in metres above 0 and at most 0.1 m, found 0, fix: change the number to fit (SI units: metres, hertz, ohms)');
    expect(firstError(withDoc((d) => { d.substrate.er = 0.9; }))).toBe('substrate.er: expected a relative permittivity εr from 1 to 100, found 0.9, fix: change the number to fit (SI units: metres, hertz, ohms)');
    expect(firstError(withDoc((d) => { d.substrate.h = 1.6; }))).toBe('substrate.h: expected a dielectric height in metres from 10 µm to 50 mm (1.6 mm is 0.0016), found 1.6, fix: change the number to fit (SI units: metres, hertz, ohms)');
    expect(firstError(withDoc((d) => { d.frequency.f0 = 2.4; }))).toBe('frequency.f0: expected a frequency in hertz from 1 MHz to 300 GHz (2.45 GHz is 2450000000), found 2.4, fix: change the number to fit (SI units: metres, hertz, ohms)');
  });
  it('collects every problem, not just the first, each with its path', () => {
    const msgs = errorsOf(withDoc((d) => {
      d.segments[1].width = { by: 'z0', z0: -50 };
      d.nodes[0].kind = 'nope';
      delete d.nodes[1].at.y;
      d.process = { kind: 'laser' };
    }));
    expect(msgs).toEqual([
      'process.kind: expected a process: kind "end-mill", "v-bit" or "etch", found "laser", fix: use one of the names listed',
      'nodes[0].kind: expected a node: an object whose kind is "port", "vertex", "junction", "open" or "short", found "nope", fix: use one of the names listed',
      // A missing field is described by its own schema (before: the enclosing record's words).
      'nodes[1].at.y: expected a coordinate in metres within ±10 m, found nothing (the field is missing), fix: add the field',
      'segments[1].width.z0: expected an impedance in ohms above 0, found -50, fix: change the number to fit (SI units: metres, hertz, ohms)',
    ]);
  });
  it('caps the list of problems and counts the rest', () => {
    const msgs = errorsOf(withDoc((d) => { d.nodes = Array.from({ length: 80 }, (_, i) => ({ id: `n${i}`, kind: 'open', at: { x: 'a', y: 0 } })); }));
    expect(msgs).toHaveLength(DESIGN_LIMITS.issues + 1);
    expect(msgs.at(-1)).toBe('file: expected fewer problems, found 30 more not listed, fix: fix the ones above first');
  });
  it('dangling references, duplicate ids and node kinds that disagree with their segments (fixture bad/dangling-and-degree.json)', () => {
    expect(errorsOf(readFileSync(join(FIXTURES, 'bad', 'dangling-and-degree.json'), 'utf8'))).toEqual([
      'nodes[1].id: expected an id not used elsewhere in the design (already used by nodes[0]), found "p1", fix: rename one of the two',
      'segments[0].b: expected the id of a node in this design, found "ghost", which no node has, fix: name an existing node, or add the node',
      'nodes[0]: expected one segment at a port, found 3 segments meeting at port "p1", fix: remove segments there or change the node kind',
      'nodes[1]: expected one segment at an open end, found 3 segments meeting at open "p1", fix: remove segments there or change the node kind',
      'nodes[2]: expected one segment at an open end, found 2 segments meeting at open "e", fix: remove segments there or change the node kind',
    ]);
  });
  it('a segment from a node to itself, or with both ends at one place', () => {
    expect(firstError(withDoc((d) => { d.segments[0].b = d.segments[0].a; }))).toBe('segments[0].b: expected a node other than its start a (a segment joins two nodes), found "src", fix: join two different nodes');
    expect(firstError(withDoc((d) => { d.nodes[1].at = { ...d.nodes[0].at }; }))).toBe('segments[0]: expected ends at two different places (the drawing gives each piece its direction), found both ends at (0, 0) m, fix: move one of its nodes');
  });
  it('an unfinished network loads with a warning (no work lost) and is an error only when completeness is asked for', () => {
    const text = withDoc((d) => { d.segments = d.segments.filter((s: { id: string }) => s.id !== 'stub'); d.nodes = d.nodes.filter((n: { id: string }) => n.id !== 'stubend'); });
    const r = parseDesign(text);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.warnings.map((w) => w.message)).toEqual(['nodes[1]: "tee" has 2 segments, needs three or four segments at a junction: the network is unfinished there. It is kept as drawn; sizing waits until it is connected.']);
    const strict = parseDesign(text, { complete: true });
    expect(strict.ok ? [] : strict.errors.map((e) => e.message)).toEqual(['nodes[1]: expected three or four segments at a junction, found 2 segments meeting at junction "tee" (the network is unfinished there), fix: connect the missing segments, or delete the node']);
  });
  it('outlines: too few points, all on a line, crossing itself, first point repeated at the end', () => {
    const outline = (pts: [number, number][]) => withDoc((d) => { d.board.outline = pts.map(([x, y]) => ({ x, y })); });
    expect(firstError(outline([[0, 0], [0.01, 0]]))).toBe('board.outline: expected an outline of at least 3 points, found a list of 2, fix: add or remove entries to fit');
    expect(firstError(outline([[0, 0], [0.01, 0], [0.02, 0]]))).toBe('board.outline: expected a closed outline enclosing an area (points not all on one line), found an outline of 3 points enclosing no area, fix: give at least three points that are not on one line');
    expect(firstError(outline([[0, 0], [0.01, 0.01], [0.01, 0], [0, 0.01]]))).toBe('board.outline: expected an outline that does not cross itself, found edges 0–1 and 2–3 crossing, fix: move or reorder the points so no two edges cross or touch');
    expect(firstError(outline([[0, 0], [0.01, 0], [0.01, 0.01], [0, 0]]))).toBe('board.outline[0]: expected an outline that does not repeat its first point at the end (it closes by itself), found the same point (0, 0) twice, fix: remove the repeated point');
  });
  it('phase groups must name ports', () => {
    expect(firstError(withDoc((d) => { d.phaseGroups = [{ id: 'g', name: 'x', from: 'tee', to: ['load', 'nowhere'], toleranceDeg: 5 }]; }))).toBe('phaseGroups[0].from: expected the id of a port node, found "tee", fix: name a port of this design');
  });
  it('a band that runs backwards is an error; f0 outside the band a warning', () => {
    expect(firstError(withDoc((d) => { d.frequency.band = { start: 2.5e9, stop: 2.3e9 }; }))).toBe('frequency.band.stop: expected a band stop above its start (2500000000 Hz), found 2300000000, fix: raise the stop or lower the start');
    const r = parseDesign(withDoc((d) => { d.frequency.band = { start: 2.5e9, stop: 2.6e9 }; }));
    expect(r.ok && r.warnings[0]!.message).toBe('frequency.f0 (2400000000 Hz) lies outside the band 2500000000–2600000000 Hz; lengths are set at f0, the band only sets the sweep.');
  });
  it('a non-string input is a clean error', () => {
    expect(firstError(undefined as unknown as string)).toBe('file: expected the text of a design file, found nothing, fix: open a design file');
  });
});

describe('size limits', () => {
  it('file bytes (a file over the limit is refused before it is read as JSON)', () => {
    const big = '{"format": "stripwright-design", "pad": "' + 'x'.repeat(DESIGN_LIMITS.fileBytes) + '"}';
    expect(firstError(big)).toBe('file: expected a design file of at most 16.0 MB, found 16.0 MB, fix: open the design file itself: this one is far larger than a design');
    // Multi-byte text counts in UTF-8 bytes, not characters: 6 M × 'µ' (2 bytes) is 12 M bytes.
    const accented = '{"format": "stripwright-design", "pad": "' + 'µ'.repeat(9 * 1024 * 1024) + '"}';
    expect(firstError(accented)).toBe('file: expected a design file of at most 16.0 MB, found 18.0 MB, fix: open the design file itself: this one is far larger than a design');
  });
  it('counts of nodes, segments, areas, phase groups', () => {
    const d = JSON.parse(BASE);
    d.nodes = new Array(DESIGN_LIMITS.nodes + 1).fill(0);
    d.segments = new Array(DESIGN_LIMITS.segments + 1).fill(0);
    expect(errorsOf(JSON.stringify(d))).toEqual([`nodes: expected at most ${DESIGN_LIMITS.nodes} nodes, found ${DESIGN_LIMITS.nodes + 1}, fix: split the design into smaller ones`, `segments: expected at most ${DESIGN_LIMITS.segments} segments, found ${DESIGN_LIMITS.segments + 1}, fix: split the design into smaller ones`]);
  });
  it('string lengths: name, label, notes, ids', () => {
    expect(firstError(withDoc((d) => { d.name = 'n'.repeat(DESIGN_LIMITS.name + 1); }))).toBe(`name: expected a design name of at most ${DESIGN_LIMITS.name} characters, found "${'n'.repeat(57)}...", fix: change the text to fit`);
    expect(firstError(withDoc((d) => { d.nodes[0].label = 'l'.repeat(DESIGN_LIMITS.label + 1); }))).toBe(`nodes[0].label: expected a label of at most ${DESIGN_LIMITS.label} characters, found "${'l'.repeat(57)}...", fix: change the text to fit`);
    expect(firstError(withDoc((d) => { d.notes = 'x'.repeat(DESIGN_LIMITS.notes + 1); }))).toMatch(/^notes: expected notes of at most 50000 characters, found "x+\.\.\.", fix: change the text to fit$/);
    expect(firstError(withDoc((d) => { d.nodes[0].id = 'bad id with spaces'; }))).toBe(`nodes[0].id: expected an id of 1 to ${DESIGN_LIMITS.id} letters, digits, '_', '-', '.' or ':', found "bad id with spaces", fix: change the text to fit`);
  });
  it('points in a polygon', () => {
    const pts = Array.from({ length: DESIGN_LIMITS.polygonPoints + 1 }, (_, i) => ({ x: Math.cos(i) * 0.01, y: Math.sin(i) * 0.01 }));
    expect(firstError(withDoc((d) => { d.board.outline = pts; }))).toBe(`board.outline: expected an outline of at most ${DESIGN_LIMITS.polygonPoints} points, found a list of ${DESIGN_LIMITS.polygonPoints + 1}, fix: add or remove entries to fit`);
  });
});

describe('the README example', () => {
  it('the JSON shown in the README design section is a complete, valid design', () => {
    const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
    const section = readme.slice(readme.indexOf('<!-- section:design -->'), readme.indexOf('<!-- /section:design -->'));
    const json = /```json\n([\s\S]*?)```/.exec(section)![1]!;
    const r = parseDesign(json, { complete: true });
    expect(r.ok ? r.warnings : r.errors.map((e) => e.message)).toEqual([]);
  });
});

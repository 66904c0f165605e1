/**
 * A design written by hand (issue 14, fault 11): sections a default would fill are filled with the documented
 * defaults and named in a note; headings take degrees with a unit; every refusal reads "field: expected …, found …,
 * fix: …" with none of the validation library's own wording. Outside facts used: annealed copper conducts
 * 5.8e7 S/m (100 %IACS, International Annealed Copper Standard); 180° = π rad (definition of the radian).
 */
import { describe, expect, it } from 'vitest';
import { parseDesign, serializeDesign, PROCESS_DEFAULT, findPreset } from '../../core/index.ts';

const port = (id: string, x: number, heading: unknown, label: string) => ({ id, kind: 'port', at: { x, y: 0 }, zRef: 50, heading, label });
function handWritten(edit: (d: Record<string, any>) => void = () => {}): string {
  const d: Record<string, any> = {
    format: 'stripwright-design', version: 6, name: 'by hand',
    substrate: { er: 3.66, h: 0.508e-3, t: 35e-6, tanDelta: 0.0037 },
    frequency: { f0: 5.8e9 },
    nodes: [port('a', 0, 0, 'left'), port('b', 0.02, '180 deg', 'right')],
    segments: [{ id: 's', kind: 'line', a: 'a', b: 'b', width: { by: 'z0', z0: 50 }, length: { by: 'drawn' } }],
  };
  edit(d);
  return JSON.stringify(d);
}

describe('a hand-written design missing sections', () => {
  it('is accepted with the documented defaults filled and named in a note', () => {
    const r = parseDesign(handWritten());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.doc.substrate.sigma).toBe(5.8e7); // annealed copper, 100 %IACS
    expect(r.doc.substrate.roughness).toBe(0);
    expect(r.doc.frequency.band.start).toBeCloseTo(5.8e9 * 0.98, 0);
    expect(r.doc.frequency.band.stop).toBeCloseTo(5.8e9 * 1.02, 0);
    expect(r.doc.process).toEqual(PROCESS_DEFAULT);
    expect(r.doc.board).toBeNull();
    for (const k of ['areas', 'phaseGroups', 'targets', 'tolerances'] as const) expect(r.doc[k]).toEqual([]);
    const note = r.warnings.find((w) => w.source === 'design-defaults')!;
    for (const k of ['substrate.sigma', 'substrate.roughness', 'frequency.band', 'process', 'board', 'areas', 'phaseGroups']) expect(note.message).toContain(k);
  });
  it('takes the conductivity and roughness of the preset it names', () => {
    const r = parseDesign(handWritten((d) => { d.substrate.preset = 'glass-epoxy'; }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.doc.substrate.roughness).toBe(findPreset('glass-epoxy')!.spec.roughness);
    expect(r.doc.substrate.sigma).toBe(findPreset('glass-epoxy')!.spec.sigma);
  });
  it('keeps what the file gives, and a saved copy reads back with nothing left to fill', () => {
    const r = parseDesign(handWritten((d) => { d.substrate.roughness = 2e-6; d.board = { outline: [{ x: -0.01, y: -0.01 }, { x: 0.03, y: -0.01 }, { x: 0.03, y: 0.01 }] }; }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.doc.substrate.roughness).toBe(2e-6);
    expect(r.doc.board?.outline).toHaveLength(3);
    const again = parseDesign(serializeDesign(r.doc));
    expect(again.ok && again.warnings.some((w) => w.source === 'design-defaults')).toBe(false);
    expect(again.ok && again.doc).toEqual(r.doc);
  });
});

describe('headings in a hand-written file', () => {
  const headingOf = (h: unknown) => {
    const r = parseDesign(handWritten((d) => { d.nodes[1].heading = h; }));
    return r.ok ? r.doc.nodes[1]!.kind === 'port' ? (r.doc.nodes[1] as { heading: number }).heading : NaN : r.errors.map((e) => e.message).join('\n');
  };
  it('accept degrees with a unit as well as radians', () => {
    expect(headingOf('180 deg')).toBeCloseTo(Math.PI, 14);
    expect(headingOf('90°')).toBeCloseTo(Math.PI / 2, 14);
    expect(headingOf('-45deg')).toBeCloseTo(-Math.PI / 4, 14);
    expect(headingOf('1.5 rad')).toBe(1.5);
    expect(headingOf(Math.PI / 2)).toBe(Math.PI / 2);
  });
  it('refuse a number in text without its unit, and a unit of another kind, saying how to fix it', () => {
    expect(headingOf('90')).toMatch(/^nodes\[1\]\.heading: expected a heading in radians \(a number\) or an angle with its unit.*, found "90", fix: say which unit: "90 deg" or "90 rad"$/);
    expect(headingOf('90 mm')).toMatch(/^nodes\[1\]\.heading: expected .+, found "90 mm", fix: use deg, ° or rad as the unit$/);
  });
});

describe('every refusal in the user\'s words', () => {
  const bad: [string, (d: Record<string, any>) => void][] = [
    ['no substrate', (d) => { delete d.substrate; }],
    ['no name and no f0', (d) => { delete d.name; d.frequency = {}; }],
    ['a segment without its width', (d) => { delete d.segments[0].width; }],
    ['a node that is not an object', (d) => { d.nodes[0] = 42; }],
    ['a port without an id', (d) => { delete d.nodes[0].id; }],
    ['a heading too large', (d) => { d.nodes[0].heading = 100; }],
    ['nodes not a list', (d) => { d.nodes = {}; }],
    ['a process of an unknown kind', (d) => { d.process = { kind: 'laser' }; }],
  ];
  for (const [what, edit] of bad) {
    it(what, () => {
      const r = parseDesign(handWritten(edit));
      expect(r.ok).toBe(false);
      if (r.ok) return;
      for (const e of r.errors) {
        expect(e.message).toMatch(/^[^\s:][^:]*: expected .+, found .+, fix: .+$/s);
        expect(e.message).not.toMatch(/Invalid (key|type)|Expected |received|a design object/);
      }
    });
  }
});

/**
 * Design commands as data, applied as one batch (core/design/command-list.ts): the batch is the same document as the
 * commands run one by one through History (the app's editor), a refusal leaves the given design untouched and names
 * the entry, and the summary names what was added, moved and changed. The project's own rules (commands are data,
 * refusals are whole), so no outside source applies.
 */
import { describe, expect, it } from 'vitest';
import {
  applyCommandList, History, InputError, newDesign, parseCommandList, readCommandList, serializeDesign, type DesignDoc,
} from '../../core/index.ts';

function start(): DesignDoc {
  const d = newDesign({ name: 'batch', f0: 2.45e9 });
  d.nodes = [{ id: 'p1', kind: 'port', zRef: 50, heading: 0, at: { x: 0, y: 0 } }];
  return d;
}
const ROUTE = { id: 'run.route', args: { from: 'p1', points: [{ x: 0.02, y: 0 }] } };
const STUB = { id: 'run.stub', args: { segment: 's1', at: { x: 0.01, y: 0 } } };

function thrown(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('applyCommandList', () => {
  it('gives the document History gives for the same commands, one label per command', () => {
    const r = applyCommandList(start(), [ROUTE, STUB]);
    const h = new History(start());
    h.apply(ROUTE.id, ROUTE.args); h.mark(); h.apply(STUB.id, STUB.args); h.mark();
    expect(serializeDesign(r.doc)).toBe(serializeDesign(h.doc));
    expect(r.labels).toEqual(['Route', 'Add stub']);
    expect(r.summary.added.nodes).toEqual(r.doc.nodes.slice(1).map((n) => n.id));
    expect(r.summary.added.segments.sort()).toEqual(r.doc.segments.map((s) => s.id).sort());
  });

  it('refuses on the first bad command, naming it, and leaves the design given untouched', () => {
    const doc = start();
    const before = serializeDesign(doc);
    const e = thrown(() => applyCommandList(doc, [ROUTE, { id: 'run.stub', args: { segment: 's9', at: { x: 0, y: 0 } } }]));
    expect(e.field).toBe('commands[1] run.stub: args.segment');
    expect(e.got).toBe('"s9"');
    expect(serializeDesign(doc)).toBe(before);
  });

  it('summarises moves and other changes separately', () => {
    const drawn = applyCommandList(start(), [ROUTE]).doc;
    const r = applyCommandList(drawn, [
      { id: 'node.move', args: { id: 'n1', at: { x: 0.02, y: 0.005 } } },
      { id: 'segment.setSpec', args: { id: 's1', spec: { width: { by: 'z0', z0: 70.7 } } } },
    ]);
    expect(r.summary.moved).toEqual(['n1']);
    expect(r.summary.changed).toEqual([{ list: 'segments', id: 's1', fields: ['width'] }]);
    expect(r.summary.added.nodes).toEqual([]);
  });
});

describe('reading command lists', () => {
  it('takes one command or a list; refuses an empty list, a stray field, an unknown id and bad args', () => {
    expect(readCommandList(ROUTE)).toEqual([ROUTE]);
    expect(readCommandList([ROUTE, { id: 'design.setInfo', args: { name: 'x' } }])).toHaveLength(2);
    expect(thrown(() => readCommandList([])).expected).toBe('at least one command');
    expect(thrown(() => readCommandList([{ id: 'run.route', arg: {} }])).field).toBe('commands[0].arg');
    const unknown = thrown(() => readCommandList({ id: 'run.bridge' }));
    expect(unknown.code).toBe('bad-choice');
    expect(unknown.expected).toMatch(/run\.route/);
    expect(thrown(() => readCommandList([{ id: 'run.route', args: [1] }])).field).toBe('commands[0].args');
  });

  it('checks the JSON text as strictly as a design file: place of a syntax error, duplicate keys', () => {
    expect(parseCommandList(JSON.stringify(ROUTE), 'x.json')).toEqual([ROUTE]);
    expect(thrown(() => parseCommandList('[\n  {"id": }\n]', 'x.json')).field).toBe('x.json line 2, column 10');
    expect(thrown(() => parseCommandList('{"id": "run.route", "id": "run.tee"}', 'x.json')).code).toBe('bad-file');
  });
});

/**
 * `stripwright edit` run as a user would (through the CLI entry point): design commands given as data — a route, a
 * tee and a stub — give the very document the app's editor makes from the same commands (each through
 * `History.apply` and one undo step, as renderer/src/state/editor.svelte.ts `edit` does); a list with one bad
 * command is refused whole with the command, the field, what was expected and what was found, and nothing is
 * written; bad command lines exit 2. The project's own rules (commands are data, refusals are whole), so no outside
 * source applies; the drawn results themselves are checked in test/unit/gestures.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cli } from './cli-basics.test.ts';
import { History, newDesign, parseDesign, serializeDesign, type DesignDoc } from '../../core/index.ts';

const dir = mkdtempSync(join(tmpdir(), 'sw-edit-'));

/** A design with one port and nothing else: where a person starts drawing. */
function start(): DesignDoc {
  const d = newDesign({ name: 'edit from the command line', f0: 2.45e9 });
  d.nodes = [{ id: 'p1', kind: 'port', zRef: 50, heading: 0, at: { x: 0, y: 0 } }];
  return d;
}
const src = join(dir, 'start.json');
writeFileSync(src, serializeDesign(start()));

const ROUTE = { id: 'run.route', args: { from: 'p1', points: [{ x: 0.03, y: 0 }, { x: 0.03, y: 0.02 }] } };
const TEE = { id: 'run.tee', args: { segment: 's1', at: { x: 0.012, y: 0 }, points: [{ x: 0.012, y: -0.015 }] } };
const STUB = { id: 'run.stub', args: { segment: 's2', at: { x: 0.03, y: 0.01 }, side: 1, end: 'short' } };

/** What the app's editor makes of the same commands: each one History.apply and a mark (one undo step). */
function asTheAppDoes(commands: { id: string; args: unknown }[]): DesignDoc {
  const h = new History(start());
  for (const c of commands) { h.apply(c.id, c.args); h.mark(); }
  expect(h.undoLabels).toEqual(commands.map(() => expect.any(String)));
  return h.doc;
}

describe('stripwright edit', () => {
  it('a route, a tee and a stub from a command file give the document the app makes from the same commands', () => {
    const file = join(dir, 'cmds.json');
    writeFileSync(file, JSON.stringify([ROUTE, TEE, STUB], null, 2));
    const out = join(dir, 'drawn.json');
    const r = cli(['edit', src, '--commands', file, '--out', out]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const written = readFileSync(out, 'utf8');
    expect(written).toBe(serializeDesign(asTheAppDoes([ROUTE, TEE, STUB])));
    // The written file opens as a design, with the tee and the shorted stub's via in it.
    const back = parseDesign(written);
    expect(back.ok).toBe(true);
    if (back.ok) {
      expect(back.doc.nodes.filter((n) => n.kind === 'junction')).toHaveLength(2);
      expect(back.doc.nodes.filter((n) => n.kind === 'short')).toHaveLength(1);
    }
    expect(r.stdout).toMatch(/applied 3 commands to .*start\.json: Route, Add tee, Add stub/);
    expect(r.stdout).toMatch(/added 6 nodes \(n1, n2, n3, n4, n5, n6\); 6 pieces \(s1, s3, s2, s5, s4, s6\)/);
    expect(r.stdout).toMatch(/wrote .*drawn\.json/);
  });

  it('--command entries follow the file\'s, in order, and give the same document', () => {
    const file = join(dir, 'route.json');
    writeFileSync(file, JSON.stringify(ROUTE));
    const out = join(dir, 'drawn2.json');
    const r = cli(['edit', src, '--commands', file, '--command', JSON.stringify(TEE), '--command', JSON.stringify(STUB), '--out', out]);
    expect(r.code).toBe(0);
    expect(readFileSync(out, 'utf8')).toBe(serializeDesign(asTheAppDoes([ROUTE, TEE, STUB])));
  });

  it('says what moved and what changed', () => {
    const drawn = join(dir, 'base.json');
    writeFileSync(drawn, serializeDesign(asTheAppDoes([ROUTE])));
    const out = join(dir, 'moved.json');
    const r = cli(['edit', drawn, '--command', '{"id":"node.move","args":{"id":"n2","at":{"x":0.03,"y":0.025}}}',
      '--command', '{"id":"node.setSpec","args":{"id":"n2","spec":{"kind":"short"}}}', '--out', out]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/moved 1 node \(n2\)/);
    expect(r.stdout).toMatch(/changed n2 \(kind, via\)/);
  });

  it('refuses the whole list when one command fails: names the command and the field, writes nothing', () => {
    const out = join(dir, 'kept.json');
    writeFileSync(out, 'the user\'s own file\n');
    const bad = { id: 'run.stub', args: { segment: 'zz', at: { x: 0.01, y: 0 } } };
    const file = join(dir, 'bad.json');
    writeFileSync(file, JSON.stringify([ROUTE, TEE, bad]));
    const r = cli(['edit', src, '--commands', file, '--out', out]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/bad\.json\[2\] run\.stub: args\.segment: expected the id of a segment in the design, got "zz"/);
    expect(r.stderr).toMatch(/nothing was written/);
    expect(readFileSync(out, 'utf8')).toBe('the user\'s own file\n');
  });

  const never = join(dir, 'never.json');
  it('refuses an unknown command id, listing the ids', () => {
    const r = cli(['edit', src, '--command', '{"id":"run.bridge","args":{}}', '--out', never]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--command #1\.id: expected a command id: one of .*run\.route.*got "run\.bridge"/);
    expect(existsSync(never)).toBe(false);
  });
  it('refuses a stray field in a command', () => {
    const r = cli(['edit', src, '--command', '{"id":"run.route","arg":{}}', '--out', never]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--command #1\.arg: expected only "id" and "args" in a command/);
  });
  it('refuses broken JSON with its line and column', () => {
    const r = cli(['edit', src, '--command', '{"id": "run.route",\n "args": {]}', '--out', never]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--command #1 line 2, column \d+: expected/);
  });
  it('refuses a bad point, naming it by its place in the list', () => {
    const r = cli(['edit', src, '--command', JSON.stringify({ id: 'run.route', args: { from: 'p1', points: [{ x: 'far', y: 0 }] } }), '--out', never]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--command #1 run\.route: args\.points\[0\]\.x: expected a coordinate in metres/);
    expect(existsSync(never)).toBe(false);
  });

  it('a bad command line exits 2 with the usage', () => {
    const none = cli(['edit', src, '--out', join(dir, 'x.json')]);
    expect(none.code).toBe(2);
    expect(none.stderr).toMatch(/--commands FILE\.json or --command JSON/);
  });
  it('no --out exits 2', () => {
    const noOut = cli(['edit', src, '--command', JSON.stringify(ROUTE)]);
    expect(noOut.code).toBe(2);
  });
  it('help lists the drawing commands', () => {
    const help = cli(['help', 'edit']);
    expect(help.code).toBe(0);
    for (const id of ['run.route', 'run.tee', 'run.stub', 'run.insert']) expect(help.stdout).toContain(id);
  });
});

// Every bridge channel refuses a foreign origin and a missing frame (checklist item 17,
// https://www.electronjs.org/docs/latest/tutorial/security#17-validate-the-sender-of-all-ipc-messages), every
// argument is checked (project rule: argument schemas reject bad payloads), and errors come back as data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CHANNELS, ipcName, LIMITS, type Channel } from '../../bridge/contract.ts';
import { RecoveryStore } from '../../electron/files/recovery-store.ts';
import { registerBridge } from '../../electron/ipc.ts';
import { Shell } from '../../electron/shell.ts';

type H = (event: unknown, ...args: unknown[]) => Promise<{ ok: boolean; error?: { code: string; message: string }; value?: unknown }>;
const handlers = new Map<string, H>();
let dir: string;
const states: unknown[] = [];

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'sw-ipc-'));
  const recovery = new RecoveryStore(join(dir, 'recovery'), 'sess');
  const none = async () => null;
  const shell = new Shell({ userData: dir, documentsFolder: dir, recovery, version: '0.1.0', dialogs: { openDesign: none, openTouchstone: none, saveDesign: none, saveExport: none, chooseFolder: none, confirmReplace: async () => false } });
  await shell.start();
  const registered = registerBridge({ handle: (name: string, h: H) => { handlers.set(name, h); } } as never, shell, { setDocumentState: (_e, s) => states.push(s) });
  expect(registered).toEqual([...CHANNELS]);
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const ours = { senderFrame: { url: 'app://stripwright/index.html', parent: null } };
const call = (c: Channel, event: unknown, ...args: unknown[]) => handlers.get(ipcName(c))!(event, ...args);

const GOOD: { [C in Channel]: unknown[] } = {
  'design:open-dialog': [], 'design:open-path': [{ path: '/x/a.stripwright' }], 'data:open-touchstone': [],
  'design:save': [{ docId: 'd1', path: '/x/a.stripwright', text: '{}', expectedModifiedMs: null }],
  'design:save-as': [{ docId: 'd1', suggestedName: 'a', text: '{}' }],
  'export:files': [{ title: 'Export', files: [{ name: 'a.gbr', data: 'x' }] }],
  'recent:list': [], 'recent:clear': [], 'autosave:write': [{ docId: 'd1', name: 'n', path: null, text: '{}' }],
  'autosave:discard': [{ docId: 'd1' }], 'recovery:list': [], 'recovery:read': [{ docId: 'd1' }], 'recovery:discard': [{ docId: 'd1' }],
  'document:state': [{ title: 't', dirty: true }], 'app:info': [],
};

describe('sender check on every channel', () => {
  it('registers one handler per contract channel', () => {
    expect([...handlers.keys()].sort()).toEqual(CHANNELS.map(ipcName).sort());
  });
  for (const c of CHANNELS) {
    it(`${c}: refuses a null frame, a foreign origin and a subframe`, async () => {
      for (const event of [{ senderFrame: null }, {}, { senderFrame: { url: 'https://evil.example/' } }, { senderFrame: { url: 'file:///tmp/x.html' } },
        { senderFrame: { url: 'app://stripwright/index.html', parent: {} } }]) {
        const r = await call(c, event, ...GOOD[c]);
        expect(r).toMatchObject({ ok: false, error: { code: 'forbidden' } });
      }
    });
  }
  it('answers our page', async () => {
    expect(await call('app:info', ours)).toMatchObject({ ok: true, value: { shell: 'electron', version: '0.1.0' } });
    expect(await call('document:state', ours, { title: 'Feed', dirty: true })).toEqual({ ok: true, value: null });
    expect(states).toEqual([{ title: 'Feed', dirty: true }]);
  });
});

describe('argument checks', () => {
  const big = 'x'.repeat(LIMITS.designBytes + 1);
  const cases: [Channel, unknown[], RegExp][] = [
    ['app:info', [{}], /expected no argument/],
    ['recent:list', [1, 2], /at most one argument/],
    ['design:open-path', [], /expected an object/],
    ['design:open-path', [{ path: 42 }], /path: expected text/],
    ['design:open-path', [{}], /^design:open-path: path: expected text, got undefined\.$/],
    ['export:files', [{ title: 't', files: [{ data: 'x' }] }], /files\[0\]\.name: expected a file name \(text\), got undefined/],
    ['design:open-path', [{ path: '' }], /expected a file path/],
    ['design:open-path', [{ path: '/x\u0000y' }], /expected a file path/],
    ['design:open-path', [{ path: 'p'.repeat(5000) }], /at most 4096/],
    ['design:open-path', [['/x']], /got an array/],
    ['design:save', [{ docId: '../../etc', path: '/x', text: '', expectedModifiedMs: null }], /docId/],
    ['design:save', [{ docId: 'd', path: '/x', text: '', expectedModifiedMs: 'yesterday' }], /expectedModifiedMs/],
    ['design:save', [{ docId: 'd', path: '/x', text: '', expectedModifiedMs: Number.NaN }], /expectedModifiedMs/],
    ['design:save-as', [{ docId: 'd', suggestedName: 'n'.repeat(500), text: '' }], /suggestedName/],
    ['export:files', [{ title: 't', files: [] }], /non-empty list/],
    ['export:files', [{ title: 't', files: [{ name: '../../.bashrc', data: 'x' }] }], /without folders/],
    ['export:files', [{ title: 't', files: [{ name: 'a.gbr', data: 1 }] }], /text or bytes/],
    ['export:files', [{ title: 't', files: [{ name: 'a.gbr', data: 'x' }, { name: 'A.GBR', data: 'y' }] }], /appears twice/],
    ['export:files', [{ title: 't', files: Array.from({ length: LIMITS.exportFiles + 1 }, (_, i) => ({ name: `f${i}.txt`, data: '' })) }], /at most 64 files/],
    ['autosave:write', [{ docId: 'd', name: 'n', path: 7, text: '' }], /path: expected text/],
    ['autosave:write', [{ docId: '', name: 'n', path: null, text: '' }], /docId/],
    ['document:state', [{ title: 't', dirty: 'yes' }], /dirty: expected true or false/],
    ['recovery:read', [{ docId: 'a/b' }], /docId/],
    ['recovery:read', [Object.assign(Object.create({ polluted: true }), { docId: 'ok' })], /expected an object/],
  ];
  for (const [c, args, re] of cases) {
    it(`${c} refuses ${JSON.stringify(args).slice(0, 70)}`, async () => {
      const r = await call(c, ours, ...args);
      expect(r.ok).toBe(false);
      expect(r.error!.code).toBe('bad-request');
      expect(r.error!.message).toMatch(re);
    });
  }
  it('answers too-large, with what to do, for a design over the size limit', async () => {
    const r = await call('design:save', ours, { docId: 'd', path: '/x', text: big, expectedModifiedMs: null });
    expect(r).toMatchObject({ ok: false, error: { code: 'too-large', message: expect.stringMatching(/at most 16 MiB can be saved \(expected a smaller design/) } });
    const e = await call('export:files', ours, { title: 't', files: [{ name: 'a.png', data: new Uint8Array(LIMITS.exportFileBytes + 1) }] });
    expect(e).toMatchObject({ ok: false, error: { code: 'too-large' } });
  });
  it('turns a failure inside a handler into an error result, never a throw', async () => {
    const r = await call('design:open-path', ours, { path: '/x/never-granted.stripwright' });
    expect(r).toMatchObject({ ok: false, error: { code: 'forbidden' } });
  });
});

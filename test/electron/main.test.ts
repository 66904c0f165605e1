// electron/main.ts wired against a stand-in 'electron' (never the real one: project rule): single instance
// (app.requestSingleInstanceLock and 'second-instance', Electron app API), the privileged app:// scheme registered
// before 'ready' (Electron protocol API: registerSchemesAsPrivileged must run before ready), one handler per
// bridge channel, files from the command line, the OS and a second instance reaching the page, and the
// unsaved-changes prompt on close.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CHANNELS, ipcName, PUSH_CHANNELS } from '../../bridge/contract.ts';
import { CONTENT_SECURITY_POLICY } from '../../electron/csp.ts';
import { FakeBrowserWindow, makeFakeMain } from './fake-electron.ts';

let dir: string;
let fake: ReturnType<typeof makeFakeMain>;
const argv = process.argv;

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'sw-main-'));
  FakeBrowserWindow.created.length = 0;
  vi.resetModules();
});
afterEach(() => { process.argv = argv; vi.doUnmock('electron'); rmSync(dir, { recursive: true, force: true }); });

async function boot(o: { lock?: boolean; args?: string[] } = {}) {
  fake = makeFakeMain({ lock: o.lock, userData: join(dir, 'userData') });
  process.argv = ['/usr/bin/electron', '/app', ...(o.args ?? [])];
  vi.doMock('electron', () => fake.electron);
  await import('../../electron/main.ts');
}
const settle = () => new Promise((r) => setTimeout(r, 50));
async function started() {
  fake.ready();
  await vi.waitFor(() => expect(FakeBrowserWindow.created.length).toBe(1));
  await settle();
  return FakeBrowserWindow.created[0]! as FakeBrowserWindow & { close(): boolean; title: string; closed: number };
}
const pushes = (w: FakeBrowserWindow, channel: string) => w.webContents.sent.filter((s) => s.channel === channel).map((s) => s.payload);

describe('electron/main.ts', () => {
  it('a second instance quits at once and opens no window', async () => {
    await boot({ lock: false });
    fake.ready();
    await settle();
    expect(fake.calls.map((c) => c.name)).toContain('app.quit');
    expect(FakeBrowserWindow.created).toEqual([]);
  });

  it('registers app:// as standard and secure before ready, forces the sandbox, serves the bundle with the CSP', async () => {
    await boot();
    const reg = fake.calls.find((c) => c.name === 'protocol.registerSchemesAsPrivileged');
    expect(reg?.args[0]).toEqual([{ scheme: 'app', privileges: expect.objectContaining({ standard: true, secure: true }) }]);
    expect(fake.calls.some((c) => c.name === 'app.enableSandbox')).toBe(true);
    expect(fake.protocolHandlers.size).toBe(0); // handled only once ready
    await started();
    const res = await fake.protocolHandlers.get('app')!(new Request('app://stripwright/does-not-exist.js'));
    expect(res.status).toBe(404);
    expect(res.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
  });

  it('handles every bridge channel and nothing else, and refuses foreign senders', async () => {
    await boot();
    await started();
    expect([...fake.handles.keys()].sort()).toEqual(CHANNELS.map(ipcName).sort());
    const r = await fake.handles.get(ipcName('app:info'))!({ senderFrame: { url: 'https://evil.example/' } });
    expect(r).toMatchObject({ ok: false, error: { code: 'forbidden' } });
  });

  it('opens a design named on the command line once the page has loaded', async () => {
    const p = join(dir, 'row.stripwright');
    writeFileSync(p, '{"format":"stripwright-design"}');
    await boot({ args: [p] });
    const w = await started();
    expect(pushes(w, PUSH_CHANNELS.openDesign)).toEqual([]); // not before the page can listen
    w.webContents.emit('did-finish-load');
    await vi.waitFor(() => expect(pushes(w, PUSH_CHANNELS.openDesign)).toEqual([expect.objectContaining({ path: p, text: '{"format":"stripwright-design"}' })]));
  });

  it('hands a second instance’s file to this window and focuses it; macOS open-file too', async () => {
    const a = join(dir, 'a.stripwright'), b = join(dir, 'b.json');
    writeFileSync(a, '{}'); writeFileSync(b, '[]');
    await boot();
    const w = await started();
    w.webContents.emit('did-finish-load');
    fake.appEvents.emit('second-instance', {}, ['/usr/bin/stripwright', '--flag', 'a.stripwright'], dir);
    const ev = { preventDefault: vi.fn() };
    fake.appEvents.emit('open-file', ev, b);
    expect(ev.preventDefault).toHaveBeenCalled();
    await vi.waitFor(() => expect(pushes(w, PUSH_CHANNELS.openDesign).map((d) => (d as { path: string }).path).sort()).toEqual([a, b].sort()));
    expect(fake.calls.some((c) => c.name === 'focus')).toBe(true);
  });

  it('asks before closing a window with unsaved changes: Cancel keeps it, Save runs file.save, the recovery choice flushes first', async () => {
    await boot();
    const w = await started();
    const ours = { senderFrame: { url: 'app://stripwright/index.html' }, sender: w.webContents };
    await fake.handles.get(ipcName('document:state'))!(ours, { title: 'Feed', dirty: true });
    expect(w.title).toBe('• Feed — Stripwright');
    fake.messageBoxAnswers.push(2);
    expect(w.close()).toBe(true); // prevented
    fake.messageBoxAnswers.push(0);
    expect(w.close()).toBe(true);
    expect(pushes(w, PUSH_CHANNELS.menuCommand)).toEqual(['file.save']);
    fake.messageBoxAnswers.push(1);
    expect(w.close()).toBe(true);
    expect(pushes(w, PUSH_CHANNELS.flushAutosave)).toHaveLength(1);
    const before = w.closed;
    await fake.handles.get(ipcName('autosave:write'))!(ours, { docId: 'd1', name: 'Feed', path: null, text: '{}' });
    expect(w.closed).toBe(before + 1); // closed once the fresh recovery copy was written
  });

  it('closes after the save the user chose in the prompt, once the page reports it clean', async () => {
    await boot();
    const w = await started();
    const ours = { senderFrame: { url: 'app://stripwright/index.html' }, sender: w.webContents };
    await fake.handles.get(ipcName('document:state'))!(ours, { title: 'Feed', dirty: true });
    fake.messageBoxAnswers.push(0);
    w.close();
    const before = w.closed;
    await fake.handles.get(ipcName('document:state'))!(ours, { title: 'Feed', dirty: false });
    expect(w.closed).toBe(before + 1);
    expect(w.title).toBe('Feed — Stripwright');
  });

  it('reloads a crashed page into a new recovery session, but stops reloading after repeated crashes', async () => {
    await boot();
    const w = await started();
    let reloads = 0;
    (w.webContents as unknown as { reload: () => void }).reload = () => { reloads++; };
    for (let i = 0; i < 5; i++) w.webContents.emit('render-process-gone', {}, { reason: 'crashed' });
    expect(reloads).toBe(3);
    const boxes = fake.calls.filter((c) => c.name === 'dialog.showErrorBox').map((c) => c.args[0]);
    expect(boxes.slice(-1)).toEqual(['The Stripwright page keeps stopping']);
  });

  it('lets a confirmed close past the page’s beforeunload guard, and asks when the page knows of changes we do not', async () => {
    await boot();
    const w = await started();
    const ev = { preventDefault: vi.fn() };
    w.webContents.emit('will-prevent-unload', ev);
    expect(ev.preventDefault).not.toHaveBeenCalled(); // not confirmed: the unload stays stopped ...
    await settle();
    expect(fake.calls.filter((c) => c.name === 'dialog.showMessageBoxSync')).toHaveLength(1); // ... and our prompt asks
    const ours = { senderFrame: { url: 'app://stripwright/index.html' }, sender: w.webContents };
    fake.messageBoxAnswers.push(1);
    w.close();
    await fake.handles.get(ipcName('autosave:write'))!(ours, { docId: 'd1', name: 'Feed', path: null, text: '{}' });
    const ev2 = { preventDefault: vi.fn() };
    w.webContents.emit('will-prevent-unload', ev2);
    expect(ev2.preventDefault).toHaveBeenCalled(); // confirmed: the page's guard is overridden
  });

  it('closes without asking when nothing is unsaved', async () => {
    await boot();
    const w = await started();
    expect(w.close()).toBe(false);
    expect(fake.calls.some((c) => c.name === 'dialog.showMessageBoxSync')).toBe(false);
  });
});

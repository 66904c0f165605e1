// The preload surface (checklist item 20: expose named functions only, never ipcRenderer; callbacks get data, not
// the IPC event), built from a recorded transport, and the real preload.ts run against a stand-in 'electron'.
import { describe, expect, it, vi } from 'vitest';
import { CHANNELS, ipcName, PUSH_CHANNELS } from '../../bridge/contract.ts';
import { buildBridge } from '../../electron/bridge.ts';

const exposed: { key: string; api: unknown }[] = [];
const rendererListeners = new Map<string, ((event: unknown, payload: unknown) => void)[]>();
const invoked: unknown[][] = [];
vi.mock('electron', () => ({
  contextBridge: { exposeInMainWorld: (key: string, api: unknown) => exposed.push({ key, api }) },
  ipcRenderer: {
    invoke: (...a: unknown[]) => { invoked.push(a); return Promise.resolve({ ok: true, value: null }); },
    on: (c: string, l: (e: unknown, p: unknown) => void) => rendererListeners.set(c, [...(rendererListeners.get(c) ?? []), l]),
    removeListener: (c: string, l: unknown) => rendererListeners.set(c, (rendererListeners.get(c) ?? []).filter((x) => x !== l)),
  },
}));

describe('the bridge object', () => {
  it('has exactly one function per contract channel and the three subscriptions, frozen', () => {
    const b = buildBridge({ invoke: async () => null, on: () => () => {} });
    expect(Object.keys(b).sort()).toEqual(['calls', 'onFlushAutosave', 'onMenuCommand', 'onOpenDesign', 'shell']);
    expect(Object.keys(b.calls).sort()).toEqual([...CHANNELS].sort());
    expect(Object.isFrozen(b) && Object.isFrozen(b.calls)).toBe(true);
  });
  it('passes only known menu command ids and well-formed designs to the page', () => {
    const subs = new Map<string, (p: unknown) => void>();
    const b = buildBridge({ invoke: async () => null, on: (c, l) => { subs.set(c, l); return () => subs.delete(c); } });
    const got: unknown[] = [];
    const off = b.onMenuCommand((id) => got.push(id));
    subs.get(PUSH_CHANNELS.menuCommand)!('file.save');
    subs.get(PUSH_CHANNELS.menuCommand)!('rm -rf');
    subs.get(PUSH_CHANNELS.menuCommand)!({ sender: 'ipc event' });
    expect(got).toEqual(['file.save']);
    off();
    expect(subs.has(PUSH_CHANNELS.menuCommand)).toBe(false);
    const designs: unknown[] = [];
    b.onOpenDesign((d) => designs.push(d));
    subs.get(PUSH_CHANNELS.openDesign)!({ path: '/a', name: 'a', text: '{}', modifiedMs: 1 });
    subs.get(PUSH_CHANNELS.openDesign)!({ path: '/a' });
    expect(designs).toEqual([{ path: '/a', name: 'a', text: '{}', modifiedMs: 1 }]);
  });
});

describe('electron/preload.ts', () => {
  it('exposes only window.stripwright, invokes prefixed channels and hides the IPC event from callbacks', async () => {
    await import('../../electron/preload.ts');
    expect(exposed.map((e) => e.key)).toEqual(['stripwright']);
    const api = exposed[0]!.api as ReturnType<typeof buildBridge>;
    await api.calls['recent:list']();
    await api.calls['design:open-path']({ path: '/x' });
    expect(invoked).toEqual([[ipcName('recent:list')], [ipcName('design:open-path'), { path: '/x' }]]);
    const seen: unknown[][] = [];
    const off = api.onMenuCommand((...args: unknown[]) => seen.push(args));
    for (const l of rendererListeners.get(PUSH_CHANNELS.menuCommand)!) l({ sender: 'secret ipcRenderer' }, 'view.zoom-fit');
    expect(seen).toEqual([['view.zoom-fit']]);
    off();
    expect(rendererListeners.get(PUSH_CHANNELS.menuCommand)).toEqual([]);
  });
});

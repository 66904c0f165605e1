/**
 * The preload bridge: the only surface the page sees, as `window.stripwright` (bridge/contract.ts
 * StripwrightBridge). One function per channel and three subscriptions; the raw ipcRenderer never reaches the page
 * and callbacks receive data only, never the IPC event (checklist item 20). Sandboxed: imports nothing but
 * 'electron' and the pure contract (bundled into one CommonJS file by scripts/build-electron.mjs).
 */
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import { buildBridge } from './bridge.ts';

contextBridge.exposeInMainWorld('stripwright', buildBridge({
  invoke: (channel, arg) => (arg === undefined ? ipcRenderer.invoke(channel) : ipcRenderer.invoke(channel, arg)),
  on: (channel, listener) => {
    const wrapped = (_event: IpcRendererEvent, payload: unknown) => listener(payload);
    ipcRenderer.on(channel, wrapped);
    return () => { ipcRenderer.removeListener(channel, wrapped); };
  },
}));

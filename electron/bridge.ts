/**
 * Builds the object the preload exposes, from two primitives (invoke a channel, listen to a push channel), so its
 * shape and its filtering are unit-tested without Electron. Pure: only the contract.
 */
import { CHANNELS, ipcName, MENU_COMMANDS, PUSH_CHANNELS, type BridgeCalls, type Channel, type MenuCommandId, type OpenedDesign, type StripwrightBridge } from '../bridge/contract.ts';

export interface BridgeTransport {
  invoke(ipcChannel: string, arg?: unknown): Promise<unknown>;
  on(ipcChannel: string, listener: (payload: unknown) => void): () => void;
}

const isMenuCommand = (v: unknown): v is MenuCommandId => typeof v === 'string' && (MENU_COMMANDS as readonly string[]).includes(v);

function isOpenedDesign(v: unknown): v is OpenedDesign {
  if (!v || typeof v !== 'object') return false;
  const o = v as Record<string, unknown>;
  return typeof o.path === 'string' && typeof o.name === 'string' && typeof o.text === 'string' && typeof o.modifiedMs === 'number';
}

export function buildBridge(t: BridgeTransport): StripwrightBridge {
  const calls = {} as Record<Channel, (arg?: unknown) => Promise<unknown>>;
  for (const c of CHANNELS) {
    const name = ipcName(c);
    calls[c] = (arg?: unknown) => t.invoke(name, arg);
  }
  Object.freeze(calls);
  return Object.freeze({
    shell: 'electron' as const,
    calls: calls as unknown as BridgeCalls,
    onMenuCommand: (h: (id: MenuCommandId) => void) => t.on(PUSH_CHANNELS.menuCommand, (p) => { if (isMenuCommand(p)) h(p); }),
    onOpenDesign: (h: (d: OpenedDesign) => void) => t.on(PUSH_CHANNELS.openDesign, (p) => { if (isOpenedDesign(p)) h(p); }),
    onFlushAutosave: (h: () => void) => t.on(PUSH_CHANNELS.flushAutosave, () => h()),
  });
}

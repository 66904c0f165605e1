/**
 * Builds the object the preload exposes, from two primitives (invoke a channel, listen to a push channel), so its
 * shape and its filtering are unit-tested without Electron. Pure: the contract and the push payloads' schemas
 * (push-schemas.ts).
 */
import * as v from 'valibot';
import { menuCommandSchema, openedDesignSchema } from './push-schemas.ts';
import { CHANNELS, ipcName, PUSH_CHANNELS, type BridgeCalls, type Channel, type MenuCommandId, type OpenedDesign, type StripwrightBridge } from '../bridge/contract.ts';

export interface BridgeTransport {
  invoke(ipcChannel: string, arg?: unknown): Promise<unknown>;
  on(ipcChannel: string, listener: (payload: unknown) => void): () => void;
}

const isMenuCommand = (x: unknown): x is MenuCommandId => v.is(menuCommandSchema, x);
const isOpenedDesign = (x: unknown): x is OpenedDesign => v.is(openedDesignSchema, x);

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

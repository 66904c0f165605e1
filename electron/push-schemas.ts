/**
 * The valibot schemas of the push payloads (main process → page), checked in the preload (bridge.ts) before a
 * handler of the page sees them. Imports only valibot and the pure contract: the sandboxed preload bundles it.
 */
import * as v from 'valibot';
import { MENU_COMMANDS, type MenuCommandId, type OpenedDesign } from '../bridge/contract.ts';

export const openedDesignSchema: v.GenericSchema<unknown, OpenedDesign> = v.object({ path: v.string(), name: v.string(), text: v.string(), modifiedMs: v.number() });
export const menuCommandSchema: v.GenericSchema<unknown, MenuCommandId> = v.picklist(MENU_COMMANDS);

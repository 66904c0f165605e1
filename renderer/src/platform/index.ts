/**
 * getPlatform(): the one entry to files, dialogs, autosave and menus for the whole renderer.
 *   import { getPlatform } from './platform/index.ts';
 *   const r = await getPlatform().openDesign();
 *   if (!r.ok) showError(r.error.message); else if (r.value) load(r.value.text);
 */
import type { StripwrightBridge } from '../../../bridge/contract.ts';
import { createBrowserPlatform } from './browser.ts';
import { createDesktopPlatform } from './desktop.ts';
import type { Platform } from './types.ts';

export type * from './types.ts';
export { DESIGN_EXTENSION, MENU_COMMANDS, OPENABLE_EXTENSIONS, LIMITS } from './types.ts';
export { createAutosaver, type Autosaver, type AutosaverOptions } from './autosave.ts';
export { createBrowserPlatform } from './browser.ts';
export { createDesktopPlatform } from './desktop.ts';

let current: Platform | null = null;

/** The desktop bridge when the preload exposed one, else the browser fallback. Created once. */
export function getPlatform(): Platform {
  if (current) return current;
  const bridge = (globalThis as { stripwright?: StripwrightBridge }).stripwright;
  current = bridge && bridge.shell === 'electron' ? createDesktopPlatform(bridge) : createBrowserPlatform();
  return current;
}

/** Tests and the component harness may install their own platform (an in-memory one, for example). */
export function setPlatformForTesting(p: Platform | null): void { current = p; }

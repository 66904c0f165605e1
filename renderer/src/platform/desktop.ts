/** The Platform inside the Electron shell: each method is one call of the preload bridge (bridge/contract.ts). */
import type { BridgeResult, StripwrightBridge } from '../../../bridge/contract.ts';
import type { Platform } from './types.ts';

/** A bridge call that rejects (the main process crashed mid-call, say) still comes back as a result object. */
async function settle<T>(p: Promise<BridgeResult<T>>): Promise<BridgeResult<T>> {
  try {
    return await p;
  } catch (err) {
    return { ok: false, error: { code: 'io', message: `the desktop shell did not answer: ${err instanceof Error ? err.message : String(err)}` } };
  }
}

export function createDesktopPlatform(bridge: StripwrightBridge): Platform {
  const c = bridge.calls;
  return {
    kind: 'desktop',
    openDesign: () => settle(c['design:open-dialog']()),
    openRecent: (path) => settle(c['design:open-path']({ path })),
    openTouchstone: () => settle(c['data:open-touchstone']()),
    saveDesign: (req) => settle(c['design:save'](req)),
    saveDesignAs: (req) => settle(c['design:save-as'](req)),
    exportFiles: (req) => settle(c['export:files'](req)),
    listRecent: () => settle(c['recent:list']()),
    clearRecent: () => settle(c['recent:clear']()),
    autosave: (snapshot) => settle(c['autosave:write'](snapshot)),
    discardAutosave: (docId) => settle(c['autosave:discard']({ docId })),
    checkRecovery: () => settle(c['recovery:list']()),
    readRecovery: (docId) => settle(c['recovery:read']({ docId })),
    discardRecovery: (docId) => settle(c['recovery:discard']({ docId })),
    setDocumentState: (state) => settle(c['document:state'](state)),
    onMenuCommand: (h) => bridge.onMenuCommand(h),
    onOpenDesign: (h) => bridge.onOpenDesign(h),
    onFlushAutosave: (h) => bridge.onFlushAutosave(h),
  };
}

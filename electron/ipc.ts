/**
 * One handler per contract channel: check the sender (checklist item 17, by frame origin; a missing frame is
 * refused), check every argument against its schema (ipc-schemas.ts: types, sizes, paths), run the Shell method, and answer a result object. Nothing
 * is thrown across the bridge: a bug in a handler becomes `{ ok: false, error: { code: 'io', ... } }`.
 */
import type { IpcMain, IpcMainInvokeEvent } from 'electron';
import { CHANNELS, fail, ipcName, ok, type BridgeResult, type Channel, type RequestOf, type ResponseOf } from '../bridge/contract.ts';
import { checkRequest, type Problem } from './ipc-schemas.ts';
import { isTrustedSender } from './policy.ts';
import type { Shell } from './shell.ts';

/**
 * The argument check of each channel: its valibot schema (ipc-schemas.ts), whose first problem is answered as
 * 'bad-request' (or 'too-large' when making something smaller fixes it).
 */
type Check<T> = (v: unknown) => { value: T } | Problem;
export const VALIDATORS: { [C in Channel]: Check<RequestOf<C>> } = Object.fromEntries(
  CHANNELS.map((c) => [c, (x: unknown) => checkRequest(c, x)]),
) as { [C in Channel]: Check<RequestOf<C>> };

/** Per-window effects of a message (title, dirty flag) that need the window; main.ts supplies them. */
export interface WindowHooks {
  setDocumentState(event: IpcMainInvokeEvent, state: { title: string; dirty: boolean }): void;
  /** Called after every successful autosave (the close-with-recovery-copy flow waits for it). */
  autosaved?(event: IpcMainInvokeEvent): void;
}

type Handler<C extends Channel> = (req: RequestOf<C>, event: IpcMainInvokeEvent) => Promise<BridgeResult<ResponseOf<C>>>;

export function channelHandlers(shell: Shell, hooks: WindowHooks): { [C in Channel]: Handler<C> } {
  return {
    'design:open-dialog': () => shell.openDialog(),
    'data:open-touchstone': () => shell.openTouchstone(),
    'design:open-path': (r) => shell.openPath(r.path),
    'design:save': (r) => shell.save(r),
    'design:save-as': (r) => shell.saveAs(r),
    'export:files': (r) => shell.exportFiles(r),
    'recent:list': () => shell.listRecent(),
    'recent:clear': () => shell.clearRecent(),
    'autosave:write': async (r, e) => { const res = await shell.autosave(r); if (res.ok) hooks.autosaved?.(e); return res; },
    'autosave:discard': (r) => shell.discard(r.docId),
    'recovery:list': () => shell.listRecovery(),
    'recovery:read': (r) => shell.readRecovery(r.docId),
    'recovery:discard': (r) => shell.discard(r.docId),
    'document:state': async (r, e) => { hooks.setDocumentState(e, r); return ok(null); },
    'app:info': async () => ok(shell.appInfo()),
  };
}

/** The full pipeline of one message: sender, argument count, argument check, handler, errors as data. */
export function guarded<C extends Channel>(channel: C, handler: Handler<C>): (event: IpcMainInvokeEvent, ...args: unknown[]) => Promise<BridgeResult<ResponseOf<C>>> {
  return async (event, ...args) => {
    if (!isTrustedSender(event.senderFrame)) return fail('forbidden', `${channel}: refused a message that did not come from the Stripwright page.`);
    if (args.length > 1) return fail('bad-request', `${channel}: expected at most one argument, got ${args.length}.`);
    let checked: ReturnType<(typeof VALIDATORS)[C]>;
    try {
      checked = VALIDATORS[channel](args[0]) as ReturnType<(typeof VALIDATORS)[C]>;
    } catch {
      // A value no check foresaw (a getter that throws, an exotic object): refused, never an exception to the page.
      return fail('bad-request', `${channel}: expected the request described in the bridge contract, got a value that could not be read.`);
    }
    if ('problem' in checked) return fail(checked.tooLarge ? 'too-large' : 'bad-request', `${channel}: ${checked.problem}.`);
    try {
      return await handler(checked.value, event);
    } catch (err) {
      return fail('io', `${channel} failed unexpectedly: ${err instanceof Error ? err.message : String(err)}`);
    }
  };
}

export function registerBridge(ipcMain: Pick<IpcMain, 'handle'>, shell: Shell, hooks: WindowHooks): Channel[] {
  const handlers = channelHandlers(shell, hooks);
  for (const c of CHANNELS) ipcMain.handle(ipcName(c), guarded(c, handlers[c] as Handler<typeof c>));
  return [...CHANNELS];
}

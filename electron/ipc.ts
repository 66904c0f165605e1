/**
 * One handler per contract channel: check the sender (checklist item 17, by frame origin; a missing frame is
 * refused), check every argument (types, sizes, paths), run the Shell method, and answer a result object. Nothing
 * is thrown across the bridge: a bug in a handler becomes `{ ok: false, error: { code: 'io', ... } }`.
 */
import type { IpcMain, IpcMainInvokeEvent } from 'electron';
import { CHANNELS, fail, ipcName, LIMITS, ok, type BridgeResult, type Channel, type ExportFile, type RequestOf, type ResponseOf } from '../bridge/contract.ts';
import { DOC_ID_RE } from './files/recovery-store.ts';
import { isTrustedSender, plainFileNameProblem } from './policy.ts';
import type { Shell } from './shell.ts';

/** A problem with an argument; `tooLarge` ones answer 'too-large' (the user can act on it), the rest 'bad-request'. */
type Problem = { problem: string; tooLarge?: boolean };
type Check<T> = (v: unknown) => { value: T } | Problem;
const bad = (problem: string): Problem => ({ problem });
const big = (problem: string): Problem => ({ problem, tooLarge: true });
const good = <T>(value: T) => ({ value });

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v) && (Object.getPrototypeOf(v) === Object.prototype || Object.getPrototypeOf(v) === null);
}

function str(o: Record<string, unknown>, key: string, max: number): string | Problem {
  const v = o[key];
  if (typeof v !== 'string') return bad(`${key}: expected text, got ${v === null ? 'null' : typeof v}`);
  if (v.length > max) return bad(`${key}: expected at most ${max} characters, got ${v.length}`);
  return v;
}

/** The design text: over the limit is something the user can fix (split the design), so it says so. */
function text(o: Record<string, unknown>): string | Problem {
  const v = o.text;
  if (typeof v === 'string' && v.length > LIMITS.designBytes) {
    return big(`the design is ${(v.length / 1024 / 1024).toFixed(1)} MiB of text; at most ${(LIMITS.designBytes / 1024 / 1024).toFixed(0)} MiB can be saved (expected a smaller design: remove unused pieces or long Touchstone blocks)`);
  }
  return str(o, 'text', LIMITS.designBytes);
}

function path(o: Record<string, unknown>, key: string): string | Problem {
  const p = str(o, key, LIMITS.pathChars);
  if (typeof p !== 'string') return p;
  if (p.length === 0 || p.includes('\0')) return bad(`${key}: expected a file path, got ${JSON.stringify(p).slice(0, 80)}`);
  return p;
}

/** A value as shown in a message: text quoted and cut, anything else by its kind (a BigInt or a cycle cannot be JSON). */
function shown(v: unknown): string {
  if (typeof v === 'string') return JSON.stringify(v.slice(0, 80));
  if (v === null || v === undefined || typeof v === 'number' || typeof v === 'boolean') return String(v);
  if (typeof v === 'bigint') return 'a big integer';
  return Array.isArray(v) ? 'a list' : `${typeof v === 'object' ? 'an object' : `a ${typeof v}`}`;
}

function docId(o: Record<string, unknown>): string | Problem {
  const d = o.docId;
  if (typeof d !== 'string' || !DOC_ID_RE.test(d)) return bad(`docId: expected 1–${LIMITS.docIdChars} letters, digits, '-' or '_', got ${shown(d)}`);
  return d;
}

/** Build a validator of a plain object from field checks; the first problem wins. */
function object<T>(fields: (o: Record<string, unknown>) => T | Problem): Check<T> {
  return (v) => {
    if (!isPlainObject(v)) return bad(`expected an object, got ${Array.isArray(v) ? 'an array' : v === null ? 'null' : typeof v}`);
    const r = fields(v);
    return typeof r === 'object' && r !== null && 'problem' in r ? (r as Problem) : good(r as T);
  };
}

const none: Check<void> = (v) => (v === undefined ? good(undefined) : bad(`expected no argument, got ${typeof v}`));

function firstProblem(...xs: unknown[]): Problem | null {
  for (const x of xs) if (typeof x === 'object' && x !== null && 'problem' in x) return x as Problem;
  return null;
}


function exportFiles(v: unknown): ExportFile[] | Problem {
  if (!Array.isArray(v) || v.length === 0) return bad('files: expected a non-empty list of { name, data }');
  if (v.length > LIMITS.exportFiles) return bad(`files: expected at most ${LIMITS.exportFiles} files, got ${v.length}`);
  const seen = new Set<string>();
  let total = 0;
  const out: ExportFile[] = [];
  for (const [i, f] of v.entries()) {
    if (!isPlainObject(f)) return bad(`files[${i}]: expected { name, data }`);
    const p = plainFileNameProblem(f.name, LIMITS.fileNameChars);
    if (p) return bad(`files[${i}].name: ${p}`);
    const name = f.name as string;
    if (seen.has(name.toLowerCase())) return bad(`files[${i}].name: ${name} appears twice (names must differ also ignoring case)`);
    seen.add(name.toLowerCase());
    const data = f.data;
    if (typeof data !== 'string' && !(data instanceof Uint8Array)) return bad(`files[${i}].data: expected text or bytes (Uint8Array), got ${typeof data}`);
    if (data.length > LIMITS.exportFileBytes) return big(`files[${i}].data: expected at most ${LIMITS.exportFileBytes} bytes, got ${data.length}`);
    total += data.length;
    out.push({ name, data });
  }
  if (total > LIMITS.exportTotalBytes) return big(`files: expected at most ${LIMITS.exportTotalBytes} bytes in all, got ${total}`);
  return out;
}

export const VALIDATORS: { [C in Channel]: Check<RequestOf<C>> } = {
  'design:open-dialog': none,
  'data:open-touchstone': none,
  'design:open-path': object((o) => { const p = path(o, 'path'); return firstProblem(p) ?? { path: p as string }; }),
  'design:save': object((o) => {
    const d = docId(o), p = path(o, 'path'), t = text(o), m = o.expectedModifiedMs;
    const mBad = m === null || (typeof m === 'number' && Number.isFinite(m)) ? null : bad(`expectedModifiedMs: expected a time in ms or null, got ${typeof m}`);
    return firstProblem(d, p, t, mBad) ?? { docId: d as string, path: p as string, text: t as string, expectedModifiedMs: m as number | null };
  }),
  'design:save-as': object((o) => {
    const d = docId(o), n = str(o, 'suggestedName', LIMITS.fileNameChars), t = text(o);
    return firstProblem(d, n, t) ?? { docId: d as string, suggestedName: n as string, text: t as string };
  }),
  'export:files': object((o) => {
    const title = str(o, 'title', LIMITS.titleChars), files = exportFiles(o.files);
    return firstProblem(title, files) ?? { title: title as string, files: files as ExportFile[] };
  }),
  'recent:list': none,
  'recent:clear': none,
  'autosave:write': object((o) => {
    const d = docId(o), n = str(o, 'name', LIMITS.titleChars), t = text(o);
    const p = o.path === null ? null : path(o, 'path');
    return firstProblem(d, n, t, p) ?? { docId: d as string, name: n as string, path: p as string | null, text: t as string };
  }),
  'autosave:discard': object((o) => { const d = docId(o); return firstProblem(d) ?? { docId: d as string }; }),
  'recovery:list': none,
  'recovery:read': object((o) => { const d = docId(o); return firstProblem(d) ?? { docId: d as string }; }),
  'recovery:discard': object((o) => { const d = docId(o); return firstProblem(d) ?? { docId: d as string }; }),
  'document:state': object((o) => {
    const t = str(o, 'title', LIMITS.titleChars);
    const dirty = typeof o.dirty === 'boolean' ? o.dirty : bad(`dirty: expected true or false, got ${typeof o.dirty}`);
    return firstProblem(t, dirty) ?? { title: t as string, dirty: dirty as boolean };
  }),
  'app:info': none,
};

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

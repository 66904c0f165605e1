/**
 * The security decisions of the shell as pure functions, so each is unit-tested with tricky inputs
 * (project rule: one module of pure policy functions that the main process wires
 * up). Items refer to the Electron security checklist, https://www.electronjs.org/docs/latest/tutorial/security.
 * URLs are always parsed with WHATWG URL, never compared with startsWith (item 13).
 */
import { isAbsolute, join, normalize, relative, sep } from 'node:path';

/** Our page is served from app://stripwright/ (item 18: a custom protocol instead of file://). */
export const APP_SCHEME = 'app';
export const APP_HOST = 'stripwright';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_ENTRY = `${APP_ORIGIN}/index.html`;

function parse(url: string): URL | null {
  try { return new URL(url); } catch { return null; }
}

/** True only for URLs of our own origin. */
export function isAppUrl(url: string): boolean {
  const u = parse(url);
  return !!u && u.protocol === `${APP_SCHEME}:` && u.host === APP_HOST && u.username === '' && u.password === '' && u.port === '';
}

/** Item 13: navigation is allowed only within our own bundle (a reload, say); everything else is refused. */
export const isAllowedNavigation = (url: string): boolean => isAppUrl(url);

/** Item 17: an IPC message is trusted only from our page's main frame, by origin; a missing frame is refused. */
export function isTrustedSender(frame: { url: string; parent?: unknown } | null | undefined): boolean {
  if (!frame || typeof frame.url !== 'string') return false;
  if (frame.parent) return false; // subframes (we have none) never talk to the shell
  return isAppUrl(frame.url);
}

/** Item 5: the app needs no permission (camera, notifications, clipboard-read, serial, ...), so all are denied. */
export function permissionDecision(_permission: string): false {
  return false;
}

/**
 * Developer tools are for development only (a run from source, `npm start`): never in a packaged app, where they
 * would give anyone at the keyboard a console with the page's bridge.
 */
export function devToolsAllowed(isPackaged: boolean): boolean {
  return !isPackaged;
}

/**
 * Which requests may leave the page (the webRequest filter): our own origin, blob: URLs created by our page, inline
 * data: images, and — in development only — the devtools' own pages. Every http(s), ws, file or other scheme is
 * cancelled, so no remote content and no local file outside the bundle can load (items 1 and 18).
 */
export function isAllowedRequest(url: string, o: { devTools?: boolean } = {}): boolean {
  const u = parse(url);
  if (!u) return false;
  if (u.protocol === 'data:') return true;
  if (u.protocol === 'blob:') return isAppUrl(url.slice('blob:'.length));
  if (u.protocol === 'devtools:') return o.devTools === true;
  return isAppUrl(url);
}

/**
 * Item 18: map an app:// request to a file under `root`, or null. Rejects other origins, encoded or plain `..`
 * segments, backslashes, NUL and absolute paths; `/` maps to index.html. (Symlinks are checked by the protocol
 * handler with realpath, because that needs the file system.)
 */
export function resolveBundlePath(requestUrl: string, root: string): string | null {
  const u = parse(requestUrl);
  if (!u || u.protocol !== `${APP_SCHEME}:` || u.host !== APP_HOST) return null;
  // Look at the raw path too: WHATWG URL already folds plain `/../`, so check encoded forms before decoding.
  const rawPath = u.pathname;
  if (/%2e%2e|%2f|%5c|%00/i.test(rawPath)) return null;
  let rel: string;
  try { rel = decodeURIComponent(rawPath); } catch { return null; }
  if (rel.includes('\0') || rel.includes('\\')) return null;
  if (rel.split('/').some((s) => s === '..')) return null;
  if (rel === '' || rel.endsWith('/')) rel += 'index.html';
  const file = normalize(join(root, rel));
  const r = relative(root, file);
  if (r === '' || r.startsWith('..') || isAbsolute(r) || r.split(sep).includes('..')) return null;
  return file;
}

/** Windows device names a file may not be called, whatever its extension. */
const RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])(\.|$)/i;

/** An export file name must be a plain name: no folders, no leading dot, no characters Windows refuses. */
export function plainFileNameProblem(name: unknown, maxChars: number): string | null {
  if (typeof name !== 'string') return `expected a file name (text), got ${typeof name}`;
  if (name.length === 0 || name.length > maxChars) return `expected a name of 1–${maxChars} characters, got ${name.length}`;
  if (/[\\/]/.test(name)) return `expected a plain file name without folders, got ${JSON.stringify(name)}`;
  if (name.startsWith('.')) return `expected a name that does not start with a dot, got ${JSON.stringify(name)}`;
  if (/[\u0000-\u001f<>:"|?*]/.test(name)) return `expected no control characters or any of < > : " | ? *, got ${JSON.stringify(name)}`;
  if (RESERVED.test(name)) return `expected a name other than a Windows device name (CON, PRN, AUX, NUL, COM1…, LPT1…), got ${JSON.stringify(name)}`;
  if (/[ .]$/.test(name)) return `expected a name that does not end in a space or a dot, got ${JSON.stringify(name)}`;
  return null;
}

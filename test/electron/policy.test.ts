// The shell's security decisions against the Electron security checklist
// (https://www.electronjs.org/docs/latest/tutorial/security; item numbers as in that checklist).
// The tricky-URL tables follow that checklist's advice to parse URLs rather than compare prefixes (item 13) and
// the path-traversal forms of item 18.
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import {
  APP_ORIGIN, isAllowedNavigation, isAllowedRequest, isAppUrl, isTrustedSender, permissionDecision, plainFileNameProblem, resolveBundlePath,
} from '../../electron/policy.ts';

const ROOT = join('/opt', 'stripwright', 'dist', 'renderer');

describe('navigation (checklist item 13)', () => {
  const refused = [
    'https://app.example.com.attacker.com', 'http://127.0.0.1:5173/', 'file:///etc/passwd', 'file:///some/local/file',
    'javascript:alert(1)', 'data:text/html,<script>alert(1)</script>', 'about:blank', 'app://stripwright.attacker.com/',
    'app://evil/index.html', 'app://user:pw@stripwright/', 'app://stripwright:8080/', 'APP-x://stripwright/', 'stripwright://app/',
    'https://stripwright/', '', 'not a url', 'blob:https://evil.example/1234',
  ];
  for (const url of refused) it(`refuses ${JSON.stringify(url)}`, () => expect(isAllowedNavigation(url)).toBe(false));
  it('allows our own bundle (a reload)', () => {
    expect(isAllowedNavigation(`${APP_ORIGIN}/index.html`)).toBe(true);
    // Chromium lower-cases the host of a registered standard scheme before we see it; WHATWG URL keeps the case of
    // a non-special scheme's host, so an upper-case host reaching us is refused (strict is the safe side).
    expect(isAllowedNavigation('APP://STRIPWRIGHT/index.html')).toBe(false);
  });
});

describe('IPC sender (checklist item 17)', () => {
  it('trusts only our main frame, by origin', () => {
    expect(isTrustedSender({ url: `${APP_ORIGIN}/index.html` })).toBe(true);
    expect(isTrustedSender({ url: `${APP_ORIGIN}/index.html`, parent: null })).toBe(true);
  });
  it('refuses a null frame, foreign origins and subframes', () => {
    expect(isTrustedSender(null)).toBe(false);
    expect(isTrustedSender(undefined)).toBe(false);
    expect(isTrustedSender({ url: 'https://evil.example/' })).toBe(false);
    expect(isTrustedSender({ url: 'file:///tmp/x.html' })).toBe(false);
    expect(isTrustedSender({ url: 'app://stripwright.evil/' })).toBe(false);
    expect(isTrustedSender({ url: `${APP_ORIGIN}/index.html`, parent: {} })).toBe(false);
  });
});

describe('permissions (checklist item 5)', () => {
  // Names from Electron's session.setPermissionRequestHandler documentation.
  const names = ['clipboard-read', 'clipboard-sanitized-write', 'display-capture', 'fullscreen', 'geolocation', 'idle-detection', 'media',
    'mediaKeySystem', 'midi', 'midiSysex', 'notifications', 'pointerLock', 'keyboardLock', 'openExternal', 'speaker-selection',
    'storage-access', 'top-level-storage-access', 'window-management', 'unknown', 'fileSystem', 'hid', 'serial', 'usb'];
  for (const n of names) it(`denies ${n}`, () => expect(permissionDecision(n)).toBe(false));
});

describe('outgoing requests (checklist items 1 and 18)', () => {
  it('lets through only our origin, our blobs, data: images, and devtools in development only', () => {
    expect(isAllowedRequest(`${APP_ORIGIN}/assets/index-abc.js`)).toBe(true);
    expect(isAllowedRequest(`blob:${APP_ORIGIN}/0b1c-22`)).toBe(true);
    expect(isAllowedRequest('data:image/png;base64,AAAA')).toBe(true);
    expect(isAllowedRequest('devtools://devtools/bundled/inspector.html', { devTools: true })).toBe(true);
    expect(isAllowedRequest('devtools://devtools/bundled/inspector.html')).toBe(false);
  });
  for (const url of ['https://fonts.example.com/a.woff2', 'http://127.0.0.1:8080/', 'ws://localhost:1234', 'file:///etc/hosts', 'blob:https://evil.example/1', 'ftp://x/', 'chrome://settings'])
    it(`cancels ${url}`, () => expect(isAllowedRequest(url)).toBe(false));
  it('isAppUrl is false for garbage', () => expect(isAppUrl('::::')).toBe(false));
});

describe('bundle paths (checklist item 18)', () => {
  it('maps / and plain files under the root', () => {
    expect(resolveBundlePath(`${APP_ORIGIN}/`, ROOT)).toBe(join(ROOT, 'index.html'));
    expect(resolveBundlePath(`${APP_ORIGIN}/assets/a.js?v=1#x`, ROOT)).toBe(join(ROOT, 'assets', 'a.js'));
    expect(resolveBundlePath(`${APP_ORIGIN}/assets/my%20file.css`, ROOT)).toBe(join(ROOT, 'assets', 'my file.css'));
  });
  const attacks = [
    `${APP_ORIGIN}/..%2f..%2fetc/passwd`, `${APP_ORIGIN}/assets/..%5c..%5cwin.ini`,
    `${APP_ORIGIN}/a%00.js`, `${APP_ORIGIN}/%2Fetc%2Fpasswd`, 'app://evil/index.html', 'file:///etc/passwd', `${APP_ORIGIN}/%E0%A4%A`,
    `${APP_ORIGIN}/..\\..\\x`,
  ];
  for (const url of attacks) it(`refuses ${url}`, () => expect(resolveBundlePath(url, ROOT)).toBeNull());
  it('keeps plain and %2e-encoded ../ inside the root (WHATWG URL folds both as dot segments before we see them)', () => {
    expect(resolveBundlePath(`${APP_ORIGIN}/../../etc/passwd`, ROOT)).toBe(join(ROOT, 'etc', 'passwd'));
    expect(resolveBundlePath(`${APP_ORIGIN}/%2e%2e/%2e%2e/etc/passwd`, ROOT)).toBe(join(ROOT, 'etc', 'passwd'));
    expect(resolveBundlePath(`${APP_ORIGIN}/.%2E/x`, ROOT)).toBe(join(ROOT, 'x'));
  });
});

describe('export file names', () => {
  it('accepts ordinary names', () => {
    for (const n of ['feed-top.gbr', 'feed.drl', 'mask 1to1.png', 'Board (rev B).dxf']) expect(plainFileNameProblem(n, 120)).toBeNull();
  });
  // Windows naming rules: Microsoft, "Naming Files, Paths, and Namespaces" (reserved names, characters, trailing dot/space).
  for (const n of ['../x.gbr', 'a/b.gbr', 'a\\b.gbr', '.bashrc', 'CON', 'nul.txt', 'COM1.gbr', 'lpt9', 'a:b', 'x?.gbr', 'tab\t.gbr', 'dot.', 'space ', '', 'x'.repeat(121)])
    it(`refuses ${JSON.stringify(n)}`, () => expect(plainFileNameProblem(n, 120)).toMatch(/expected/));
  it('refuses a non-string', () => expect(plainFileNameProblem(42, 120)).toMatch(/expected a file name/));
});

// The app:// handler: the one CSP as a response header (checklist item 7 prefers a header, and frame-ancestors
// only works in one: W3C Content Security Policy Level 3, §6.4.2), only files inside the bundle, also through
// symlinks (item 18).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CONTENT_SECURITY_POLICY } from '../../electron/csp.ts';
import { APP_ORIGIN } from '../../electron/policy.ts';
import { createBundleHandler } from '../../electron/protocol.ts';

let base: string, root: string;
let handle: (r: Request) => Promise<Response>;
beforeAll(() => {
  base = mkdtempSync(join(tmpdir(), 'sw-proto-'));
  root = join(base, 'renderer');
  mkdirSync(join(root, 'assets'), { recursive: true });
  writeFileSync(join(root, 'index.html'), '<!doctype html><title>Stripwright</title>');
  writeFileSync(join(root, 'assets', 'app.js'), 'console.log(1)');
  writeFileSync(join(root, 'assets', 'poly.wasm'), new Uint8Array([0, 97, 115, 109]));
  writeFileSync(join(base, 'secret.txt'), 'do not serve');
  symlinkSync(join(base, 'secret.txt'), join(root, 'assets', 'link.txt'));
  handle = createBundleHandler(root);
});
afterAll(() => rmSync(base, { recursive: true, force: true }));

const get = (path: string, method = 'GET') => handle(new Request(`${APP_ORIGIN}${path}`, { method }));

describe('app:// bundle handler', () => {
  it('serves index.html with the CSP header from electron/csp.ts', async () => {
    const r = await get('/');
    expect(r.status).toBe(200);
    expect(r.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(r.headers.get('x-content-type-options')).toBe('nosniff');
    expect(r.headers.get('content-type')).toMatch(/^text\/html/);
    expect(await r.text()).toContain('<title>Stripwright</title>');
  });
  it('serves wasm as application/wasm (WebAssembly.instantiateStreaming requires it: WebAssembly Web API §3)', async () => {
    const r = await get('/assets/poly.wasm');
    expect(r.headers.get('content-type')).toBe('application/wasm');
    expect(new Uint8Array(await r.arrayBuffer())).toEqual(new Uint8Array([0, 97, 115, 109]));
  });
  it('refuses a symlink that points outside the bundle', async () => {
    const r = await get('/assets/link.txt');
    expect(r.status).toBe(403);
    expect(await r.text()).not.toContain('do not serve');
  });
  it('refuses encoded traversal and other origins, still with the CSP header', async () => {
    const r = await get('/..%2fsecret.txt');
    expect(r.status).toBe(403);
    expect(r.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    // %2e%2e is folded as a dot segment inside the root, so it asks for <root>/secret.txt, which does not exist.
    const folded = await get('/%2e%2e/secret.txt');
    expect(folded.status).toBe(404);
    expect(await folded.text()).not.toContain('do not serve');
    expect((await handle(new Request('app://other/index.html'))).status).toBe(403);
  });
  it('answers 404 for a missing file and 405 for a POST', async () => {
    expect((await get('/nope.js')).status).toBe(404);
    expect((await get('/assets')).status).toBe(404);
    expect((await get('/index.html', 'POST')).status).toBe(405);
  });
});

describe('the compute worker policy', () => {
  it('serves worker scripts with the worker policy and everything else with the page policy', async () => {
    const { mkdtempSync, writeFileSync, mkdirSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const { join } = await import('node:path');
    const { CONTENT_SECURITY_POLICY, WORKER_CONTENT_SECURITY_POLICY } = await import('../../electron/csp.ts');
    const { createBundleHandler } = await import('../../electron/protocol.ts');
    const root = mkdtempSync(join(tmpdir(), 'sw-worker-csp-'));
    mkdirSync(join(root, 'assets'));
    writeFileSync(join(root, 'assets', 'compute.worker-AbC123.js'), 'self.onmessage = () => {};');
    writeFileSync(join(root, 'assets', 'index-XyZ.js'), 'console.log(1);');
    const handle = createBundleHandler(root);
    const worker = await handle(new Request('app://stripwright/assets/compute.worker-AbC123.js'));
    const page = await handle(new Request('app://stripwright/assets/index-XyZ.js'));
    expect(worker.headers.get('Content-Security-Policy')).toBe(WORKER_CONTENT_SECURITY_POLICY);
    expect(page.headers.get('Content-Security-Policy')).toBe(CONTENT_SECURITY_POLICY);
    // The page policy never allows string evaluation; only the worker's does.
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/'unsafe-eval'/);
    expect(WORKER_CONTENT_SECURITY_POLICY).toMatch(/script-src 'self' 'wasm-unsafe-eval' 'unsafe-eval'/);
  });
});

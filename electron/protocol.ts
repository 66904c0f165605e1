/**
 * The app:// protocol handler: serves the built renderer (dist/renderer) with the one CSP (./csp.ts) as a
 * response header (checklist item 7 prefers a header; `frame-ancestors` works only as one). Only GET and HEAD,
 * only files under the bundle folder, also after resolving symlinks. A plain function of a Fetch Request, so it is
 * tested without Electron; main.ts passes it to protocol.handle.
 */
import { readFile, realpath, stat } from 'node:fs/promises';
import { extname, relative, isAbsolute } from 'node:path';
import { CONTENT_SECURITY_POLICY, policyFor } from './csp.ts';
import { resolveBundlePath } from './policy.ts';

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8', '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8', '.json': 'application/json', '.wasm': 'application/wasm', '.svg': 'image/svg+xml',
  '.png': 'image/png', '.ico': 'image/x-icon', '.woff2': 'font/woff2', '.txt': 'text/plain; charset=utf-8', '.map': 'application/json',
};

export const SECURITY_HEADERS: Record<string, string> = {
  'Content-Security-Policy': CONTENT_SECURITY_POLICY,
  'X-Content-Type-Options': 'nosniff',
  'Cross-Origin-Opener-Policy': 'same-origin',
  'Referrer-Policy': 'no-referrer',
  'Cache-Control': 'no-store',
};

const refuse = (status: number, text: string) => new Response(text, { status, headers: { 'Content-Type': 'text/plain; charset=utf-8', ...SECURITY_HEADERS } });

export function createBundleHandler(root: string): (request: Request) => Promise<Response> {
  let realRoot: Promise<string> | null = null;
  return async (request) => {
    if (request.method !== 'GET' && request.method !== 'HEAD') return refuse(405, 'method not allowed');
    const file = resolveBundlePath(request.url, root);
    if (!file) return refuse(403, 'forbidden');
    try {
      realRoot ??= realpath(root);
      const [rootReal, fileReal] = await Promise.all([realRoot, realpath(file)]);
      const rel = relative(rootReal, fileReal);
      if (rel === '' || rel.startsWith('..') || isAbsolute(rel)) return refuse(403, 'forbidden');
      const info = await stat(fileReal);
      if (!info.isFile()) return refuse(404, 'not found');
      const body = request.method === 'HEAD' ? null : await readFile(fileReal);
      // The compute worker's script carries its own, narrower policy (see csp.ts for why).
      const headers = { 'Content-Type': MIME[extname(fileReal).toLowerCase()] ?? 'application/octet-stream', ...SECURITY_HEADERS, 'Content-Security-Policy': policyFor(fileReal) };
      return new Response(body, { status: 200, headers });
    } catch {
      return refuse(404, 'not found');
    }
  };
}

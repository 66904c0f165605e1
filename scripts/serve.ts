/**
 * Static server for the built renderer (dist/renderer) on 127.0.0.1, answering through the desktop shell's app:// handler.
 * Used by `npm start` when Electron cannot start, and by the Playwright tests.
 *   tsx scripts/serve.ts [--port N]
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { APP_ORIGIN } from '../electron/policy.ts';
import { createBundleHandler, SECURITY_HEADERS } from '../electron/protocol.ts';

export const RENDERER_DIR = resolve(fileURLToPath(new URL('../dist/renderer', import.meta.url)));

/** Hosts the server answers for: the loopback names with its own port. Anything else (a DNS-rebinding name) is refused. */
export function allowedHost(host: string | undefined, port: number): boolean {
  if (!host) return false;
  const h = host.toLowerCase();
  return h === `127.0.0.1:${port}` || h === `localhost:${port}` || h === `[::1]:${port}`;
}

/**
 * Serves the bundle through the desktop shell's own app:// handler (electron/protocol.ts), so the browser gets
 * the same files, path checks, MIME types and Content-Security-Policy headers as the desktop app. Only GET and HEAD
 * (405 for every other method) and only for a loopback Host with our port (403 otherwise), so a page on another
 * site cannot reach it through DNS rebinding. Errors answer in plain words, never with an engine's message.
 */
export function serveRenderer(port: number, root = RENDERER_DIR): Promise<Server> {
  const handle = createBundleHandler(root);
  const server = createServer(async (req, res) => {
    const own = (server.address() as AddressInfo | null)?.port ?? port;
    const plain = (status: number, text: string, extra: Record<string, string> = {}) =>
      res.writeHead(status, { ...SECURITY_HEADERS, 'Content-Type': 'text/plain; charset=utf-8', ...extra }).end(`${text}\n`);
    if (!allowedHost(req.headers.host, own)) return plain(403, `This server answers only to 127.0.0.1:${own}, localhost:${own} or [::1]:${own}.`);
    if (req.method !== 'GET' && req.method !== 'HEAD') return plain(405, 'Only GET and HEAD are answered here.', { Allow: 'GET, HEAD' });
    try {
      const path = new URL(req.url ?? '/', 'http://127.0.0.1').pathname;
      const answer = await handle(new Request(`${APP_ORIGIN}${path}`, { method: req.method }));
      res.writeHead(answer.status, Object.fromEntries(answer.headers));
      res.end(req.method === 'HEAD' ? undefined : Buffer.from(await answer.arrayBuffer()));
    } catch {
      if (!res.headersSent) plain(500, 'The file could not be served.');
      else res.end();
    }
  });
  return new Promise((ok, fail) => {
    server.once('error', fail);
    server.listen(port, '127.0.0.1', () => ok(server));
  });
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const i = process.argv.indexOf('--port');
  const port = i > 0 ? Number(process.argv[i + 1]) : 4173;
  serveRenderer(port).then(() => console.log(`serving ${RENDERER_DIR} on http://127.0.0.1:${port}`));
}

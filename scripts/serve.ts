/**
 * Static server for the built renderer (dist/renderer) on 127.0.0.1, answering through the desktop shell's app:// handler.
 * Used by `npm start` when Electron cannot start, and by the Playwright tests.
 *   tsx scripts/serve.ts [--port N]
 */
import { createServer, type Server } from 'node:http';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { APP_ORIGIN } from '../electron/policy.ts';
import { createBundleHandler } from '../electron/protocol.ts';

export const RENDERER_DIR = resolve(fileURLToPath(new URL('../dist/renderer', import.meta.url)));

/**
 * Serves the bundle through the desktop shell's own app:// handler (electron/protocol.ts), so the browser gets
 * the same files, path checks, MIME types and Content-Security-Policy headers as the desktop app.
 */
export function serveRenderer(port: number, root = RENDERER_DIR): Promise<Server> {
  const handle = createBundleHandler(root);
  const server = createServer(async (req, res) => {
    try {
      const path = new URL(req.url ?? '/', 'http://127.0.0.1').pathname;
      const answer = await handle(new Request(`${APP_ORIGIN}${path}`, { method: req.method ?? 'GET' }));
      res.writeHead(answer.status, Object.fromEntries(answer.headers));
      res.end(Buffer.from(await answer.arrayBuffer()));
    } catch (err) {
      res.writeHead(500, { 'Content-Type': 'text/plain; charset=utf-8' }).end(String(err));
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

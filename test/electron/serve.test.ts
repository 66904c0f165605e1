// The browser fallback's server (scripts/serve.ts, `npm start` without Electron): only GET/HEAD (405 otherwise, in
// words, never an engine message) and only for a loopback Host with its own port (DNS rebinding, RFC 6454 origins:
// a foreign name pointing at 127.0.0.1 must not read the app).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { request } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Server } from 'node:http';
import { allowedHost, serveRenderer } from '../../scripts/serve.ts';

let server: Server, port: number, root: string;
beforeAll(async () => {
  root = mkdtempSync(join(tmpdir(), 'sw-serve-'));
  writeFileSync(join(root, 'index.html'), '<!doctype html><title>t</title>');
  server = await serveRenderer(0, root);
  port = (server.address() as AddressInfo).port;
});
afterAll(() => { server.close(); rmSync(root, { recursive: true, force: true }); });

function ask(method: string, host: string | null, path = '/'): Promise<{ status: number; body: string; allow?: string }> {
  return new Promise((ok, fail) => {
    const req = request({ host: '127.0.0.1', port, method, path, setHost: false, headers: host === null ? {} : { Host: host } }, (res) => {
      let body = ''; res.setEncoding('utf8'); res.on('data', (c) => { body += c; });
      res.on('end', () => ok({ status: res.statusCode ?? 0, body, allow: res.headers.allow }));
    });
    req.on('error', fail); req.end();
  });
}

describe('fallback server', () => {
  it('serves the app to 127.0.0.1, localhost and [::1] with its port', async () => {
    for (const h of [`127.0.0.1:${port}`, `localhost:${port}`, `LOCALHOST:${port}`, `[::1]:${port}`]) {
      const r = await ask('GET', h);
      expect(r.status, h).toBe(200);
      expect(r.body).toMatch(/<title>t<\/title>/);
    }
    expect((await ask('HEAD', `127.0.0.1:${port}`)).status).toBe(200);
  });
  for (const m of ['TRACE', 'POST', 'PUT', 'DELETE', 'OPTIONS', 'PATCH']) {
    it(`${m}: 405 with Allow: GET, HEAD and plain words`, async () => {
      const r = await ask(m, `127.0.0.1:${port}`);
      expect(r.status).toBe(405);
      expect(r.allow).toBe('GET, HEAD');
      expect(r.body).not.toMatch(/TypeError|Error:|unsupported/);
    });
  }
  for (const h of ['evil.example', `evil.example:${port}`, '127.0.0.1', `127.0.0.1:${port + 1}`, `localhost.evil.example:${port}`, `127.0.0.2:${port}`, null]) {
    it(`Host ${JSON.stringify(h)}: refused (403)`, async () => {
      const r = await ask('GET', h);
      expect(h === null ? [400, 403] : [403]).toContain(r.status); // no Host at all: Node itself answers 400
      expect(r.body).not.toMatch(/<title>/);
    });
  }
  it('the host rule alone', () => {
    expect(allowedHost(`localhost:${port}`, port)).toBe(true);
    expect(allowedHost(undefined, port)).toBe(false);
    expect(allowedHost(`[::1]:${port}extra`, port)).toBe(false);
  });
});

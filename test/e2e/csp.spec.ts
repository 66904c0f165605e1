/**
 * The renderer under the CSP it ships with (electron/csp.ts; scripts/serve.ts sends the same header the desktop
 * shell's app:// protocol sends). Sources: Electron security checklist item 7
 * (https://www.electronjs.org/docs/latest/tutorial/security#7-define-a-content-security-policy) and W3C Content
 * Security Policy Level 3 (script-src without 'unsafe-inline' blocks inline scripts, §6.1.11; without
 * 'unsafe-eval' eval() and new Function() throw EvalError, §6.1.11 / §4.4; connect-src limits fetch, §6.1.3;
 * a blocked load fires `securitypolicyviolation`, §5.3).
 */
import { expect, test, type Page } from '@playwright/test';
import { CONTENT_SECURITY_POLICY } from '../../electron/csp.ts';

declare global { interface Window { __violations?: string[]; __inlineRan?: boolean } }

async function openApp(page: Page): Promise<{ requests: string[] }> {
  const requests: string[] = [];
  page.on('request', (r) => requests.push(r.url()));
  // Installed before any page script: records every violation the page reports.
  await page.addInitScript(() => {
    window.__violations = [];
    document.addEventListener('securitypolicyviolation', (e) => window.__violations!.push(`${e.effectiveDirective} ${e.blockedURI}`));
  });
  const response = await page.goto('/');
  expect(response?.headers()['content-security-policy']).toBe(CONTENT_SECURITY_POLICY);
  await expect(page).toHaveTitle(/Stripwright/);
  return { requests };
}

test('normal use raises no CSP violation and makes no request off 127.0.0.1', async ({ page }) => {
  const { requests } = await openApp(page);
  // Use the app the way a person first does: visit every tab and panel (plots, Smith chart, outputs preview draw
  // themselves), pick pieces, move over the board, zoom, press Escape.
  await page.waitForLoadState('networkidle');
  let visited = 0;
  for (const prefix of ['tab-', 'dock-']) {
    const items = page.locator(`[data-testid^="${prefix}"]`);
    for (let i = 0; i < await items.count(); i++) {
      const item = items.nth(i);
      if (await item.isVisible()) { await item.click(); visited++; await page.waitForTimeout(300); }
    }
  }
  const rows = page.locator('[data-testid^="piece-row-"]');
  for (let i = 0; i < Math.min(await rows.count(), 3); i++) if (await rows.nth(i).isVisible()) await rows.nth(i).click();
  const board = page.getByTestId('board');
  const box = (await board.isVisible()) ? await board.boundingBox() : await page.locator('body').boundingBox();
  if (box) {
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.move(box.x + box.width / 3, box.y + box.height / 3, { steps: 5 });
    await page.mouse.wheel(0, -200);
  }
  await page.keyboard.press('Escape');
  await page.waitForTimeout(1000);
  expect(visited, 'no tab-* or dock-* controls found: the walk through the app did not happen').toBeGreaterThan(2);
  expect(await page.evaluate(() => window.__violations)).toEqual([]);
  const offHost = requests.filter((u) => { const p = new URL(u); return !['data:', 'blob:'].includes(p.protocol) && p.hostname !== '127.0.0.1'; });
  expect(offHost).toEqual([]);
  expect(requests.length).toBeGreaterThan(0);
});

test('an injected inline script does not run and is reported', async ({ page }) => {
  await openApp(page);
  await page.evaluate(() => {
    const s = document.createElement('script');
    s.textContent = 'window.__inlineRan = true';
    document.body.append(s);
  });
  // Wait for the report itself (delivered as a task, later on a loaded machine) instead of a fixed time.
  await expect.poll(() => page.evaluate(() => window.__violations)).toContainEqual(expect.stringMatching(/^script-src/));
  expect(await page.evaluate(() => window.__inlineRan)).toBeUndefined();
});

test('an injected inline event handler does not run', async ({ page }) => {
  await openApp(page);
  await page.evaluate(() => { document.body.insertAdjacentHTML('beforeend', '<img src="data:," onerror="window.__inlineRan = true">'); });
  // The handler's refusal is reported once the image has failed: wait for that report, not a fixed time.
  await expect.poll(() => page.evaluate(() => window.__violations)).toContainEqual(expect.stringMatching(/^script-src/));
  expect(await page.evaluate(() => window.__inlineRan)).toBeUndefined();
});

test('eval and new Function fail in page scripts', async ({ page }) => {
  // page.evaluate runs through the DevTools protocol, which CSP does not govern; so the probe is a page script of
  // our own origin (allowed by script-src 'self'), served by a route, that tries both and reports.
  await page.route('**/csp-eval-probe.js', (route) => route.fulfill({
    contentType: 'text/javascript',
    body: `const r = [];
      try { r.push(String((0, eval)('6*7'))); } catch (e) { r.push(e.name); }
      try { r.push(String(new Function('return 6*7')())); } catch (e) { r.push(e.name); }
      document.documentElement.dataset.evalProbe = r.join(',');`,
  }));
  await openApp(page);
  await page.evaluate(() => { const s = document.createElement('script'); s.src = '/csp-eval-probe.js'; document.head.append(s); });
  await expect(page.locator('html')).toHaveAttribute('data-eval-probe', 'EvalError,EvalError');
  expect(await page.evaluate(() => window.__violations)).toContainEqual(expect.stringMatching(/^script-src eval/));
});

test('fetching a remote address and loading a remote script are blocked', async ({ page }) => {
  const finished: string[] = [];
  const failed: string[] = [];
  page.on('requestfinished', (r) => finished.push(r.url()));
  page.on('requestfailed', (r) => failed.push(`${r.url()} ${r.failure()?.errorText ?? ''}`));
  await openApp(page);
  const fetched = await page.evaluate(async () => { try { await fetch('https://example.com/x.json'); return 'fetched'; } catch (e) { return (e as Error).name; } });
  expect(fetched).toBe('TypeError');
  await page.evaluate(() => { const s = document.createElement('script'); s.src = 'https://example.com/x.js'; document.head.append(s); });
  const violations = () => page.evaluate(() => window.__violations!);
  await expect.poll(violations).toContainEqual('script-src-elem https://example.com/x.js');
  expect(await violations()).toContainEqual('connect-src https://example.com/x.json');
  await expect.poll(() => failed.length).toBeGreaterThan(0);
  // Chromium announces the request, then refuses it before it leaves: nothing from example.com completes.
  expect(finished.filter((u) => u.includes('example.com'))).toEqual([]);
  expect(failed).toContainEqual(expect.stringMatching(/^https:\/\/example\.com\/x\.js .*(BLOCKED|CSP)/i));
});

/**
 * The README screenshots are taken at moments inside the browser tests, but written into the tracked
 * docs/screenshots/ only by `npm run screenshots` (scripts/screenshots.ts sets STRIPWRIGHT_SCREENSHOTS=1). An
 * ordinary test run writes them under test-results/ (ignored by git), so `npm test` leaves the tree clean.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from '@playwright/test';

export const README_SHOTS = 'docs/screenshots';
const folder = () => (process.env.STRIPWRIGHT_SCREENSHOTS === '1' ? README_SHOTS : join('test-results', 'readme-screenshots'));

export async function readmeShot(page: Page, name: string): Promise<void> {
  const dir = folder();
  mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: join(dir, name) });
}

/** Where a README picture made by other means (a report page rendered by poppler) goes, by the same rule. */
export function readmeShotPath(name: string): string {
  const dir = folder();
  mkdirSync(dir, { recursive: true });
  return join(dir, name);
}

/**
 * A README picture that is the same bytes on every run: the status bar's layout time (which differs run to run) is
 * hidden, and the page is taken once two screenshots in a row agree (at most 20 tries, 250 ms apart), so a frame half
 * drawn or a chart still settling is never kept.
 */
export async function stableReadmeShot(page: Page, name: string): Promise<void> {
  const layoutMs = page.getByTestId('layout-ms');
  if (await layoutMs.count()) await layoutMs.evaluate((e) => { (e as HTMLElement).style.display = 'none'; });
  writeFileSync(readmeShotPath(name), await settledScreenshot(page));
}

/** The page once it has stopped changing: screenshots until two in a row agree (at most 20, 250 ms apart). */
export async function settledScreenshot(page: Page): Promise<Buffer> {
  let last = await page.screenshot({ animations: 'disabled', caret: 'hide' });
  for (let k = 0; k < 20; k++) {
    await page.waitForTimeout(250);
    const next = await page.screenshot({ animations: 'disabled', caret: 'hide' });
    if (next.equals(last)) break;
    last = next;
  }
  return last;
}

/**
 * The README screenshots are taken at moments inside the browser tests, but written into the tracked
 * docs/screenshots/ only by `npm run screenshots` (scripts/screenshots.ts sets STRIPWRIGHT_SCREENSHOTS=1). An
 * ordinary test run writes them under test-results/ (ignored by git), so `npm test` leaves the tree clean.
 */
import { mkdirSync } from 'node:fs';
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

import { expect, test } from '@playwright/test';
import { mkdirSync } from 'node:fs';

test('the served renderer opens on the demo design with an empty board', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (m) => { if (/Content Security Policy|Refused to/.test(m.text())) violations.push(m.text()); });
  await page.goto('/');
  await expect(page).toHaveTitle(/Stripwright/);
  await expect(page.getByTestId('design-name')).toContainText('5.8 GHz');
  await expect(page.getByTestId('board')).toBeVisible();
  mkdirSync('reports/screenshots', { recursive: true });
  await page.screenshot({ path: 'reports/screenshots/smoke.png' });
  expect(violations).toEqual([]);
});

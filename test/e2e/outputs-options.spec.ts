/**
 * The Outputs panel offers every option of `stripwright export` (core/pipeline): here a person picks DXF R12, adds
 * the mask as PDF, turns on the isolation layer (its width comes from the design's own V-bit process) and an etch
 * bias, exports, and the downloaded files are read back by outside tools:
 *  - DXF: dxf-parser 1.1.2 from npm; $ACADVER AC1009 is the R12 version code (DXF reference, header variables); the
 *    isolation outlines sit on their own layer and are closed polylines;
 *  - PDF: Debian poppler-utils' pdfinfo reads one page of A4 (210 × 297 mm = 595.3 × 841.9 pt, ISO 216), and pdftotext
 *    finds the design's hash on the sheet.
 * The files carry the design's hash and the app's version (the same bytes the CLI writes; test/cli/export-faces).
 */
import { expect, test, type Download } from '@playwright/test';
import DxfParser from 'dxf-parser';
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';

test('export DXF R12 and the mask as PDF from Outputs, with isolation and bias', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('dock-outputs').click();
  await expect(page.getByTestId('outputs-panel')).toBeVisible();
  await expect(page.getByTestId('export-preview').locator('img')).toBeVisible({ timeout: 30_000 });
  await page.getByTestId('opt-dxf-version').selectOption('r12');
  await page.getByTestId('kind-mask-pdf').check();
  await page.getByTestId('layer-isolation').check();
  await expect(page.getByTestId('file-options')).toContainText(/process: 0\.\d{3} mm/);
  const bias = page.getByTestId('opt-bias');
  await bias.fill('0.035mm');
  await bias.press('Tab');

  const downloads: Download[] = [];
  page.on('download', (d) => downloads.push(d));
  await page.getByTestId('export-now').click();
  await expect.poll(() => downloads.length, { timeout: 30_000 }).toBe(2);
  await expect(page.getByTestId('export-error')).toHaveCount(0);
  const byName = Object.fromEntries(await Promise.all(downloads.map(async (d) => [d.suggestedFilename(), (await d.path())!] as const)));
  const names = Object.keys(byName);
  const dxfName = names.find((n) => n.endsWith('.dxf'));
  const pdfName = names.find((n) => n.endsWith('-mask.pdf'));
  expect(dxfName && pdfName, names.join(', ')).toBeTruthy();

  const dxfText = readFileSync(byName[dxfName!]!, 'utf8');
  const dxf = new DxfParser().parseSync(dxfText) as unknown as { header: Record<string, unknown>; entities: { type: string; layer: string; shape?: boolean }[] };
  expect(dxf.header.$ACADVER).toBe('AC1009');
  const iso = dxf.entities.filter((e) => e.layer === 'ISOLATION_PATH');
  expect(iso.length).toBeGreaterThan(0);
  expect(iso.every((e) => e.type === 'POLYLINE' && e.shape)).toBe(true);

  const pdfPath = byName[pdfName!]!;
  expect(readFileSync(pdfPath, 'latin1').slice(0, 5)).toBe('%PDF-');
  const info = execFileSync('pdfinfo', [pdfPath], { encoding: 'utf8', env: { ...process.env, PATH: `/usr/bin:/bin:${process.env.PATH ?? ''}` } });
  expect(info).toMatch(/Pages:\s+1/);
  expect(info).toMatch(/Page size:\s+595\.\d+ x 841\.\d+ pts \(A4\)/);
  // The sheet's title line names the design's hash (poppler's pdftotext reads the page's text).
  const text = execFileSync('pdftotext', [pdfPath, '-'], { encoding: 'utf8', env: { ...process.env, PATH: `/usr/bin:/bin:${process.env.PATH ?? ''}` } });
  expect(text).toMatch(/design [0-9a-f]{8}:/);
});

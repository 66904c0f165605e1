/**
 * Measured data and the design report, as a person does it in the browser at 1366×768: open the Measured tab, pick
 * a Touchstone file of the board with the file chooser, see the ports mapped in order, notice the large difference,
 * correct the map with the two drop-downs, read the remaining difference (the invented board of
 * test/fixtures/measured is 0.9× in the transmissions from the input, 0.7× to patch 2: 20·log10 0.9 = −0.915 dB,
 * 20·log10 0.7 = −3.098 dB), undo and redo a map
 * change with the keys, then write the Touchstone file (what `stripwright sweep --out` writes) and the design
 * report from Outputs and read the report back with poppler's pdftotext and pdfinfo (Debian poppler-utils); and the
 * report as one command from the command finder, page for page and word for word what `stripwright report` writes.
 */
import { readmeShot, readmeShotPath } from './readme-shots.ts';
import { expect, test } from '@playwright/test';
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');
const FILE = join(ROOT, 'test', 'fixtures', 'measured', 'demo-board.s5p');

test('load a measured file, correct its port map, see the overlay and the difference, undo it', async ({ page }) => {
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('dock-measured').click();
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('measured-load').click();
  await (await chooser).setFiles(FILE);
  await expect(page.getByTestId('measured-file-m1')).toHaveText('demo-board.s5p');

  // Guessed in order: file port 2 is taken as the design's second port (patch 1) — wrong for this board, whose
  // patch 2 path is the weak one (0.7×, −3.10 dB): the table puts that loss on S21.
  await expect(page.getByTestId('port-map-2')).toHaveValue('out1');
  await expect(page.getByTestId('port-map-3')).toHaveValue('out2');
  const worstDb = async (s: string) => Number(((await page.getByTestId(`compare-row-${s}`).locator('td').nth(3).textContent()) ?? '').trim());
  await expect(page.getByTestId('compare-table')).toBeVisible();
  await expect.poll(() => worstDb('S21')).toBeCloseTo(3.1, 1);

  // The person reads the file's port list and maps file ports 2 and 3 the other way round.
  await page.getByTestId('port-map-2').selectOption({ label: 'patch 2' });
  await page.getByTestId('port-map-3').selectOption({ label: 'patch 1' });
  await expect(page.getByTestId('port-map-3')).toHaveValue('out1');
  // Now each loss sits on its own path: 0.9× (0.92 dB) to patch 1, 0.7× (3.10 dB) to patch 2.
  await expect.poll(() => worstDb('S21')).toBeCloseTo(0.92, 2);
  await expect.poll(() => worstDb('S31')).toBeCloseTo(3.1, 2);
  await expect(page.getByTestId('measured-overlay').locator('canvas')).toBeVisible();
  await expect(page.getByTestId('measured-difference').locator('canvas')).toBeVisible();
  // Give the dock more of the window by dragging its top edge up, as a person would to read the plots.
  const grip = (await page.getByRole('separator', { name: 'Drag to resize the dock' }).boundingBox())!;
  await page.mouse.move(grip.x + grip.width / 2, grip.y + grip.height / 2);
  await page.mouse.down();
  await page.mouse.move(grip.x + grip.width / 2, grip.y - 180, { steps: 8 });
  await page.mouse.up();
  await expect.poll(async () => (await page.getByTestId('measured-overlay').boundingBox())!.height).toBeGreaterThan(240);
  await readmeShot(page, 'measured.png');

  // Undo the last map change with the keys, and redo it.
  await page.locator('body').click({ position: { x: 5, y: 5 } });
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('port-map-3')).toHaveValue('out2');
  await page.keyboard.press('Control+Shift+z');
  await expect(page.getByTestId('port-map-3')).toHaveValue('out1');

  // Removing the file is one step too.
  await page.getByTestId('measured-remove-m1').click();
  await expect(page.getByTestId('measured-file-m1')).toHaveCount(0);
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('measured-file-m1')).toBeVisible();
});

test('write the Touchstone file and the design report from Outputs', async ({ page }) => {
  test.setTimeout(180_000); // the CLI run from source for the comparison takes a while on a busy machine
  const dir = mkdtempSync(join(tmpdir(), 'sw-e2e-report-'));
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('dock-outputs').click();
  await page.getByTestId('kind-dxf').uncheck();

  // Touchstone: the same bytes as the CLI writes for a design file of the same name (2.0: the demo's input is 50 Ω,
  // its outputs 100 Ω, and 2.0 keeps each port's reference).
  await page.getByTestId('kind-touchstone').check();
  let download = page.waitForEvent('download');
  await page.getByTestId('export-now').click();
  const ts = await download;
  const tsName = ts.suggestedFilename();
  expect(tsName).toMatch(/\.s5p$/);
  await ts.saveAs(join(dir, tsName));
  const base = tsName.replace(/\.s5p$/, '');
  copyFileSync(join(ROOT, 'assets', 'examples', 'demo.json'), join(dir, `${base}.json`));
  const cli = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'cli', 'main.ts'), 'sweep', join(dir, `${base}.json`), '--out', join(dir, 'cli.s5p'), '--touchstone', '2.0'], { cwd: ROOT, encoding: 'utf8' });
  expect(cli.status, cli.stderr).toBe(0);
  // The same function writes both (in Node it gives the very same bytes: test/unit/measured-job.test.ts); the browser's
  // JavaScript engine may round the last bit of a sine or logarithm differently from Node's, so the numbers are
  // compared to 1e-12 and everything else byte for byte.
  const app = readFileSync(join(dir, tsName), 'utf8').split(/\s+/), ref = readFileSync(join(dir, 'cli.s5p'), 'utf8').split(/\s+/);
  expect(app.length).toBe(ref.length);
  app.forEach((w, k) => {
    const a = Number(w), b = Number(ref[k]);
    if (Number.isFinite(a) && Number.isFinite(b) && w !== ref[k]) expect(Math.abs(a - b), `word ${k}`).toBeLessThan(1e-12 * Math.max(1, Math.abs(b)));
    else expect(w, `word ${k}`).toBe(ref[k]);
  });

  // The report.
  await page.getByTestId('kind-touchstone').uncheck();
  await page.getByTestId('kind-report').check();
  download = page.waitForEvent('download');
  await page.getByTestId('export-now').click();
  const pdf = await download;
  expect(pdf.suggestedFilename()).toMatch(/-report\.pdf$/);
  const file = join(dir, pdf.suggestedFilename());
  await pdf.saveAs(file);
  const info = spawnSync('pdfinfo', [file], { encoding: 'utf8' });
  expect(info.status, info.stderr).toBe(0);
  expect(info.stdout).toMatch(/Page size:\s+595\.276 x 841\.89 pts \(A4\)/);
  const text = spawnSync('pdftotext', [file, '-'], { encoding: 'utf8' }).stdout;
  expect(text).toContain('Design report: Four-way patch row feed');
  for (const h of ['Pieces (at f0)', 'Path ledger', 'Shop check', 'Models used', 'Not modelled', 'Cautions']) expect(text).toContain(h);
  expect(text).toContain('Ω');
});

test('the design report is one command: the command finder writes the PDF at once, as `stripwright report` does', async ({ page }) => {
  test.setTimeout(180_000); // the CLI run from source for the comparison takes a while on a busy machine
  const dir = mkdtempSync(join(tmpdir(), 'sw-e2e-report-cmd-'));
  await page.goto('/');
  await page.locator('[data-piece]').first().waitFor();
  await page.getByTestId('dock-paths').click();
  // Ctrl+K, a few letters, Enter: the file comes as a download (a save dialog on the desktop), no panel opens.
  const download = page.waitForEvent('download');
  await page.keyboard.press('Control+k');
  await page.keyboard.type('design report');
  await page.keyboard.press('Enter');
  const pdf = await download;
  expect(pdf.suggestedFilename()).toMatch(/-report\.pdf$/);
  await expect(page.getByTestId('outputs-panel')).toHaveCount(0);
  await expect(page.getByText(/Wrote .*-report\.pdf/)).toBeVisible();
  const file = join(dir, pdf.suggestedFilename());
  await pdf.saveAs(file);

  // The CLI on the same design (the demo the app opened): the same pages and the same words, read back with
  // poppler's pdfinfo and pdftotext (Debian poppler-utils).
  const cli = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'cli', 'main.ts'), 'report', join(ROOT, 'assets', 'examples', 'demo.json'), '--out', join(dir, 'cli.pdf')], { cwd: ROOT, encoding: 'utf8' });
  expect(cli.status, cli.stderr).toBe(0);
  const pages = (f: string) => Number(/Pages:\s+(\d+)/.exec(spawnSync('pdfinfo', [f], { encoding: 'utf8' }).stdout)?.[1]);
  expect(pages(file)).toBeGreaterThanOrEqual(2);
  expect(pages(file)).toBe(pages(join(dir, 'cli.pdf')));
  const text = (f: string) => spawnSync('pdftotext', ['-layout', f, '-'], { encoding: 'utf8' }).stdout;
  const app = text(file), ref = text(join(dir, 'cli.pdf'));
  expect(app).toContain('Design report: Four-way patch row feed');
  for (const h of ['Pieces (at f0)', 'Path ledger', 'Shop check', 'Models used', 'Not modelled', 'Cautions']) expect(app).toContain(h);
  expect(app).toBe(ref);
  // The first page, rendered by poppler's pdftoppm, for the README.
  const shot = spawnSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', '-singlefile', file, readmeShotPath('report-page1.png').replace(/\.png$/, '')], { encoding: 'utf8' });
  expect(shot.status, shot.stderr).toBe(0);
});

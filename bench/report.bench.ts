/**
 * The design report of the demo (assets/examples/demo.json): sizing, shop check, path ledger, 401-point sweep, vector
 * plots and the PDF with DejaVu Sans embedded — what `stripwright report` and the app's Outputs do. Prints the first
 * (cold: pdf-lib, fontkit and the models warming up in this process) and the median of later runs, wall and CPU time.
 * Target (issue 15): the demo's report in under 2 s.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDesign, initPolygons, designReport } from '../core/index.ts';

export async function run(): Promise<void> {
  const root = join(import.meta.dirname, '..');
  const parsed = parseDesign(readFileSync(join(root, 'assets', 'examples', 'demo.json'), 'utf8'));
  if (!parsed.ok) throw new Error('demo.json does not load');
  const font = new Uint8Array(readFileSync(join(root, 'node_modules', 'dejavu-fonts-ttf', 'ttf', 'DejaVuSans.ttf')));
  await initPolygons();
  const once = async () => {
    const t0 = performance.now(), c0 = process.cpuUsage();
    const r = await designReport(parsed.doc, { font, app: 'stripwright bench' });
    const c = process.cpuUsage(c0);
    return { wall: performance.now() - t0, cpu: (c.user + c.system) / 1000, bytes: r.pdf.length, pages: r.pages };
  };
  const first = await once();
  const later: (typeof first)[] = [];
  for (let i = 0; i < 5; i++) later.push(await once());
  const med = (k: 'wall' | 'cpu') => later.map((x) => x[k]).sort((a, b) => a - b)[2]!;
  console.log(`demo report: ${first.pages} pages, ${(first.bytes / 1024).toFixed(0)} kB`);
  console.log(`  first run   ${first.wall.toFixed(0).padStart(6)} ms wall  ${first.cpu.toFixed(0).padStart(6)} ms CPU`);
  console.log(`  median of 5 ${med('wall').toFixed(0).padStart(6)} ms wall  ${med('cpu').toFixed(0).padStart(6)} ms CPU   (target: under 2000 ms)`);
}

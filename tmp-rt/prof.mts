import { readFileSync } from 'node:fs';
import { parseDesign, initPolygons, designReport } from '../core/index.ts';
await initPolygons();
const p = parseDesign(readFileSync(`assets/examples/demo.json`, 'utf8'));
if (!p.ok) throw new Error('bad');
const font = new Uint8Array(readFileSync('node_modules/dejavu-fonts-ttf/ttf/DejaVuSans.ttf'));
for (let k = 0; k < 4; k++) { const t = performance.now(); await designReport(p.doc, { font, app: 'x' }); console.log(performance.now() - t); }

/**
 * Cross-section solver benchmark (`npm run bench -- section`). Targets (issue 16): one cross-section to 0.2 %
 * estimated error in ≤ 30 ms on one core; a sizing table (TABLE_POINTS solves, interpolated) in ≤ 1 s.
 * Times are CPU time of this process (process.cpuUsage, user + system), so other jobs sharing the cores do not
 * inflate them; the solver is single-threaded. Each figure is the fastest of several runs after a warm-up.
 * Prints, per case and grid fineness: unknowns of the finer grid, PCG iterations, the estimated error of Z0, the
 * CPU time, and whether the case meets "0.2 % in 30 ms". Also prints the load average, since the machine may be shared
 * (CPU time still grows under load: the cores' caches and memory bandwidth are shared).
 */
import os from 'node:os';
import { buildSectionTable, solveSection, TABLE_POINTS, type SectionSpec } from '../core/section/index.ts';

const cpuMs = (f: () => void): number => { const c = process.cpuUsage(); f(); const d = process.cpuUsage(c); return (d.user + d.system) / 1000; };

const CASES: [string, SectionSpec][] = [
  ['50 Ω microstrip, FR-4 1.6 mm, 35 µm', { er: 4.4, h: 1.6e-3, width: 3e-3, t: 35e-6 }],
  ['milled: 0.4 mm end mill, stitched, trench', { er: 3.66, h: 0.508e-3, width: 1.0e-3, t: 35e-6, side: { gap: 0.4e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 45e-6 } }],
  ['milled: 30° V-bit, floating side copper', { er: 4.4, h: 1.6e-3, width: 2.6e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.11e-3, width: Infinity, connection: 'floating' }, trench: { depth: 15e-6, angleDeg: 30 } }],
  ['coupled pair, cover 25 µm', { er: 3.66, h: 0.508e-3, width: 1.1e-3, t: 35e-6, spacing: 0.3e-3, cover: { er: 3.5, thickness: 25e-6 } }],
  ['thin-sheet microstrip W/h = 1 (t = 0)', { er: 4.4, h: 1e-3, width: 1e-3, t: 0 }],
  ['one V-bit pass on FR-4 (0.108 mm), stitched', { er: 4.4, h: 1.6e-3, width: 0.66e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.108e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 15e-6, angleDeg: 30 } }],
  // The default process of a new design: 30° V-bit, 0.7 mm isolation clearance (9 passes, 0.735 mm at the copper's
  // top, 0.717 mm at the substrate), a line near 50 Ω as made (2.2 mm).
  ['new design: default V-bit, 0.7 mm clearance', { er: 4.4, h: 1.6e-3, width: 2.2e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.717e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 15e-6, angleDeg: 30 } }],
  ['milled: 0.4 mm end mill, floating, trench', { er: 3.66, h: 0.508e-3, width: 1.0e-3, t: 35e-6, side: { gap: 0.4e-3, width: Infinity, connection: 'floating' }, trench: { depth: 45e-6 } }],
  ['milled: end mill, stitched, 25 µm cover', { er: 3.66, h: 0.508e-3, width: 1.0e-3, t: 35e-6, side: { gap: 0.4e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 45e-6 }, cover: { er: 3.5, thickness: 25e-6 } }],
  ['one V-bit pass, stitched, 20 µm cover', { er: 4.4, h: 1.6e-3, width: 0.66e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.108e-3, width: Infinity, connection: 'stitched' }, trench: { depth: 15e-6, angleDeg: 30 }, cover: { er: 3.8, thickness: 20e-6 } }],
  ['default V-bit, 0.7 mm clearance, floating', { er: 4.4, h: 1.6e-3, width: 2.2e-3, t: 35e-6, etchAngleDeg: 75, side: { gap: 0.717e-3, width: Infinity, connection: 'floating' }, trench: { depth: 15e-6, angleDeg: 30 } }],
];

/** The milled cases (side copper beside the line): the ones the targets are for, and whose tables are timed. */
const MILLED = CASES.filter(([, s]) => s.side !== undefined);

export async function run(): Promise<void> {
  console.log(`load average at start: ${os.loadavg().map((x) => x.toFixed(2)).join(', ')} (${os.cpus().length} cores)`);
  for (let i = 0; i < 5; i++) solveSection(CASES[0]![1]); // warm-up
  console.log('case'.padEnd(46), 'fineness', 'nodes'.padStart(7), 'iter'.padStart(5), 'est. Z0 err'.padStart(12), 'CPU ms'.padStart(8), ' 0.2 % in 30 ms');
  for (const [name, spec] of CASES) {
    for (const fineness of [1, 1.5]) {
      let best = Infinity;
      let r = solveSection(spec, { fineness, loss: false });
      for (let k = 0; k < 5; k++) best = Math.min(best, cpuMs(() => { r = solveSection(spec, { fineness, loss: false }); }));
      const err = Math.max(...r.modes.map((m) => m.error.z0));
      const ok = err <= 0.002 && best <= 30;
      console.log(name.padEnd(46), String(fineness).padStart(8), String(r.stats.nodesFine).padStart(7), String(r.stats.iterations).padStart(5),
        `${(err * 100).toFixed(3)} %`.padStart(12), best.toFixed(1).padStart(8), ok ? ' yes' : ' no');
    }
  }
  console.log(`\nsizing tables (${TABLE_POINTS} widths, W/h 0.05–20, with the Wheeler loss solve):`);
  for (const [name, spec] of [CASES[0]!, ...MILLED]) {
    const { width: _w, ...template } = spec;
    let table = buildSectionTable(template);
    let ms = Infinity;
    for (let k = 0; k < 2; k++) ms = Math.min(ms, cpuMs(() => { table = buildSectionTable(template); }));
    const worst = Math.max(...table.points.map((p) => p.z0Error));
    console.log(`  ${name.padEnd(46)} ${ms.toFixed(0).padStart(6)} ms CPU, worst estimated Z0 error ${(worst * 100).toFixed(2)} %  ${ms <= 1000 ? '(≤ 1 s)' : '(above 1 s)'}`);
  }
  console.log(`load average at the end: ${os.loadavg().map((x) => x.toFixed(2)).join(', ')}`);
}

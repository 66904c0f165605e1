/**
 * Response-solver benchmark: a 1001-point sweep of a generated 64-output corporate feed (core/layout generator,
 * sized with the full line model), and the same network — the same lines with the same Z0 and γ at every point —
 * built and connected with scikit-rf 0.15.4 (Debian python3, scripts/reference/skrf_network.py, "grow" mode: one
 * piece at a time with skrf.network.connect). Prints both times, the ratio and the largest |ΔS| between the two.
 * Target (brief): under 1 s here and at least 10× faster than the library.
 * The library run takes a few minutes here (most of it building and connecting the ~700 small networks, nearly
 * independent of the point count — so a shorter library run could not be scaled fairly). NETWORK_BENCH_SKRF=0
 * skips it.
 */
import { execSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { corporateFeed, sizeDesign } from '../core/layout/index.ts';
import { compileNetwork, netlistFromSized, solveNetwork, sweepFrequencies, type NetElement, type Netlist } from '../core/network/index.ts';

export async function run(): Promise<void> {
  const outputs = 64, points = 1001;
  const doc = corporateFeed({ outputs });
  const sized = sizeDesign(doc);
  const net = netlistFromSized(sized);
  const band = doc.frequency.band;
  const freqs = sweepFrequencies({ start: band.start * 0.8, stop: band.stop * 1.2, points });
  const lines = net.elements.filter((e): e is Extract<NetElement, { kind: 'line' }> => e.kind === 'line');
  const others = net.elements.length - lines.length;

  // Ours, full model: line constants from the line model at every point, compile, solve. The first run is what
  // a user sees on the first sweep (the JavaScript engine compiles the solver while it runs); then a warm one.
  const t0 = performance.now();
  const cn = compileNetwork(net);
  const tCompile = performance.now() - t0;
  solveNetwork(cn, freqs);
  const tCold = performance.now() - t0;
  const t0w = performance.now();
  const full = solveNetwork(compileNetwork(net), freqs);
  const tFull = performance.now() - t0w;

  // Tabled constants (real Zc, as scikit-rf's line media take them) shared by both sides for the comparison.
  const tables = lines.map((l) => {
    const z0: number[] = [], gamma: [number, number][] = [];
    for (const f of freqs) { const c = l.model(f); z0.push(c.zc.re); gamma.push([c.gamma.re, c.gamma.im]); }
    return { id: l.id, a: l.a, b: l.b, length: l.length, z0, gamma };
  });
  const index = new Map<number, number>();
  freqs.forEach((f, k) => index.set(f, k));
  const tabled: Netlist = {
    ports: net.ports,
    elements: [
      ...tables.map((t): NetElement => {
        // Constants prepared up front so the timed solve does not measure the table's own allocations.
        const at = t.z0.map((z, k) => ({ zc: { re: z, im: 0 }, gamma: { re: t.gamma[k][0], im: t.gamma[k][1] } }));
        return { kind: 'line', id: t.id, a: t.a, b: t.b, length: t.length, model: (f) => at[index.get(f)!] };
      }),
      ...net.elements.filter((e) => e.kind !== 'line'),
    ],
  };
  const t1 = performance.now();
  const ours = solveNetwork(tabled, freqs);
  const tOurs = performance.now() - t1;

  console.log(`network: ${outputs}-output corporate feed, ${net.ports.length} ports, ${cn.nodeNames.length} nodes, ${lines.length} lines${others ? ` + ${others} other elements` : ''}, ${points} points`);
  console.log(`  ours, full model (line model per point + compile + solve): first run ${tCold.toFixed(0)} ms, warm ${tFull.toFixed(0)} ms (compile ${tCompile.toFixed(1)} ms)`);
  console.log(`  ours, tabled constants (solve only):                       ${tOurs.toFixed(0)} ms  (${(tOurs / points * 1e3).toFixed(0)} µs per point, ${net.ports.length}×${net.ports.length} S)`);
  void full;

  if (others) { console.log('  scikit-rf: skipped (the network holds elements other than lines)'); return; }
  if (process.env.NETWORK_BENCH_SKRF === '0') { console.log('  scikit-rf: skipped (NETWORK_BENCH_SKRF=0)'); return; }
  const spec = { freqs: Array.from(freqs), lines: tables, resistors: [], ports: net.ports, mode: 'grow' };
  const PATH = execSync('getconf PATH', { encoding: 'utf8' }).trim();
  const t2 = performance.now();
  const r = spawnSync('python3', [join(import.meta.dirname, '..', 'scripts', 'reference', 'skrf_network.py')], { input: JSON.stringify(spec), encoding: 'utf8', env: { PATH, HOME: process.env.HOME ?? '/tmp' }, maxBuffer: 1 << 30 });
  const wall = performance.now() - t2;
  if (r.status !== 0) { console.log(`  scikit-rf failed: ${r.stderr.slice(-400)}`); return; }
  const out = JSON.parse(r.stdout) as { s: number[][][][]; seconds: number };
  const P = net.ports.length;
  let worst = 0;
  out.s.forEach((m, k) => m.forEach((row, i) => row.forEach(([re, im], j) => {
    const t = 2 * ((k * P + i) * P + j);
    worst = Math.max(worst, Math.hypot(ours.s[t] - re, ours.s[t + 1] - im));
  })));
  const skrfMs = out.seconds * 1e3;
  console.log(`  scikit-rf 0.15.4 build + connect, ${points} points: ${skrfMs.toFixed(0)} ms (process wall ${wall.toFixed(0)} ms)`);
  console.log(`  ratio scikit-rf / ours (tabled): ${(skrfMs / tOurs).toFixed(1)}×   largest |ΔS| ${worst.toExponential(2)}`);
}

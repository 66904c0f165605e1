/**
 * Block fold benchmark (`npm run bench -- block-fold`): the CPU time of fitting a block into a footprint
 * (core/blocks/fold.ts `fitFootprint`, fold-branched.ts), measured as the block made with the footprint less the same
 * block made without one (generation, sizing and phase matching are the generator's, not the fold's). Cases:
 *  1. a 16-output corporate feed, 20 mm pitch, 1.6 mm glass-epoxy at 2.45 GHz, asked to fit 310 × 90 mm (it folds);
 *  2. the same asked to fit 310 × 70 mm (refused, naming the smallest footprint it folds into);
 *  3. a 16-output feed at its default pitch (half a wavelength in free space, 61 mm) with a 40 mm feed line, asked
 *     to fit 925 × 100 mm (refused: its 33 bridge lines fold, not enough);
 *  4. a Wilkinson divider with 15 mm port lines on 0.8 mm glass-epoxy in 45 × 24 mm (it folds);
 *  5. case 1's feed asked to fit the footprint case 2's refusal named (it folds).
 * Printed with the machine's load average before and after (the machine is shared; CPU time is this process's own).
 * The first make of each block warms the engine and the laminate's tables and is not counted.
 */
import { loadavg } from 'node:os';
import { makeBlockDesign, InputError, type SubstrateSpec } from '../core/index.ts';
import { cpuMs } from './timing.ts';

const FR4_16: SubstrateSpec = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6 };
const FR4_08: SubstrateSpec = { ...FR4_16, h: 0.8e-3 };

/** The feed is made as the app's new design makes it (its default as-made sizing); the Wilkinson as the fold tests do. */
function make(kind: string, raw: Record<string, unknown>, substrate: SubstrateSpec): { cpu: number; wall: number; words: string } {
  const c = process.cpuUsage(), t = performance.now();
  let words: string;
  try {
    const asMade = kind === 'wilkinson' ? { asMade: { sizing: 'microstrip' as const, sideCopper: 'stitched' as const } } : {};
    const doc = makeBlockDesign(kind, raw, { f0: 2.45e9, substrate, ...asMade });
    words = (doc.notes ?? '').split('\n').find((l) => /^(Folded|Turned)/.test(l)) ?? 'fits as laid out';
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    words = `refused: ${e.expected}`;
  }
  return { cpu: cpuMs(c), wall: performance.now() - t, words };
}

export async function run(): Promise<void> {
  const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');
  console.log(`load average before: ${load()}`);
  const feed = { outputs: '16', pitch: '20mm' };
  const cases: { name: string; kind: string; raw: Record<string, unknown>; substrate: SubstrateSpec }[] = [
    { name: '16-output feed, 310 × 90 mm', kind: 'corporate', raw: { ...feed, footprint: '310mm,90mm' }, substrate: FR4_16 },
    { name: '16-output feed, 310 × 70 mm', kind: 'corporate', raw: { ...feed, footprint: '310mm,70mm' }, substrate: FR4_16 },
    { name: '16-output feed, 61 mm pitch, 40 mm feed, 925 × 100 mm', kind: 'corporate', raw: { outputs: '16', feed: '40mm', footprint: '925mm,100mm' }, substrate: FR4_16 },
    { name: 'Wilkinson, 45 × 24 mm', kind: 'wilkinson', raw: { feed: '15mm', footprint: '45mm,24mm' }, substrate: FR4_08 },
  ];
  console.log('| case | fold CPU ms | make CPU ms | wall ms | result |\n|---|---|---|---|---|');
  const row = (name: string, kind: string, raw: Record<string, unknown>, substrate: SubstrateSpec): string => {
    const { footprint: _fp, ...flatRaw } = raw;
    make(kind, flatRaw, substrate); // warm-up
    const flat = make(kind, flatRaw, substrate);
    const r = make(kind, raw, substrate);
    console.log(`| ${name} | ${(r.cpu - flat.cpu).toFixed(0)} | ${r.cpu.toFixed(0)} | ${r.wall.toFixed(0)} | ${r.words.slice(0, 160)} |`);
    return r.words;
  };
  let named: string | null = null;
  for (const c of cases) {
    const words = row(c.name, c.kind, c.raw, c.substrate);
    const m = /or folded, at least (\d+\.\d) mm × (\d+\.\d) mm/.exec(words);
    if (m && c.kind === 'corporate' && !named) named = `${m[1]}mm,${m[2]}mm`;
  }
  if (named) row(`16-output feed, the named ${named}`, 'corporate', { ...feed, footprint: named }, FR4_16);
  console.log(`load average after: ${load()}`);
}

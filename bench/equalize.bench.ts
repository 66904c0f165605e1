/**
 * Equalize and tune benchmark (README Benchmarks, `npm run bench -- equalize`), CPU time of this process:
 *  1. Equalizing the generated 64-output corporate feed (5.8 GHz, 0.5 mm glass-epoxy, 15 mm pitch) whose output run
 *     run5 is 3 mm (then 6 mm) long: meanders first on the six sibling arms, checked in the sweep at the band's edges;
 *     past 1° there they move to the 63 matched port leads, sized and measured until they match. Target: < 1 s.
 *  2. Tuning the Wilkinson example detuned (arm impedance +12 %, arm legs +8 % in degrees, resistor 130 Ω) back to
 *     its four targets: 4 variables (arm impedance, the two legs' degrees, the resistor), 201 points. Target: < 2 s.
 * A warm-up run precedes each measure (the engine compiles the hot loops on first use). Also printed, outside the
 * timing: the sweep's S21 phase spread of the equalized feed at 5 points across the band (an independent solve).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { corporateFeed, equalizeGroup, parseDesign, tuneDesign, sizeDesign, netlistFromSized, solveNetwork, sweepFrequencies, type DesignDoc } from '../core/index.ts';
import { cpuMs } from './timing.ts';


function longFeed(extra: number): DesignDoc {
  const feed = corporateFeed({ outputs: 64, f0: 5.8e9, pitch: 15e-3, substrate: { h: 0.5e-3 } });
  return { ...feed, segments: feed.segments.map((s) => (s.id === 'run5' && s.kind === 'line' ? { ...s, length: { by: 'length' as const, length: 8e-3 + extra } } : s)) };
}

function detunedWilkinson(): DesignDoc {
  const r = parseDesign(readFileSync(join(import.meta.dirname, '..', 'assets', 'examples', 'wilkinson-2g45.json'), 'utf8'));
  if (!r.ok) throw new Error('the Wilkinson example does not load');
  return {
    ...r.doc,
    segments: r.doc.segments.map((s) => {
      if (s.kind === 'lumped') return { ...s, value: 130 };
      if (s.kind !== 'line' || !s.id.startsWith('arm') || s.width.by !== 'z0' || s.length.by !== 'degrees') return s;
      return { ...s, width: { by: 'z0' as const, z0: s.width.z0 * 1.12 }, length: { by: 'degrees' as const, deg: s.length.deg * 1.08 } };
    }),
  };
}

/** Largest minus smallest ∠S(out, in) over the group's outputs at 5 points across the band, degrees. */
function sweepSpread(doc: DesignDoc): number[] {
  const g = doc.phaseGroups[0]!, b = doc.frequency.band;
  const s = sizeDesign(doc);
  const r = solveNetwork(netlistFromSized(s, { line: s.lineOptions }), sweepFrequencies({ start: b.start, stop: b.stop, points: 5 }));
  const P = r.ports.length, i = r.ports.findIndex((p) => p.name === g.from);
  return Array.from(r.freqs, (_, k) => {
    const ph = g.to.map((t) => { const j = r.ports.findIndex((p) => p.name === t); const x = 2 * ((k * P + j) * P + i); return (Math.atan2(r.s[x + 1]!, r.s[x]!) * 180) / Math.PI; });
    const rel = ph.map((p) => ((p - ph[0]! + 540) % 360) - 180);
    return Math.max(...rel) - Math.min(...rel);
  });
}

export async function run(): Promise<void> {
  for (const mm of [3, 6]) {
    const feed = longFeed(mm * 1e-3);
    equalizeGroup(feed, { group: 'outputs' });
    const t = process.cpuUsage();
    const e = equalizeGroup(feed, { group: 'outputs' });
    const tEq = cpuMs(t);
    const on = e.meanders.every((m) => m.piece.startsWith('run')) ? 'on the port leads' : 'on the sibling branches';
    console.log(`equalize: 64-output feed, one run ${mm} mm long: ${e.meanders.length} meanders ${on}, ledger spread at f0 ${e.spreadDeg.toFixed(3)}°: ${tEq.toFixed(0)} ms CPU (target < 1000 ms)`);
    console.log(`  sweep S21 phase spread of the result at 5 points across the band: ${sweepSpread(e.doc).map((x) => x.toFixed(2)).join(' / ')}°`);
  }

  const w = detunedWilkinson();
  const variables = [
    { segments: ['arma1', 'arma2', 'armb1', 'armb2'], quantity: 'z0' as const, min: 55, max: 90 },
    { segments: ['arma1', 'armb1'], quantity: 'degrees' as const, min: 30, max: 70 },
    { segments: ['arma2', 'armb2'], quantity: 'degrees' as const, min: 25, max: 65 },
    { segments: ['r1'], quantity: 'value' as const, min: 60, max: 160 },
  ];
  await tuneDesign(w, { variables, seed: 1, points: 201 });
  const t = process.cpuUsage();
  const r = await tuneDesign(w, { variables, seed: 1, points: 201 });
  const tTune = cpuMs(t);
  console.log(`tune: Wilkinson, 4 variables, 201 points: ${r.evaluations} evaluations (${r.stopped}), targets met ${r.before.results.filter((x) => x.pass).length} → ${r.after.results.filter((x) => x.pass).length} of ${r.after.results.length}: ${tTune.toFixed(0)} ms CPU (target < 2000 ms)`);
}

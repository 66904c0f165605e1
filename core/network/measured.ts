/**
 * Measured files beside the simulation: a design's Touchstone file of the whole board is read, its ports are put in
 * the design's port order through the saved map (core/design/measured.ts), renormalised to the design's port
 * references where the file was measured at others (conversions.ts `renormalize`), and compared with the simulation
 * by `compareResponses` — the one comparison behind the app's overlay and difference plot and `sweep --compare`.
 */
import { InputError } from '../util/errors.ts';
import { warn, type Warning } from '../util/warnings.ts';
import type { MeasuredFile } from '../design/measured.ts';
import type { NetworkResponse, ResponsePort } from './response.ts';
import { readTouchstone } from './touchstoneRead.ts';
import { renormalize } from './conversions.ts';
import { compareResponses, type ResponseDifference } from './compare.ts';

/** The guess when a file is loaded: file port k is design port k; file ports beyond the design's are left out (''). */
export function guessPortMap(filePorts: number, designPorts: readonly string[]): string[] {
  return Array.from({ length: filePorts }, (_, k) => designPorts[k] ?? '');
}

/** How many ports the file has (read once, for the map editor). */
export function measuredPortCount(m: Pick<MeasuredFile, 'name' | 'touchstone'>): number {
  return readTouchstone(m.touchstone, { fileName: m.name }).ports.length;
}

/**
 * The measured response in the design's port order and references. Every design port must be measured at exactly
 * one file port; file ports mapped to '' are dropped (they must have been terminated in their reference when
 * measured — said in a warning).
 */
export function measuredForDesign(m: MeasuredFile, design: readonly ResponsePort[], opts: { from?: number; to?: number } = {}): { response: NetworkResponse; warnings: Warning[] } {
  const d = readTouchstone(m.touchstone, { fileName: m.name });
  if (opts.from !== undefined || opts.to !== undefined) keepRange(d, opts.from ?? -Infinity, opts.to ?? Infinity, m.name);
  const F = d.ports.length, P = design.length;
  if (m.ports.length !== F) {
    throw new InputError('out-of-range', `measured ${m.name}: port map`, `one entry per port of the file (${F})`, `${m.ports.length}`, 'map the ports again in the Measured panel');
  }
  const from: number[] = [];
  for (let p = 0; p < P; p++) {
    const at = m.ports.flatMap((id, k) => (id === design[p]!.name ? [k] : []));
    if (at.length !== 1) {
      throw new InputError('out-of-range', `measured ${m.name}: port map`, `design port ${design[p]!.name} at exactly one port of the file`,
        at.length === 0 ? 'at none' : `at ports ${at.map((k) => k + 1).join(', ')}`, 'choose the file port for each design port');
    }
    from.push(at[0]!);
  }
  const warnings: Warning[] = [...d.warnings];
  const unmapped = m.ports.flatMap((id, k) => (id === '' || !design.some((p) => p.name === id) ? [k + 1] : []));
  if (unmapped.length) warnings.push(warn('note', `${m.name}: file port${unmapped.length > 1 ? 's' : ''} ${unmapped.join(', ')} not compared (taken as terminated in their reference when measured)`, { subjects: [m.id], severity: 'info' }));
  const K = d.freqs.length;
  const s = new Float64Array(2 * K * P * P);
  const fileRefs = from.map((k) => d.ports[k]!.zRef), designRefs = design.map((p) => p.zRef);
  const same = fileRefs.every((z, p) => z === designRefs[p]);
  const one = new Float64Array(2 * P * P);
  for (let k = 0; k < K; k++) {
    for (let i = 0; i < P; i++) for (let j = 0; j < P; j++) {
      const t = 2 * ((k * F + from[i]!) * F + from[j]!);
      one[2 * (i * P + j)] = d.s[t]!;
      one[2 * (i * P + j) + 1] = d.s[t + 1]!;
    }
    s.set(same ? one : renormalize(one, P, fileRefs, designRefs), 2 * k * P * P);
  }
  if (!same) warnings.push(warn('note', `${m.name}: renormalised from the file's references (${fileRefs.join(', ')} Ω) to the design's (${designRefs.join(', ')} Ω)`, { subjects: [m.id], severity: 'info' }));
  return { response: { freqs: d.freqs, ports: design.map((p) => ({ ...p })), s, warnings }, warnings };
}

/** Simulation against a measured file: the measured response in design order and the difference (per S-parameter). */
export function compareMeasured(sim: NetworkResponse, m: MeasuredFile, opts: { floorDb?: number; from?: number; to?: number } = {}): { measured: NetworkResponse; diff: ResponseDifference; warnings: Warning[] } {
  const { response, warnings } = measuredForDesign(m, sim.ports, opts);
  return { measured: response, diff: compareResponses(sim, response, opts), warnings };
}

/** Keeps the file's points from `lo` to `hi` (a measured file is compared at its own points; a range only selects). */
function keepRange(d: NetworkResponse, lo: number, hi: number, name: string): void {
  const P = d.ports.length, w = 2 * P * P;
  const keep: number[] = [];
  d.freqs.forEach((f, k) => { if (f >= lo && f <= hi) keep.push(k); });
  if (keep.length === 0) throw new InputError('out-of-range', `measured ${name}: range`, 'a range that holds some of the file\'s frequencies', 'none inside');
  const s = new Float64Array(keep.length * w);
  keep.forEach((k, i) => s.set(d.s.subarray(k * w, (k + 1) * w), i * w));
  d.freqs = Float64Array.from(keep.map((k) => d.freqs[k]!));
  d.s = s;
}

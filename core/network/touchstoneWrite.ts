/**
 * Touchstone version 1.1 writer (.sNp). Source: "Touchstone File Format Specification, Rev. 1.1", EIA/IBIS Open
 * Forum, 2002: "!" comments, one option line "# <unit> S <format> R <ohms>",
 * one record per frequency; 1-port "f S11"; 2-port "f S11 S21 S12 S22" on one line (the historic order);
 * 3 or more ports one matrix row per line, at most four pairs per line, the frequency only at the start.
 * Numbers are written with the shortest text that reads back to the same double.
 * Version 2.0 ("Touchstone File Format Specification, Version 2.0", IBIS Open Forum, 2009) is offered for ports
 * with different references: [Version] 2.0, [Number of Ports], [Two-Port Data Order] 21_12 (the v1 row layout,
 * valid in 2.0), [Number of Frequencies], [Reference] per port, [Network Data] … [End]; no renormalisation needed.
 */
import { InputError } from '../util/errors.ts';
import { renormalize } from './conversions.ts';
import { matrixAt, requireAll, type NetworkResponse } from './response.ts';

export type TouchstoneFormat = 'ri' | 'ma' | 'db';
export type FrequencyUnit = 'hz' | 'khz' | 'mhz' | 'ghz';

export const UNIT_SCALE: Record<FrequencyUnit, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9 };
const UNIT_TEXT: Record<FrequencyUnit, string> = { hz: 'Hz', khz: 'kHz', mhz: 'MHz', ghz: 'GHz' };

export interface TouchstoneWriteOptions {
  format?: TouchstoneFormat;
  unit?: FrequencyUnit;
  /** Reference impedance of the file, Ω. Default: the ports' common reference; the data are renormalised to it. */
  zRef?: number;
  /** Program and version for the header, e.g. 'stripwright 0.1.0'. */
  app?: string;
  /** Design name for the header. */
  design?: string;
  /** Further comment lines (without the leading '!'). */
  comments?: string[];
  /** '1.1' (default, the widest support) or '2.0' (keeps per-port references). */
  version?: '1.1' | '2.0';
}

const ASCII: Record<string, string> = { 'Ω': 'ohm', 'µ': 'u', '°': 'deg', '→': '->', '–': '-', '—': '-', '×': 'x' };

const num = (x: number): string => (Object.is(x, -0) ? '0' : String(x));

export function writeTouchstone(r: NetworkResponse, opts: TouchstoneWriteOptions = {}): string {
  const format = opts.format ?? 'ri', unit = opts.unit ?? 'ghz';
  if (!['ri', 'ma', 'db'].includes(format)) throw new InputError('bad-choice', 'format', 'ri, ma or db', String(format));
  if (!(unit in UNIT_SCALE)) throw new InputError('bad-choice', 'unit', 'hz, khz, mhz or ghz', String(unit));
  requireAll(r);
  const P = r.ports.length;
  if (P < 1) throw new InputError('out-of-range', 'ports', 'at least one port', '0');
  const refs = r.ports.map((p) => p.zRef);
  const same = refs.every((z) => z === refs[0]);
  const v2 = opts.version === '2.0';
  if (opts.version !== undefined && opts.version !== '1.1' && !v2) throw new InputError('bad-choice', 'version', "'1.1' or '2.0'", String(opts.version));
  // Version 2.0 keeps each port's own reference unless one is asked for.
  const zRef = opts.zRef ?? (same || v2 ? refs[0] : NaN);
  if (!(zRef > 0) || !Number.isFinite(zRef)) {
    throw new InputError('out-of-range', 'zRef', 'one reference impedance > 0 Ω for the file (Touchstone 1.1 has a single R)',
      opts.zRef === undefined ? `ports with different references (${refs.join(', ')} Ω)` : String(opts.zRef), 'choose the reference to renormalise to');
  }
  const renorm = v2 ? opts.zRef !== undefined && !refs.every((z) => z === zRef) : !refs.every((z) => z === zRef);
  const fileRefs = v2 && opts.zRef === undefined ? refs : refs.map(() => zRef);
  // Touchstone files are ASCII: common symbols are spelt out, anything else becomes '?'.
  const clean = (t: string) => t.replace(/[\r\n]+/g, ' ').replace(/[Ωµ°→–—×]/g, (c) => ASCII[c] ?? '?').replace(/[^\x20-\x7e]/g, '?');
  const lines: string[] = [];
  lines.push(`! ${clean(opts.app ?? 'stripwright')} - S-parameters, ${P} port${P > 1 ? 's' : ''}`);
  if (opts.design) lines.push(`! design: ${clean(opts.design)}`);
  lines.push(`! ports: ${r.ports.map((p, i) => `${i + 1}=${clean(p.label ? `${p.label} (${p.name})` : p.name)}`).join(' ')}`);
  lines.push(fileRefs.every((z) => z === fileRefs[0])
    ? `! power-wave S-parameters, real reference ${num(zRef)} ohm on every port${renorm ? ` (renormalised from ${refs.join(', ')} ohm)` : ''}`
    : `! power-wave S-parameters, real references per port: ${fileRefs.map(num).join(', ')} ohm`);
  for (const c of opts.comments ?? []) lines.push(`! ${clean(c)}`);
  if (v2) lines.push('[Version] 2.0');
  lines.push(`# ${UNIT_TEXT[unit]} S ${format.toUpperCase()} R ${num(zRef)}`);
  if (v2) {
    lines.push(`[Number of Ports] ${P}`);
    if (P === 2) lines.push('[Two-Port Data Order] 21_12');
    lines.push(`[Number of Frequencies] ${r.freqs.length}`);
    lines.push(`[Reference] ${fileRefs.map(num).join(' ')}`);
    lines.push('[Network Data]');
  }
  for (let k = 0; k < r.freqs.length; k++) {
    if (!(r.freqs[k] > 0) || !Number.isFinite(r.freqs[k]) || (k > 0 && !(r.freqs[k] > r.freqs[k - 1]))) {
      throw new InputError('out-of-range', `freqs[${k}]`, 'finite frequencies above 0 Hz, strictly increasing', String(r.freqs[k]));
    }
  }
  for (let t = 0; t < r.s.length; t++) {
    if (!Number.isFinite(r.s[t])) throw new InputError('invalid-number', 's', 'finite S-parameters', `a non-finite value at frequency ${r.freqs[Math.floor(t / (2 * P * P))]} Hz`);
  }
  const pair = (re: number, im: number): string => {
    if (format === 'ri') return `${num(re)} ${num(im)}`;
    const m = Math.hypot(re, im), a = (Math.atan2(im, re) * 180) / Math.PI;
    if (format === 'ma') return `${num(m)} ${num(a)}`;
    // 20·log10(0) has no value; −400 dB stands for an exact null (far below any measurement).
    return `${num(m > 0 ? 20 * Math.log10(m) : -400)} ${num(a)}`;
  };
  const scale = UNIT_SCALE[unit];
  for (let k = 0; k < r.freqs.length; k++) {
    const m = renorm ? renormalize(matrixAt(r, k), P, refs, fileRefs) : matrixAt(r, k);
    const at = (i: number, j: number) => pair(m[2 * (i * P + j)], m[2 * (i * P + j) + 1]);
    const f = num(r.freqs[k] / scale);
    if (P === 1) lines.push(`${f} ${at(0, 0)}`);
    else if (P === 2) lines.push(`${f} ${at(0, 0)} ${at(1, 0)} ${at(0, 1)} ${at(1, 1)}`);
    else {
      for (let i = 0; i < P; i++) {
        for (let j0 = 0; j0 < P; j0 += 4) {
          const parts: string[] = [];
          for (let j = j0; j < Math.min(P, j0 + 4); j++) parts.push(at(i, j));
          lines.push(`${i === 0 && j0 === 0 ? f : ' '} ${parts.join(' ')}`);
        }
      }
    }
  }
  if (v2) lines.push('[End]');
  return lines.join('\n') + '\n';
}

/** File extension for P ports: '.s2p'. */
export const touchstoneExtension = (ports: number): string => `.s${ports}p`;

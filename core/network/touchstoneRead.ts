/**
 * Touchstone reader, versions 1.0/1.1 and 2.0. Sources: "Touchstone File Format Specification, Rev. 1.1",
 * EIA/IBIS Open Forum, 2002; "Touchstone File Format Specification, Version 2.0", IBIS Open Forum, 2009.
 *
 * Handled: comments, the option line (defaults GHz S MA R 50; only the first counts), S, Y and Z data in RI, MA and
 * DB, 1 to N ports, v1 2-port order S11 S21 S12 S22, v2 [Number of Ports], [Two-Port Data Order] 12_21 | 21_12,
 * [Number of Frequencies], [Reference] (per-port), [Matrix Format] Full | Lower | Upper, [Begin/End Information],
 * [Network Data], [Noise Data] and the v1 2-port noise block (both skipped, with a note), [End].
 * Not handled (clear error): H and G parameters, mixed-mode data.
 * Y and Z are normalised to R in v1 and absolute in v2; all are converted to S for the file's references.
 * Every malformed file gives InputError('bad-file') with the file name and line number.
 */
import { InputError } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { yToS, zToS } from './conversions.ts';
import type { NetworkResponse } from './response.ts';
import { UNIT_SCALE, type FrequencyUnit, type TouchstoneFormat } from './touchstoneWrite.ts';

export interface TouchstoneData extends NetworkResponse {
  version: '1' | '2.0';
  parameter: 'S' | 'Y' | 'Z';
  format: TouchstoneFormat;
  /** Text of the '!' comment lines, in order. */
  comments: string[];
}

export interface TouchstoneReadOptions {
  /** Used in messages and, for v1, to learn the port count from the extension (.s2p → 2). */
  fileName?: string;
  /** Port count for a v1 file whose name does not say it. */
  ports?: number;
}

interface Tok { v: number; line: number; first: boolean }

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
/** Port count accepted from a file (a feed of 1024 outputs has 1025 ports). */
export const MAX_PORTS = 4097;

export function readTouchstone(text: string, opts: TouchstoneReadOptions = {}): TouchstoneData {
  const name = opts.fileName ?? 'touchstone';
  const bad = (line: number, expected: string, got: string, hint?: string) =>
    new InputError('bad-file', line > 0 ? `${name}:${line}` : name, expected, got, hint);
  if (typeof text !== 'string' || text.trim() === '') throw bad(0, 'Touchstone text (an option line and data)', 'an empty file');
  // A UTF-8 byte-order mark is harmless; anything else outside ASCII is reported with its line below.
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  const comments: string[] = [];
  const warnings: Warning[] = [];
  let version: '1' | '2.0' = '1';
  let option: { unit: FrequencyUnit; param: 'S' | 'Y' | 'Z'; format: TouchstoneFormat; r: number } | null = null;
  let nPorts: number | null = null;
  let order: '12_21' | '21_12' | null = null;
  let nFreq: number | null = null;
  let matrix: 'full' | 'lower' | 'upper' = 'full';
  let reference: number[] | null = null;
  let refLine = 0;
  let inInfo = false, inData = false, ended = false, sawContent = false, skippedNoise = false;
  const toks: Tok[] = [];
  /** Values on each data line (by line number): tells network data from a v1 noise block. */
  const perLine = new Map<number, number>();

  for (let li = 0; li < lines.length && !ended; li++) {
    const ln = li + 1;
    const raw = lines[li];
    const bang = raw.indexOf('!');
    if (bang >= 0) comments.push(raw.slice(bang + 1).trim());
    const body = (bang >= 0 ? raw.slice(0, bang) : raw).trim();
    if (body === '') continue;
    if (/[^\x20-\x7e\t]/.test(body)) throw bad(ln, 'ASCII text', JSON.stringify(body.slice(0, 40)));
    if (inInfo) { if (/^\[end information\]/i.test(body)) inInfo = false; continue; }
    if (body.startsWith('[')) {
      const m = /^\[([^\]]+)\]\s*(.*)$/.exec(body);
      if (!m) throw bad(ln, 'a keyword in square brackets, e.g. [Number of Ports] 2', JSON.stringify(body));
      const key = m[1].trim().toLowerCase().replace(/\s+/g, ' '), arg = m[2].trim();
      if (key === 'version') {
        if (sawContent) throw bad(ln, '[Version] as the first line that is not a comment', '[Version] later in the file');
        if (!/^2(\.0+)?$/.test(arg) && !/^2\.\d+$/.test(arg)) throw bad(ln, '[Version] 2.0', JSON.stringify(arg));
        version = '2.0'; sawContent = true; continue;
      }
      sawContent = true;
      if (version !== '2.0') throw bad(ln, 'data or an option line (keywords need [Version] 2.0 first)', `[${m[1]}]`);
      const intArg = (what: string): number => {
        const v = Number(arg);
        if (!Number.isInteger(v) || v < 1) throw bad(ln, `a whole number after [${what}]`, JSON.stringify(arg));
        return v;
      };
      switch (key) {
        case 'number of ports': nPorts = intArg('Number of Ports'); break;
        case 'two-port data order':
          if (!/^(12_21|21_12)$/.test(arg)) throw bad(ln, '12_21 or 21_12 after [Two-Port Data Order]', JSON.stringify(arg));
          order = arg as '12_21' | '21_12'; break;
        case 'number of frequencies': nFreq = intArg('Number of Frequencies'); break;
        case 'number of noise frequencies': break;
        case 'reference': {
          reference = [];
          refLine = ln;
          for (const t of arg.split(/\s+/).filter(Boolean)) reference.push(parseNum(t, ln));
          // The values may continue on the following lines.
          while (nPorts !== null && reference.length < nPorts && li + 1 < lines.length) {
            const next = lines[li + 1].replace(/!.*$/, '').trim();
            if (next === '' ) { li++; continue; }
            if (!NUMBER.test(next.split(/\s+/)[0])) break;
            li++;
            for (const t of next.split(/\s+/)) reference.push(parseNum(t, li + 1));
          }
          break;
        }
        case 'matrix format': {
          const a = arg.toLowerCase();
          if (a !== 'full' && a !== 'lower' && a !== 'upper') throw bad(ln, 'Full, Lower or Upper after [Matrix Format]', JSON.stringify(arg));
          matrix = a; break;
        }
        case 'mixed-mode order': throw bad(ln, 'single-ended data', 'mixed-mode data ([Mixed-Mode Order])', 'mixed-mode files are not supported; export single-ended S-parameters');
        case 'begin information': inInfo = true; break;
        case 'network data':
          if (!option) throw bad(ln, 'the option line (# GHz S RI R 50) before [Network Data]', 'none');
          inData = true; break;
        case 'noise data': inData = false; skippedNoise = true; break;
        case 'end': ended = true; break;
        default: throw bad(ln, 'a Touchstone 2.0 keyword', `[${m[1]}]`);
      }
      continue;
    }
    if (body.startsWith('#')) {
      sawContent = true;
      if (option) { warnings.push({ code: 'note', severity: 'info', message: `${name}:${ln}: a second option line is ignored (only the first counts)` }); continue; }
      option = parseOption(body, ln, bad);
      continue;
    }
    sawContent = true;
    if (version === '2.0' && !inData) {
      if (skippedNoise) continue;
      throw bad(ln, 'data after [Network Data]', JSON.stringify(body.slice(0, 40)));
    }
    if (!option) throw bad(ln, 'the option line (e.g. # GHz S RI R 50) before the data', JSON.stringify(body.slice(0, 40)), 'Touchstone data must follow a line starting with #');
    const parts = body.split(/[\s,]+/).filter(Boolean);
    perLine.set(ln, parts.length);
    parts.forEach((t, i) => toks.push({ v: parseNum(t, ln), line: ln, first: i === 0 }));
  }
  if (version === '2.0' && !ended) throw bad(lines.length, 'an [End] line closing a Touchstone 2.0 file', 'the end of the file', 'the file may be cut short');
  if (!option) throw bad(0, 'an option line such as # GHz S RI R 50', 'none');
  if (toks.length === 0) throw bad(0, 'at least one frequency of network data', 'none');

  function parseNum(t: string, ln: number): number {
    if (!NUMBER.test(t)) throw bad(ln, 'a number', JSON.stringify(t));
    const v = Number(t);
    if (!Number.isFinite(v)) throw bad(ln, 'a finite number', JSON.stringify(t));
    return v;
  }

  // Port count.
  let N: number;
  if (version === '2.0') {
    if (nPorts === null) throw bad(0, '[Number of Ports] in a Touchstone 2.0 file', 'none');
    N = nPorts;
    if (N === 2 && order === null) throw bad(0, '[Two-Port Data Order] 12_21 or 21_12 (required for 2-port files)', 'none', 'without it S21 and S12 cannot be told apart');
  } else {
    const ext = /\.s(\d+)p$/i.exec(opts.fileName ?? '');
    if (opts.ports !== undefined) N = opts.ports;
    else if (ext) N = Number(ext[1]);
    else N = inferPorts(toks);
    if (!Number.isInteger(N) || N < 1) throw bad(0, 'a port count of 1 or more (from the .sNp extension)', String(N));
  }
  if (N > MAX_PORTS) throw bad(0, `at most ${MAX_PORTS} ports`, String(N));
  const perMatrix = matrix === 'full' ? N * N : (N * (N + 1)) / 2;
  const perRecord = 1 + 2 * perMatrix;

  // Split records. In v1 a 2-port noise block follows the network data with a frequency that does not rise; its
  // lines hold 5 values. A record on a line with the network data's column count is network data whatever its
  // frequency: a repeated frequency is kept (with a warning naming the line), a falling one is refused.
  const dataColumns = perLine.get(toks[0].line) ?? 0;
  const recs: number[] = [];
  const repeats: number[] = [];
  let lastF = -Infinity;
  for (let t = 0; t < toks.length; t += perRecord) {
    const f = toks[t].v, ln = toks[t].line;
    const isNoise = version === '1' && N === 2 && t > 0 && f <= lastF && (!toks[t].first || perLine.get(ln) !== dataColumns);
    if (isNoise) { skippedNoise = true; break; }
    if (t + perRecord > toks.length) {
      throw bad(ln, `${perRecord - 1} values after the frequency for a ${N}-port record`, `${toks.length - t - 1}`, 'the last record is incomplete');
    }
    if (!(f >= 0)) throw bad(ln, 'a frequency of 0 or more', String(f));
    if (f < lastF) throw bad(ln, `frequencies in rising order (this one after ${lastF})`, String(f), 'sort the records by frequency');
    if (f === lastF) repeats.push(ln);
    if (version === '1' && N >= 3 && !toks[t].first) throw bad(ln, 'each frequency record to start on a new line', 'a record starting mid-line', 'check the port count');
    lastF = f; recs.push(t);
  }
  if (repeats.length > 0) {
    const shown = repeats.slice(0, 5).map((l) => `${l}`).join(', ') + (repeats.length > 5 ? ` and ${repeats.length - 5} more` : '');
    warnings.push({ code: 'note', severity: 'warning', message: `${name}: a frequency repeats the one before it on line${repeats.length > 1 ? 's' : ''} ${shown}; both points are kept as data (is the file two sweeps joined?)` });
  }
  if (nFreq !== null && recs.length !== nFreq) throw bad(0, `${nFreq} frequencies as [Number of Frequencies] says`, String(recs.length));
  if (skippedNoise) warnings.push({ code: 'note', severity: 'info', message: `${name}: noise parameters were skipped (not used)` });

  let refs = new Array<number>(N).fill(option.r);
  if (reference) {
    if (reference.length !== N) throw bad(refLine, `${N} values after [Reference]`, String(reference.length));
    refs = reference;
  }
  refs.forEach((z, i) => { if (!(z > 0)) throw bad(refLine, `a real reference impedance > 0 Ω for port ${i + 1}`, String(z), 'complex or zero references are not supported'); });

  const F = recs.length;
  const freqs = new Float64Array(F);
  const s = new Float64Array(2 * N * N * F);
  const scale = UNIT_SCALE[option.unit];
  for (let k = 0; k < F; k++) {
    const t0 = recs[k];
    freqs[k] = toks[t0].v * scale;
    if (!Number.isFinite(freqs[k])) throw bad(toks[t0].line, 'a frequency that is a finite number of hertz once scaled by the unit', `${toks[t0].v} ${option.unit}`);
    const m = new Float64Array(2 * N * N);
    const put = (i: number, j: number, a: number, b: number) => {
      let re: number, im: number;
      if (option!.format === 'ri') { re = a; im = b; } else {
        const mag = option!.format === 'ma' ? a : Math.pow(10, a / 20);
        const ang = (b * Math.PI) / 180;
        re = mag * Math.cos(ang); im = mag * Math.sin(ang);
      }
      // dB values above about 6165 overflow a double; refuse them where they are, not later as a silent short.
      if (!Number.isFinite(re) || !Number.isFinite(im)) throw bad(toks[q - 1].line, `a ${option!.format === 'db' ? 'dB magnitude' : 'value'} that gives a finite ${option!.param}-parameter`, `${a} ${b}`);
      m[2 * (i * N + j)] = re; m[2 * (i * N + j) + 1] = im;
    };
    let q = t0 + 1;
    const next = (): [number, number] => { const a = toks[q].v, b = toks[q + 1].v; q += 2; return [a, b]; };
    if (N === 2 && matrix === 'full' && (version === '1' || order === '21_12')) {
      const s11 = next(), s21 = next(), s12 = next(), s22 = next();
      put(0, 0, ...s11); put(1, 0, ...s21); put(0, 1, ...s12); put(1, 1, ...s22);
    } else {
      for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) {
        if (matrix === 'lower' && j > i) continue;
        if (matrix === 'upper' && j < i) continue;
        put(i, j, ...next());
      }
      if (matrix !== 'full') for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) {
        const [si, sj] = matrix === 'lower' ? [Math.max(i, j), Math.min(i, j)] : [Math.min(i, j), Math.max(i, j)];
        m[2 * (i * N + j)] = m[2 * (si * N + sj)]; m[2 * (i * N + j) + 1] = m[2 * (si * N + sj) + 1];
      }
    }
    for (const v of m) if (!Number.isFinite(v)) throw bad(toks[t0].line, `${option.param}-parameters that are finite numbers once scaled`, 'a value beyond the range of a number');
    let sm: Float64Array = m;
    if (option.param !== 'S') {
      // v1 Y and Z are normalised to R; v2 gives them in siemens / ohms.
      if (version === '1') {
        for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) {
          const c = option.param === 'Z' ? option.r : 1 / option.r;
          m[2 * (i * N + j)] *= c; m[2 * (i * N + j) + 1] *= c;
        }
      }
      try { sm = option.param === 'Z' ? zToS(m, N, refs) : yToS(m, N, refs); } catch {
        throw bad(toks[t0].line, `${option.param}-parameters that have an S-matrix`, 'a singular matrix');
      }
    }
    for (const v of sm) if (!Number.isFinite(v)) throw bad(toks[t0].line, `${option.param}-parameters that have a finite S-matrix`, 'values too large to convert');
    s.set(sm, 2 * N * N * k);
  }
  const ports = refs.map((z, i) => ({ name: String(i + 1), zRef: z }));
  return { version, parameter: option.param, format: option.format, comments, freqs, ports, s, warnings };
}

function parseOption(body: string, ln: number, bad: (line: number, e: string, g: string, h?: string) => InputError) {
  const t = body.slice(1).trim().split(/\s+/).filter(Boolean).map((x) => x.toLowerCase());
  let unit: FrequencyUnit = 'ghz', param: 'S' | 'Y' | 'Z' = 'S', format: TouchstoneFormat = 'ma', r = 50;
  for (let i = 0; i < t.length; i++) {
    const w = t[i];
    if (w === 'hz' || w === 'khz' || w === 'mhz' || w === 'ghz') unit = w;
    else if (w === 's' || w === 'y' || w === 'z') param = w.toUpperCase() as 'S' | 'Y' | 'Z';
    else if (w === 'h' || w === 'g') throw bad(ln, 'S, Y or Z parameters', `${w.toUpperCase()}-parameters`, 'hybrid parameters are not supported');
    else if (w === 'ri' || w === 'ma' || w === 'db') format = w;
    else if (w === 'r') {
      const v = Number(t[i + 1]);
      if (t[i + 1] === undefined || !NUMBER.test(t[i + 1]) || !(v > 0) || !Number.isFinite(v)) throw bad(ln, 'a finite reference resistance > 0 after R', JSON.stringify(t[i + 1] ?? ''));
      r = v; i++;
    } else throw bad(ln, 'an option line such as # GHz S RI R 50 (units Hz/kHz/MHz/GHz, S/Y/Z, RI/MA/DB, R ohms)', JSON.stringify(body));
  }
  return { unit, param, format, r };
}

/** Port count of a v1 file without a name: the smallest N whose records start at line starts with rising frequency. */
function inferPorts(toks: Tok[]): number {
  for (let N = 1; N <= 64; N++) {
    const per = 1 + 2 * N * N;
    if (toks.length % per !== 0) continue;
    let ok = true, last = -Infinity;
    for (let t = 0; t < toks.length; t += per) {
      if (!toks[t].first || !(toks[t].v > last)) { ok = false; break; }
      last = toks[t].v;
    }
    if (ok) return N;
  }
  throw new InputError('bad-file', 'touchstone', 'a file name ending in .sNp (the port count) or a consistent record layout', 'data whose port count cannot be told', 'name the file .s1p, .s2p, …');
}

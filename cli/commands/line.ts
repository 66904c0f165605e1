/**
 * `stripwright line`: size (Z0 → W) or analyse (W → Z0) one microstrip line, or a CSV file of them.
 * A thin face over core/line: values are parsed with core/units, results printed as a table or JSON (SI numbers).
 */
import { CSV_INPUT, readInputText, writeOutputFile } from '../files.ts';
import { resultJson } from '../json.ts';
import { parseArgs } from 'node:util';
import { statSync } from 'node:fs';
import { resolve } from 'node:path';
import {
  analyzeLine, synthesizeLine, lengthForDegrees, degreesForLength, parseQuantity, formatQuantity, findPreset,
  SUBSTRATE_PRESETS, DISPERSION_MODELS, CONDUCTOR_LOSS_MODELS, DEFAULT_COPPER_T, ANNEALED_COPPER_SIGMA, InputError,
  type SubstrateSpec, type LineOptions, type LineResult, type DispersionModel, type ConductorLossModel, type Warning,
} from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { COUPLED_USAGE, coupledJson, coupledTable, solveCoupled } from './line-coupled.ts';

const MAX_BATCH_ROWS = 200_000;

const USAGE = `Usage: stripwright line [substrate] (--z0 OHMS | --width LEN) [--f FREQ] [--deg DEG | --length LEN] [--json]
       stripwright line [substrate] --batch FILE.csv [--out FILE.csv]
       stripwright line [substrate] --coupled (--width LEN --spacing LEN | --coupling-db DB --z0 OHMS) [--f FREQ] [--json]

Sizes a microstrip line for a target impedance (--z0) or analyses a given width (--width).
Values take units: 1.6mm, 62mil, 35um, 1oz, 5.8GHz, 50ohm, 90deg.

Substrate (a preset fills every field; the flags you give override it):
  --preset NAME         generic laminate: ${SUBSTRATE_PRESETS.map((p) => p.id).join(', ')}
  --er N                relative permittivity (needed without --preset)
  --h LEN               dielectric height, e.g. 1.6mm (needed without --preset)
  --t LEN               copper thickness, e.g. 35um or 1oz (default 35 µm; 0 = ideal thin strip)
  --tand N              loss tangent (default 0)
  --sigma S             conductor conductivity, e.g. 5.8e7, 58MS/m, 100%IACS (default annealed copper)
  --rough LEN           rms surface roughness, e.g. 1um (default 0)
  --f-measure FREQ      εr and tanδ were measured at FREQ: carry them to --f with the wideband Debye model

Line:
  --z0 OHMS             size the width for this impedance (at --f, or static without it)
  --width LEN           analyse this width
  --f FREQ              design frequency; without it, static values
  --deg DEG             also give the length of DEG electrical degrees at --f
  --length LEN          also give the electrical length of LEN at --f

Models:
  --dispersion NAME     ${DISPERSION_MODELS[0]} (default), ${DISPERSION_MODELS.slice(1).join(', ')}
  --conductor-loss NAME ${CONDUCTOR_LOSS_MODELS[0]} (default), ${CONDUCTOR_LOSS_MODELS.slice(1).join(', ')}

Output:
  --json                one JSON object, SI numbers
  --batch FILE.csv      one case per row; columns named like the flags (er,h,t,tand,sigma,rough,preset,
                        f-measure,z0,width,f,deg,length,dispersion,conductor-loss); flags give defaults
  --out FILE.csv        write the batch results here instead of standard output
  --force               let --out replace an existing file

${COUPLED_USAGE}

Examples:
  stripwright line --er 3.66 --h 0.508mm --coupled --coupling-db 10 --z0 50 --f 2.45GHz --json
  stripwright line --preset glass-epoxy --z0 50 --f 5.8GHz --deg 90
  stripwright line --er 3.66 --h 0.508mm --t 35um --tand 0.0037 --width 1.07mm --f 10GHz --json
  stripwright line --er 4.4 --h 0.8mm --batch lines.csv --out sized.csv`;

const OPTIONS = {
  preset: { type: 'string' }, er: { type: 'string' }, h: { type: 'string' }, t: { type: 'string' },
  tand: { type: 'string' }, sigma: { type: 'string' }, rough: { type: 'string' }, 'f-measure': { type: 'string' },
  z0: { type: 'string' }, width: { type: 'string' }, f: { type: 'string' }, deg: { type: 'string' }, length: { type: 'string' },
  dispersion: { type: 'string' }, 'conductor-loss': { type: 'string' },
  coupled: { type: 'boolean' }, spacing: { type: 'string' }, 'coupling-db': { type: 'string' }, z0e: { type: 'string' }, z0o: { type: 'string' },
  json: { type: 'boolean' }, batch: { type: 'string' }, out: { type: 'string' }, force: { type: 'boolean' },
} as const;

/** Inputs of one case, as text (from flags or a CSV row). */
export type CaseText = Partial<Record<'preset' | 'er' | 'h' | 't' | 'tand' | 'sigma' | 'rough' | 'f-measure' | 'z0' | 'width' | 'f' | 'deg' | 'length' | 'dispersion' | 'conductor-loss', string>>;
const CASE_KEYS = ['preset', 'er', 'h', 't', 'tand', 'sigma', 'rough', 'f-measure', 'z0', 'width', 'f', 'deg', 'length', 'dispersion', 'conductor-loss'] as const;

interface Solved { result: LineResult; sub: SubstrateSpec; opts: LineOptions; lengthM?: number; deg?: number }

/** The models behind a result, named with their sources (the table's last row). */
function modelNames(s: Solved): string {
  const d = s.opts.dispersion ?? 'kirschning-jansen';
  const c = s.opts.conductorLoss ?? 'wheeler-incremental';
  const parts = ['static Hammerstad–Jensen 1980 (with thickness)'];
  if (s.result.f > 0) {
    parts.push(d === 'kirschning-jansen' ? 'εeff(f) Kirschning–Jansen 1982, Z0(f) Jansen–Kirschning 1983'
      : d === 'hammerstad-jensen' ? 'dispersion Hammerstad–Jensen 1980' : 'no dispersion');
    parts.push(c === 'wheeler-incremental' && s.sub.t > 0 ? "conductor loss Wheeler's incremental inductance" : 'conductor loss current-distribution form');
    parts.push('roughness Hammerstad–Bekkadal 1975', 'dielectric loss filling factor');
    if (s.sub.dielectricModel?.kind === 'wideband-debye') parts.push('εr, tanδ wideband Debye (Djordjevic et al. 2001)');
  }
  return parts.join('; ');
}

export function substrateOf(c: CaseText): SubstrateSpec {
  let base: SubstrateSpec | undefined;
  if (c.preset !== undefined) {
    const p = findPreset(c.preset);
    if (!p) throw new InputError('bad-choice', 'preset', `one of ${SUBSTRATE_PRESETS.map((x) => x.id).join(', ')}`, JSON.stringify(c.preset));
    base = { ...p.spec };
  }
  if (!base && (c.er === undefined || c.h === undefined)) {
    throw new UsageError('give the substrate: --er and --h, or --preset NAME');
  }
  const sub: SubstrateSpec = base ?? { er: 0, h: 0, t: DEFAULT_COPPER_T, tanDelta: 0, sigma: ANNEALED_COPPER_SIGMA, roughness: 0 };
  if (c.er !== undefined) sub.er = parseQuantity(c.er, 'ratio', 'er');
  if (c.h !== undefined) sub.h = parseQuantity(c.h, 'length', 'h');
  if (c.t !== undefined) sub.t = parseQuantity(c.t, 'length', 't');
  if (c.tand !== undefined) sub.tanDelta = parseQuantity(c.tand, 'ratio', 'tand');
  if (c.sigma !== undefined) sub.sigma = parseQuantity(c.sigma, 'conductivity', 'sigma');
  if (c.rough !== undefined) sub.roughness = parseQuantity(c.rough, 'length', 'rough');
  if (c['f-measure'] !== undefined) sub.dielectricModel = { kind: 'wideband-debye', fMeasure: parseQuantity(c['f-measure'], 'frequency', 'f-measure') };
  return sub;
}

function optionsOf(c: CaseText): LineOptions {
  const opts: LineOptions = {};
  if (c.dispersion !== undefined) {
    if (!DISPERSION_MODELS.includes(c.dispersion as DispersionModel)) throw new InputError('bad-choice', 'dispersion', `one of ${DISPERSION_MODELS.join(', ')}`, JSON.stringify(c.dispersion));
    opts.dispersion = c.dispersion as DispersionModel;
  }
  if (c['conductor-loss'] !== undefined) {
    if (!CONDUCTOR_LOSS_MODELS.includes(c['conductor-loss'] as ConductorLossModel)) throw new InputError('bad-choice', 'conductor-loss', `one of ${CONDUCTOR_LOSS_MODELS.join(', ')}`, JSON.stringify(c['conductor-loss']));
    opts.conductorLoss = c['conductor-loss'] as ConductorLossModel;
  }
  return opts;
}

function solve(c: CaseText): Solved {
  if ((c.z0 === undefined) === (c.width === undefined)) throw new UsageError('give exactly one of --z0 (size a width) or --width (analyse a width)');
  if (c.deg !== undefined && c.length !== undefined) throw new UsageError('give --deg or --length, not both');
  if ((c.deg !== undefined || c.length !== undefined) && c.f === undefined) throw new UsageError('--deg and --length need a frequency: add --f');
  const sub = substrateOf(c);
  const opts = optionsOf(c);
  const f = c.f === undefined ? 0 : parseQuantity(c.f, 'frequency', 'f');
  if (c.f !== undefined && f === 0 && (c.deg !== undefined || c.length !== undefined)) {
    throw new InputError('out-of-range', 'f', 'a frequency above 0 Hz for --deg or --length', c.f);
  }
  const result = c.z0 !== undefined
    ? synthesizeLine(sub, parseQuantity(c.z0, 'impedance', 'z0'), f, opts)
    : analyzeLine(sub, parseQuantity(c.width!, 'length', 'width'), f, opts);
  const out: Solved = { result, sub, opts };
  if (c.deg !== undefined) {
    out.deg = (parseQuantity(c.deg, 'angle', 'deg') * 180) / Math.PI;
    out.lengthM = lengthForDegrees(result, out.deg);
  } else if (c.length !== undefined) {
    out.lengthM = parseQuantity(c.length, 'length', 'length');
    out.deg = degreesForLength(result, out.lengthM);
  }
  return out;
}

function warningJson(w: Warning) {
  return { code: w.code, severity: w.severity, message: w.message, ...(w.source ? { source: w.source } : {}) };
}

/** The JSON object of one case; keys fixed (documented in README, section cli). */
function toJson(s: Solved): Record<string, unknown> {
  const r = s.result;
  const atF = r.f > 0;
  const o: Record<string, unknown> = {
    width_m: r.width, z0_ohm: r.z0, z0_static_ohm: r.z0Static, eps_eff: r.epsEff, eps_eff_static: r.epsEffStatic,
    f_hz: r.f, ...(atF ? { lambda_g_m: r.lambdaG } : {}), vp_m_per_s: r.vp, delay_s_per_m: r.delayPerM,
    alpha_c_db_per_m: r.alphaCdBPerM, alpha_d_db_per_m: r.alphaDdBPerM, ...(atF ? { skin_depth_m: r.skinDepth } : {}),
    threshold_hz: r.thresholds.errorAt, warnings: r.warnings.map(warningJson),
  };
  if (s.lengthM !== undefined) { o.length_m = s.lengthM; o.deg = s.deg; }
  return o;
}

function table(s: Solved): string {
  const r = s.result; const sub = s.sub;
  const q = formatQuantity;
  const atF = r.f > 0;
  const rows: [string, string][] = [
    ['substrate', `εr ${q(sub.er, 'ratio')}, h ${q(sub.h, 'length')}, t ${q(sub.t, 'length')}, tanδ ${q(sub.tanDelta, 'ratio')}, σ ${q(sub.sigma, 'conductivity')}, roughness ${q(sub.roughness, 'length')}${sub.preset ? ` (preset ${sub.preset})` : ''}`],
    ['width', `${q(r.width, 'length')}  (W/h ${q(r.width / sub.h, 'ratio')})`],
    ['frequency', atF ? q(r.f, 'frequency') : 'static (no --f)'],
    ['Z0', atF ? `${q(r.z0, 'impedance')} at f, ${q(r.z0Static, 'impedance')} static` : q(r.z0Static, 'impedance')],
    ['εeff', atF ? `${q(r.epsEff, 'ratio')} at f, ${q(r.epsEffStatic, 'ratio')} static` : q(r.epsEffStatic, 'ratio')],
    ['phase velocity', `${q(r.vp / 299792458, 'ratio')} c0 (${q(r.delayPerM * 1e-3 * 1e12, 'ratio')} ps/mm)`],
  ];
  if (atF) {
    rows.push(['guided wavelength', q(r.lambdaG, 'length')]);
    rows.push(['conductor loss', `${q(r.alphaCdBPerM, 'db')}/m`]);
    rows.push(['dielectric loss', `${q(r.alphaDdBPerM, 'db')}/m`]);
    rows.push(['loss per wavelength', q(r.lossDbPerWavelength, 'db')]);
    rows.push(['skin depth', q(r.skinDepth, 'length')]);
  } else {
    rows.push(['DC conductor loss', `${q(r.alphaCdBPerM, 'db')}/m`]);
  }
  const preset = sub.preset ? findPreset(sub.preset) : undefined;
  if (preset) rows.splice(1, 0, ['preset note', preset.note]);
  if (s.lengthM !== undefined) rows.push(['electrical length', `${q(s.deg!, 'ratio')}° = ${q(s.lengthM, 'length')}`]);
  rows.push(['mode threshold', `${q(r.thresholds.errorAt, 'frequency')} (caution above ${q(r.thresholds.warnAt, 'frequency')}; rule of thumb c0/(4h√(εr−1)) = ${q(r.thresholds.ruleOfThumb, 'frequency')})`]);
  rows.push(['models', modelNames(s)]);
  const width = Math.max(...rows.map(([k]) => k.length));
  const lines = rows.map(([k, v]) => `  ${k.padEnd(width)}  ${v}`);
  if (r.warnings.length > 0) {
    lines.push('', 'Warnings:');
    for (const w of r.warnings) lines.push(`  [${w.severity}] ${w.message}`);
  }
  return lines.join('\n');
}

function errorText(e: unknown): string {
  if (e instanceof InputError) return e.message;
  if (e instanceof UsageError) return e.message;
  throw e;
}

// ---- batch -------------------------------------------------------------------------------------------------------

/** Minimal RFC 4180 reader: quoted fields, doubled quotes, CRLF or LF; returns rows with their 1-based line numbers. */
function readCsv(text: string): { line: number; cells: string[] }[] {
  const rows: { line: number; cells: string[] }[] = [];
  let cells: string[] = []; let cell = ''; let quoted = false; let line = 1; let start = 1; let i = 0;
  if (text.charCodeAt(0) === 0xfeff) i = 1; // byte-order mark
  for (; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') { if (text[i + 1] === '"') { cell += '"'; i++; } else quoted = false; }
      else { if (ch === '\n') line++; cell += ch; }
    } else if (ch === '"' && cell === '') quoted = true;
    else if (ch === ',') { cells.push(cell); cell = ''; }
    else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      cells.push(cell); cell = '';
      if (cells.some((c) => c.trim() !== '')) rows.push({ line: start, cells });
      cells = []; line++; start = line;
    } else cell += ch;
  }
  if (quoted) throw new InputError('bad-file', 'batch', 'a CSV file whose quotes are closed', `an open quote from line ${start}`);
  cells.push(cell);
  if (cells.some((c) => c.trim() !== '')) rows.push({ line: start, cells });
  return rows;
}

function exists(p: string): boolean {
  try { statSync(p); return true; } catch { return false; }
}

function csvCell(v: unknown): string {
  const s = v === undefined || v === null ? '' : typeof v === 'number' ? String(v) : String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

const RESULT_COLUMNS = ['width_m', 'z0_ohm', 'z0_static_ohm', 'eps_eff', 'eps_eff_static', 'f_hz', 'lambda_g_m', 'vp_m_per_s',
  'delay_s_per_m', 'alpha_c_db_per_m', 'alpha_d_db_per_m', 'skin_depth_m', 'threshold_hz', 'length_m', 'deg'] as const;

async function runBatch(path: string, defaults: CaseText, outPath: string | undefined, force: boolean, io: CliIo): Promise<number> {
  const file = resolve(io.cwd, path);
  const read = await readInputText(file, path, CSV_INPUT, 'a CSV file with a header row');
  if (!read.ok) { io.err(`stripwright line: the batch file: ${read.message}`); return 1; }
  const text = read.text;
  let rows: { line: number; cells: string[] }[];
  try { rows = readCsv(text); } catch (e) { io.err(`stripwright line: ${path}: ${errorText(e)}`); return 1; }
  if (rows.length === 0) { io.err(`stripwright line: ${path}: expected a header row naming the columns (${CASE_KEYS.join(',')}), got an empty file`); return 1; }
  const header = rows[0]!.cells.map((c) => c.trim().replace(/^--/, ''));
  const unknown = header.filter((h) => !(CASE_KEYS as readonly string[]).includes(h));
  if (unknown.length > 0) {
    io.err(`stripwright line: ${path} line ${rows[0]!.line}: unknown column${unknown.length > 1 ? 's' : ''} ${unknown.map((u) => `'${u}'`).join(', ')}; expected columns named like the flags: ${CASE_KEYS.join(', ')}`);
    return 1;
  }
  if (rows.length - 1 > MAX_BATCH_ROWS) { io.err(`stripwright line: ${path}: expected at most ${MAX_BATCH_ROWS} rows, got ${rows.length - 1}`); return 1; }
  const out: string[] = [['line', ...header, ...RESULT_COLUMNS, 'warnings', 'error'].map(csvCell).join(',')];
  let failed = 0;
  for (const row of rows.slice(1)) {
    const c: CaseText = { ...defaults };
    header.forEach((h, i) => { const v = (row.cells[i] ?? '').trim(); if (v !== '') c[h as keyof CaseText] = v; });
    const echo = header.map((_, i) => row.cells[i] ?? '');
    try {
      if (row.cells.length > header.length) throw new InputError('bad-file', 'row', `at most ${header.length} cells, as in the header`, `${row.cells.length}`);
      const s = solve(c);
      const j = toJson(s);
      const warnings = (j.warnings as ReturnType<typeof warningJson>[]).map((w) => `[${w.severity}] ${w.message}`).join(' | ');
      out.push([row.line, ...echo, ...RESULT_COLUMNS.map((k) => j[k]), warnings, ''].map(csvCell).join(','));
    } catch (e) {
      failed++;
      const msg = errorText(e);
      io.err(`stripwright line: ${path} line ${row.line}: ${msg}`);
      out.push([row.line, ...echo, ...RESULT_COLUMNS.map(() => ''), '', msg].map(csvCell).join(','));
    }
  }
  const csv = out.join('\n') + '\n';
  if (outPath === undefined) io.out(csv.trimEnd());
  else {
    const target = resolve(io.cwd, outPath);
    if (target === file) { io.err('stripwright line: --out must not be the batch file itself (it would be overwritten)'); return 1; }
    if (!force && exists(target)) { io.err(`stripwright line: ${outPath} exists; choose another --out or add --force to replace it`); return 1; }
    try { await writeOutputFile(target, csv); } catch (e) {
      io.err(`stripwright line: ${(e as Error).message}`);
      return 1;
    }
    io.err(`stripwright line: ${rows.length - 1 - failed} of ${rows.length - 1} rows sized, results in ${outPath}`);
  }
  if (failed > 0) io.err(`stripwright line: ${failed} row${failed > 1 ? 's' : ''} failed (see above)`);
  return failed > 0 ? 1 : 0;
}

export const lineCommand: CliCommand = {
  name: 'line',
  summary: 'Size a microstrip width for an impedance, or analyse a width (Z0, εeff, loss, length)',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values } = parseArgs({ args: argv, options: OPTIONS, strict: true, allowPositionals: false });
    const c: CaseText = {};
    for (const k of CASE_KEYS) if (values[k] !== undefined) c[k] = values[k];
    if (values.batch !== undefined) {
      if (values.json) throw new UsageError('--json is for one case; --batch writes CSV');
      return await runBatch(values.batch, c, values.out, values.force === true, io);
    }
    if (values.out !== undefined || values.force) throw new UsageError('--out and --force go with --batch');
    if (values.coupled) return runCoupled(values, io);
    if (values.spacing !== undefined || values['coupling-db'] !== undefined || values.z0e !== undefined || values.z0o !== undefined) {
      throw new UsageError('--spacing, --coupling-db, --z0e and --z0o are for a coupled pair: add --coupled');
    }
    try {
      const s = solve(c);
      io.out(values.json ? resultJson(toJson(s), 2) : table(s));
      return 0;
    } catch (e) {
      if (e instanceof UsageError) throw e;
      io.err(`stripwright line: ${errorText(e)}`);
      return 1;
    }
  },
};

/** `--coupled`: one coupled pair through core coupledLine (cli/commands/line-coupled.ts). */
function runCoupled(values: Record<string, string | boolean | undefined>, io: CliIo): number {
  const str = (k: string) => (typeof values[k] === 'string' ? (values[k] as string) : undefined);
  try {
    const sub = substrateOf({ preset: str('preset'), er: str('er'), h: str('h'), t: str('t'), tand: str('tand'), sigma: str('sigma'), rough: str('rough'), 'f-measure': str('f-measure') });
    if (str('deg') !== undefined || str('length') !== undefined || str('conductor-loss') !== undefined) throw new UsageError('--deg, --length and --conductor-loss are not for --coupled');
    const r = solveCoupled(sub, { width: str('width'), spacing: str('spacing'), 'coupling-db': str('coupling-db'), z0: str('z0'), z0e: str('z0e'), z0o: str('z0o'), f: str('f'), dispersion: str('dispersion') });
    io.out(values.json ? JSON.stringify(coupledJson(r), null, 2) : coupledTable(r, sub));
    return 0;
  } catch (e) {
    if (e instanceof UsageError) throw e;
    io.err(`stripwright line: ${errorText(e)}`);
    return 1;
  }
}

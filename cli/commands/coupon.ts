/**
 * `stripwright coupon`: the laminate's εr and tanδ from a measured coupon (two or more .s2p files of lines that
 * differ only in length), or `--make` a coupon design sized for a laminate and band. A thin face over
 * core/network/coupon (extractLaminate) and core/layout/generators/coupon.ts (laminateCoupon, couponForDesign).
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import {
  ANNEALED_COPPER_SIGMA, CONDUCTOR_LOSS_MODELS, DEFAULT_COPPER_T, DISPERSION_MODELS, InputError, SUBSTRATE_PRESETS,
  couponForDesign, extractLaminate, findPreset, formatQuantity, laminateCoupon, parseDesign, parseQuantity, runCommand, serializeDesign,
  type ConductorLossModel, type CouponResult, type DesignDoc, type DispersionModel, type LineOptions, type QuantityKind, type SubstrateSpec,
} from '../../core/index.ts';
import { OutputError, writeOutputFile } from '../files.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { VERSION } from '../version.ts';

const LETTERS = ['a', 'b', 'c', 'd', 'e', 'f'] as const;

const USAGE = `Usage: stripwright coupon A.s2p B.s2p [C.s2p …] --length-a LEN --length-b LEN [--length-c LEN …]
                         --h LEN --t LEN --width LEN [--er-guess N] [--json]
       stripwright coupon --make --from FREQ --to FREQ (--preset NAME | --er N --h LEN) --out FILE.json
       stripwright coupon --make --add-to DESIGN.json --out FILE.json

Measures the laminate: εr and tanδ (at one stated frequency) from two-port measurements of coupon lines that
differ only in length. The propagation constant comes from the lines' eigenvalues (two-line / multiline method),
the effective permittivity from it, and εr and tanδ from a least-squares fit of the line model (dispersion,
conductor and dielectric loss) over the band. Frequencies where the lines' phase difference is near a multiple of
180° are left out and listed. Uncertainties are one standard uncertainty (residuals and measured spread).

Measured lines (one .s2p per line, same analyser settings, port 1 at one end and port 2 at the other):
  --length-a LEN …      port-to-port length of the first, second, … file (only differences matter), e.g. 25mm
  --lengths L1,L2,…     the same as one list
  --h LEN               dielectric height
  --t LEN               copper thickness (0 allowed)
  --width LEN           strip width of the lines, as made (measure it)
  --er-guess N          first guess of εr (default 4.4; resolves the 360° ambiguity of the phase)
  --tand-guess N        first guess of tanδ (default 0.01)
  --sigma S             conductor conductivity (default annealed copper)
  --rough LEN           copper rms roughness (default 0)
  --fit-roughness       also fit the roughness (needs a wide band; otherwise it trades against tanδ)
  --dielectric debye|constant
                        debye (default): εr, tanδ stated at --f-measure and carried over the band with the
                        wideband Debye model; constant: the same at every frequency
  --f-measure FREQ      frequency the result is stated at (default: geometric middle of the used band)
  --min-phase DEG       conditioning margin from 0°/180° (default 20)
  --dispersion NAME     ${DISPERSION_MODELS.join(', ')} (default ${DISPERSION_MODELS[0]})
  --conductor-loss NAME ${CONDUCTOR_LOSS_MODELS.join(', ')} (default ${CONDUCTOR_LOSS_MODELS[0]})
  --json                one JSON object: er, tand, uncertainty {er, tand}, excluded [{f, reason}], points, substrate

Making a coupon:
  --make                write a coupon design instead of measuring one
  --from FREQ, --to FREQ band to measure over (default with --add-to: the design's band)
  --preset NAME | --er N --h LEN [--t LEN] [--tand N]
                        the laminate as far as it is known (${SUBSTRATE_PRESETS.map((p) => p.id).join(', ')})
  --z0 OHMS | --width LEN  line impedance (default 50 ohm) or strip width
  --base-length LEN     shortest line (default 25 mm)
  --pitch LEN           distance between lines (default 15 mm)
  --thru                add a thru (the two launches back to back)
  --add-to DESIGN.json  add the coupon below that design's network (its laminate and band)
  --out FILE.json       the design to write; refuses to replace a file unless --force

Test equipment: stay within the analyser's input power and DC limits, use ESD precautions and a torque wrench,
keep connectors clean, and follow the instrument's manual and local rules.

Examples:
  stripwright coupon --make --preset glass-epoxy --from 1GHz --to 4GHz --out coupon.json
  stripwright coupon a.s2p b.s2p --length-a 25mm --length-b 41.29mm --h 1.6mm --t 35um --width 3.02mm
  stripwright coupon a.s2p b.s2p --lengths 25mm,41.29mm --h 1.6mm --t 35um --width 3.02mm --json`;

const OPTIONS = {
  lengths: { type: 'string' }, h: { type: 'string' }, t: { type: 'string' }, width: { type: 'string' },
  'er-guess': { type: 'string' }, 'tand-guess': { type: 'string' }, sigma: { type: 'string' }, rough: { type: 'string' },
  'fit-roughness': { type: 'boolean' }, dielectric: { type: 'string' }, 'f-measure': { type: 'string' }, 'min-phase': { type: 'string' },
  dispersion: { type: 'string' }, 'conductor-loss': { type: 'string' }, json: { type: 'boolean' },
  make: { type: 'boolean' }, from: { type: 'string' }, to: { type: 'string' }, preset: { type: 'string' }, er: { type: 'string' },
  tand: { type: 'string' }, z0: { type: 'string' }, 'base-length': { type: 'string' }, pitch: { type: 'string' }, thru: { type: 'boolean' },
  'add-to': { type: 'string' }, out: { type: 'string' }, force: { type: 'boolean' },
  ...Object.fromEntries(LETTERS.map((l) => [`length-${l}`, { type: 'string' }])),
} as const;

type Values = Record<string, string | boolean | undefined>;

function q(values: Values, flag: string, kind: QuantityKind): number | undefined {
  const v = values[flag];
  if (v === undefined || typeof v !== 'string') return undefined;
  return parseQuantity(v, kind, `--${flag}`);
}

function need(values: Values, flag: string, kind: QuantityKind, why: string): number {
  const v = q(values, flag, kind);
  if (v === undefined) throw new UsageError(`give --${flag} (${why})`);
  return v;
}

function lineOptions(values: Values): LineOptions {
  const opts: LineOptions = {};
  const d = values.dispersion, c = values['conductor-loss'];
  if (typeof d === 'string') {
    if (!DISPERSION_MODELS.includes(d as DispersionModel)) throw new UsageError(`--dispersion must be one of ${DISPERSION_MODELS.join(', ')}, not '${d}'`);
    opts.dispersion = d as DispersionModel;
  }
  if (typeof c === 'string') {
    if (!CONDUCTOR_LOSS_MODELS.includes(c as ConductorLossModel)) throw new UsageError(`--conductor-loss must be one of ${CONDUCTOR_LOSS_MODELS.join(', ')}, not '${c}'`);
    opts.conductorLoss = c as ConductorLossModel;
  }
  return opts;
}

function readText(path: string, shown: string, io: CliIo): string | null {
  try {
    if (statSync(path).size > 64 * 1024 * 1024) { io.err(`stripwright coupon: ${shown} is larger than 64 MB; is it the right file?`); return null; }
    return readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    io.err(`stripwright coupon: cannot read ${shown}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : (e as Error).message}`);
    return null;
  }
}

const ghz = (f: number) => `${Number((f / 1e9).toPrecision(4))} GHz`;
const sig = (x: number, d = 4) => String(Number(x.toPrecision(d)));

/** Left-out frequencies as ranges per reason: "1.2–1.4 GHz (ill-conditioned …)". */
function excludedText(r: CouponResult): string[] {
  const out: string[] = [];
  let run: { a: number; b: number; reason: string } | null = null;
  const flush = () => { if (run) out.push(`${run.a === run.b ? ghz(run.a) : `${sig(run.a / 1e9)}–${ghz(run.b)}`}: ${run.reason}`); run = null; };
  for (const p of r.points) {
    if (p.used) { flush(); continue; }
    if (run && run.reason === p.reason) run.b = p.f;
    else { flush(); run = { a: p.f, b: p.f, reason: p.reason! }; }
  }
  flush();
  return out;
}

function table(r: CouponResult): string {
  const used = r.points.filter((p) => p.used);
  const lines = [
    `Laminate from ${r.lines.length} coupon lines (${r.lines.map((l) => `${l.name} ${formatQuantity(l.length, 'length', { unit: 'mm' })}`).join(', ')})`,
    `  εr     ${sig(r.er, 5)} ± ${sig(r.uncertainty.er, 2)}`,
    `  tanδ   ${sig(r.tand, 4)} ± ${sig(r.uncertainty.tand, 2)}`,
    ...(r.roughness !== undefined ? [`  rough  ${formatQuantity(r.roughness, 'length', { unit: 'um' })} ± ${formatQuantity(r.uncertainty.roughness!, 'length', { unit: 'um', digits: 2 })} rms`] : []),
    `  stated at ${ghz(r.fMeasure)} (${r.dielectric === 'constant' ? 'constant over the band' : 'wideband Debye over the band'}); one standard uncertainty`,
    `  used   ${used.length} of ${r.points.length} frequencies, ${ghz(used[0]!.f)} to ${ghz(used[used.length - 1]!.f)}; rms misfit ε'eff ${sig(r.rms.epsEff, 2)}, ε''eff ${sig(r.rms.epsEffLoss, 2)}`,
  ];
  const ex = excludedText(r);
  if (ex.length) lines.push('  left out:', ...ex.map((e) => `    ${e}`));
  const notes = r.warnings.filter((w) => w.severity !== 'info').map((w) => `  note: ${w.message}`);
  return [...lines, ...notes].join('\n');
}

function toJson(r: CouponResult): unknown {
  return {
    er: r.er, tand: r.tand, ...(r.roughness !== undefined ? { roughness: r.roughness } : {}),
    uncertainty: r.uncertainty, uncertaintyParts: r.uncertaintyParts,
    fMeasure: r.fMeasure, dielectric: r.dielectric, substrate: r.substrate,
    excluded: r.excluded, lines: r.lines, rms: r.rms,
    points: r.points, warnings: r.warnings.map((w) => ({ severity: w.severity, message: w.message, ...(w.source ? { source: w.source } : {}) })),
  };
}

async function measure(files: string[], values: Values, io: CliIo): Promise<number> {
  if (files.length < 2) throw new UsageError('give at least two measured lines (.s2p files)');
  if (files.length > LETTERS.length && values.lengths === undefined) throw new UsageError(`with more than ${LETTERS.length} files give the lengths as --lengths L1,L2,…`);
  let lengths: number[];
  if (typeof values.lengths === 'string') {
    lengths = values.lengths.split(',').map((s, i) => parseQuantity(s.trim(), 'length', `--lengths[${i + 1}]`));
    if (lengths.length !== files.length) throw new UsageError(`--lengths gives ${lengths.length} lengths for ${files.length} files`);
  } else {
    lengths = files.map((_, i) => need(values, `length-${LETTERS[i]}`, 'length', `the port-to-port length of ${files[i]}`));
  }
  const h = need(values, 'h', 'length', 'the dielectric height');
  const t = need(values, 't', 'length', 'the copper thickness; 0 is allowed');
  const width = need(values, 'width', 'length', 'the strip width of the lines as made');
  const dielectric = values.dielectric === undefined ? undefined : values.dielectric === 'debye' ? 'wideband-debye' : values.dielectric === 'constant' ? 'constant' : null;
  if (dielectric === null) throw new UsageError(`--dielectric must be debye or constant, not '${String(values.dielectric)}'`);
  const minPhase = q(values, 'min-phase', 'angle');
  const texts: string[] = [];
  for (const f of files) {
    const text = readText(resolve(io.cwd, f), f, io);
    if (text === null) return 1;
    texts.push(text);
  }
  const r = extractLaminate({
    lines: files.map((f, i) => ({ name: basename(f), text: texts[i]!, length: lengths[i]! })),
    width, h, t,
    sigma: q(values, 'sigma', 'conductivity'), roughness: q(values, 'rough', 'length'),
    erGuess: q(values, 'er-guess', 'ratio'), tanDeltaGuess: q(values, 'tand-guess', 'ratio'),
    fitRoughness: values['fit-roughness'] === true, dielectric, fMeasure: q(values, 'f-measure', 'frequency'),
    minPhaseDeg: minPhase === undefined ? undefined : (minPhase * 180) / Math.PI, line: lineOptions(values),
  });
  io.out(values.json ? JSON.stringify(toJson(r)) : table(r));
  return 0;
}

function laminateOf(values: Values): SubstrateSpec {
  let sub: SubstrateSpec;
  if (typeof values.preset === 'string') {
    const p = findPreset(values.preset);
    if (!p) throw new InputError('bad-choice', '--preset', `one of ${SUBSTRATE_PRESETS.map((x) => x.id).join(', ')}`, JSON.stringify(values.preset));
    sub = { ...p.spec };
  } else {
    if (values.er === undefined || values.h === undefined) throw new UsageError('give the laminate: --er and --h, or --preset NAME');
    sub = { er: 0, h: 0, t: DEFAULT_COPPER_T, tanDelta: 0, sigma: ANNEALED_COPPER_SIGMA, roughness: 0 };
  }
  const er = q(values, 'er', 'ratio'), h = q(values, 'h', 'length'), t = q(values, 't', 'length'), tand = q(values, 'tand', 'ratio');
  if (er !== undefined) sub.er = er;
  if (h !== undefined) sub.h = h;
  if (t !== undefined) sub.t = t;
  if (tand !== undefined) sub.tanDelta = tand;
  return sub;
}

async function make(values: Values, io: CliIo): Promise<number> {
  if (typeof values.out !== 'string') throw new UsageError('give --out FILE.json for the coupon design');
  const out = resolve(io.cwd, values.out);
  if (existsSync(out) && !values.force) { io.err(`stripwright coupon: not replacing ${out}; nothing was written (add --force to replace it)`); return 1; }
  const from = q(values, 'from', 'frequency'), to = q(values, 'to', 'frequency');
  const band = from !== undefined || to !== undefined ? { start: from ?? Number.NaN, stop: to ?? Number.NaN } : undefined;
  const common = {
    ...(band ? { band } : {}), z0: q(values, 'z0', 'impedance'), width: q(values, 'width', 'length'),
    baseLength: q(values, 'base-length', 'length'), pitch: q(values, 'pitch', 'length'), thru: values.thru === true,
  };
  let doc: DesignDoc;
  let planText: string;
  if (typeof values['add-to'] === 'string') {
    const text = readText(resolve(io.cwd, values['add-to']), values['add-to'], io);
    if (text === null) return 1;
    const parsed = parseDesign(text);
    if (!parsed.ok) { io.err(`stripwright coupon: ${values['add-to']} cannot be read:`); for (const e of parsed.errors) io.err(`  ${e.message}`); return 1; }
    const c = couponForDesign(parsed.doc, common);
    doc = runCommand(parsed.doc, 'selection.paste', { clipboard: c.clipboard, offset: c.offset });
    planText = planLines(c.plan);
  } else {
    if (!band) throw new UsageError('give the band: --from FREQ --to FREQ');
    const c = laminateCoupon({ ...common, band, substrate: laminateOf(values) });
    doc = c.design;
    planText = planLines(c.plan);
  }
  doc.app = `stripwright ${VERSION}`;
  await writeOutputFile(out, serializeDesign(doc));
  io.out(`wrote ${out}\n${planText}`);
  return 0;
}

function planLines(plan: ReturnType<typeof laminateCoupon>['plan']): string {
  return [
    `coupon lines (strip ${formatQuantity(plan.width, 'length', { unit: 'mm' })}, launch pads ${formatQuantity(plan.padLength, 'length', { unit: 'mm' })}):`,
    ...plan.lines.map((l) => `  ${l.name === 'T' ? 'thru' : `line ${l.name}`}  ${formatQuantity(l.length, 'length', { unit: 'mm', digits: 6 })}${l.phaseDeg ? `  (β·Δl ${Math.round(l.phaseDeg[0])}°–${Math.round(l.phaseDeg[1])}° over ${ghz(l.band!.start)}–${ghz(l.band!.stop)})` : ''}`),
    `  phase difference at least ${Math.round(plan.worstMarginDeg)}° from 0° and 180° across the band`,
    ...plan.warnings.map((w) => `  note: ${w.message}`),
  ].join('\n');
}

export const couponCommand: CliCommand = {
  name: 'coupon',
  summary: 'Laminate εr and tanδ from a measured coupon; --make a coupon design',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({ args: argv, options: OPTIONS, allowPositionals: true, strict: true });
    try {
      if (values.make) {
        if (positionals.length > 0) throw new UsageError('--make takes no measured files');
        return await make(values as Values, io);
      }
      if (values.out !== undefined || values['add-to'] !== undefined) throw new UsageError('--out and --add-to go with --make');
      return await measure(positionals, values as Values, io);
    } catch (e) {
      if (e instanceof InputError || e instanceof OutputError) { io.err(`stripwright coupon: ${e.message}`); return 1; }
      throw e;
    }
  },
};

/**
 * `stripwright sweep`: the response of a design across frequency — S-parameters of every port, derived figures,
 * a Touchstone file. A thin face over core/network: the design is parsed, sized, turned into a netlist and swept.
 * A Touchstone file given instead of a design is read and summarised the same way (to look at a measured board).
 */
import { DESIGN_TEXT, OutputError, readInputText, TOUCHSTONE_INPUT, writeOutputFile } from '../files.ts';
import { parseArgs } from 'node:util';
import { existsSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import {
  InputError, parseDesign, formatQuantity, portLabel, sweepRangeWarnings, DesignPipeline, sweepDesign,
  readTouchstone, writeTouchstone, summarize, magnitudeDb, phaseDeg, groupDelay, returnLoss, vswr, amplitudeBalance,
  phaseBalance, isolation, portIndex, compareResponses, compareMeasured, guessPortMap, MAX_POINTS, designSweepSettings, type MeasuredFile,
  type NetworkResponse, type DesignDoc, type TouchstoneData, type JunctionChoice, type ResponseDifference, type SweepSettings, type TouchstoneFormat, type FrequencyUnit, type Warning,
} from '../../core/index.ts';
import { countOption, quantityOption } from '../numbers.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { VERSION } from '../version.ts';
import { resultJson } from '../json.ts';

const USAGE = `Usage: stripwright sweep FILE [--from FREQ --to FREQ --points N --log] [--out FILE.sNp]
                        [--format ri|ma|db] [--unit hz|khz|mhz|ghz] [--zref OHMS] [--input PORT] [--json]

Computes the S-parameters of a design (FILE.json) across frequency: every piece as a lossy, dispersive line,
with open ends, vias, part pads and S-parameter parts, solved by nodal analysis. A Touchstone file
(FILE.s1p, .s2p, …) is read and summarised instead, e.g. to look at a measured board.

Sweep (default: the design's own sweep settings, else its band, 201 linear points, widened to include f0):
  --from FREQ, --to FREQ   band edges, e.g. 2.3GHz, 2500MHz
  --points N               number of frequencies (1 to ${MAX_POINTS})
  --log                    logarithmic spacing

Output (default: a summary table — worst figures over the band and the values at f0):
  --out FILE.sNp           write a Touchstone 1.1 file (N = number of ports); refuses to replace a file unless --force
  --format ri|ma|db        Touchstone number format (default ri: real/imaginary, full precision)
  --unit hz|khz|mhz|ghz    Touchstone frequency unit (default ghz)
  --zref OHMS              reference impedance of the Touchstone file (default: the ports' own, when all agree)
  --touchstone 1.1|2.0     file version (default 1.1; 2.0 keeps different port references, older readers may
                           ignore them)
  --input PORT             port taken as the input for the figures, by label, id or number (default: the
                           layout's anchor port)
  --compare FILE.sNp       sweep at that file's frequencies and show how far the design is from it
                           (largest |ΔS|, Δ dB and Δ phase per S-parameter), e.g. a measured board
  --junctions modelled|ideal
                           tees (Hammerstad 1981) and width steps (Garg–Bahl 1978) as modelled, or ideal junctions
                           joined at their centre, for comparison (default: the design's own setting, else modelled)
  --json                   one JSON object: frequencies, S as real and imaginary parts, derived figures
  --force                  replace an existing --out file

Examples:
  stripwright sweep assets/examples/wilkinson-2g45.json
  stripwright sweep assets/examples/branchline-10g4.json --junctions ideal
  stripwright sweep feed.json --from 5GHz --to 6.5GHz --points 301 --out feed.s5p
  stripwright sweep measured.s2p --json`;

const OPTIONS = {
  from: { type: 'string' }, to: { type: 'string' }, points: { type: 'string' }, log: { type: 'boolean' },
  out: { type: 'string' }, format: { type: 'string' }, unit: { type: 'string' }, zref: { type: 'string' },
  input: { type: 'string' }, json: { type: 'boolean' }, force: { type: 'boolean' }, junctions: { type: 'string' }, compare: { type: 'string' }, touchstone: { type: 'string' },
} as const;

function choice<T extends string>(flag: string, v: string | undefined, allowed: readonly T[]): T | undefined {
  if (v === undefined) return undefined;
  const l = v.toLowerCase();
  if (!(allowed as readonly string[]).includes(l)) throw new UsageError(`--${flag} must be one of ${allowed.join(', ')}, not '${v}'`);
  return l as T;
}


interface Loaded { doc?: DesignDoc; name: string; f0?: number; response: NetworkResponse; input: number; warnings: Warning[]; from: 'design' | 'touchstone' }

export const sweepCommand: CliCommand = {
  name: 'sweep',
  summary: 'S-parameters of a design across frequency; figures, Touchstone out',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({ args: argv, options: OPTIONS, allowPositionals: true, strict: true });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the design (or Touchstone) file to sweep' : `one file at a time, got ${positionals.length}`);
    const format = choice<TouchstoneFormat>('format', values.format, ['ri', 'ma', 'db']);
    const tsVersion = choice<'1.1' | '2.0'>('touchstone', values.touchstone, ['1.1', '2.0']);
    const unit = choice<FrequencyUnit>('unit', values.unit, ['hz', 'khz', 'mhz', 'ghz']);
    const from = quantityOption('from', values.from, 'frequency');
    const to = quantityOption('to', values.to, 'frequency');
    const zref = quantityOption('zref', values.zref, 'impedance', { min: 0, max: 1e6, minExclusive: true });
    const points = countOption('points', values.points, 1, MAX_POINTS);
    const junctions = choice<JunctionChoice>('junctions', values.junctions, ['modelled', 'ideal']);
    if ((format || unit || tsVersion || zref !== undefined || values.force) && !values.out) throw new UsageError('--format, --unit, --touchstone, --zref and --force apply to the Touchstone file: add --out FILE.sNp');

    const file = resolve(io.cwd, positionals[0]);
    let measured: TouchstoneData | undefined;
    let measuredText = '';
    if (values.compare !== undefined) {
      if (/\.s\d+p$/i.test(file)) throw new UsageError('--compare goes with a design file; to compare two Touchstone files, sweep the design against each');
      if (values.points !== undefined || values.log) throw new UsageError('--compare sweeps at the frequencies of the compared file; leave out --points and --log');
      const cf = resolve(io.cwd, values.compare);
      const ctext = await readInput(cf, values.compare, io);
      if (ctext === null) return 1;
      measuredText = ctext;
      try { measured = loadTouchstone(ctext, cf, { from, to }).response as TouchstoneData; } catch (e) {
        if (e instanceof InputError) { io.err(`stripwright sweep: ${e.message}`); return 1; }
        throw e;
      }
    }
    const text = await readInput(file, positionals[0], io);
    if (text === null) return 1;
    try {
      const loaded = /\.s\d+p$/i.test(file)
        ? loadTouchstone(text, file, { from, to, points, log: values.log })
        : await loadDesign(text, positionals[0], { from, to, points, log: values.log, junctions, freqs: measured?.freqs }, io);
      if (!loaded) return 1;
      const r = loaded.response;
      const input = values.input !== undefined ? portIndex(r, values.input, '--input') : loaded.input;
      if (values.out) {
        const out = resolve(io.cwd, values.out);
        const want = `.s${r.ports.length}p`;
        if (!out.toLowerCase().endsWith(want)) {
          io.err(`stripwright sweep: --out should end in ${want} for ${r.ports.length} port(s) (Touchstone readers take the port count from the extension); nothing was written`);
          return 1;
        }
        if (existsSync(out) && !values.force) {
          io.err(`stripwright sweep: not replacing ${out}; nothing was written (add --force to replace it)`);
          return 1;
        }
        const ts = writeTouchstone(r, {
          format, unit, zRef: zref, version: tsVersion, app: `stripwright ${VERSION}`, design: loaded.name,
          comments: [`from ${basename(file)}`],
        });
        await writeOutputFile(out, ts);
        if (!values.json) io.out(`wrote ${out}  (Touchstone ${tsVersion ?? '1.1'}, ${r.ports.length} port(s), ${r.freqs.length} frequencies)`);
      }
      for (const w of [...loaded.warnings, ...r.warnings]) if (w.severity !== 'info') io.err(`warning: ${w.message}`);
      // The app's comparison: the design's saved port map for this file name when it has one, else ports in order.
      const diff = measured ? compareMeasured(r, measuredRecord(loaded.doc, basename(values.compare!), measuredText, measured.ports.length, r), { from, to }).diff : undefined;
      if (values.json) io.out(resultJson({ ...toJson(loaded, input), ...(diff ? { comparison: { file: basename(values.compare!), ...comparisonJson(r, diff) } } : {}) }));
      else if (!values.out || diff) io.out([values.out ? '' : table(loaded, input), diff ? comparisonTable(r, diff, basename(values.compare!)) : '', values.out ? '' : notes([...loaded.warnings, ...r.warnings])].filter(Boolean).join('\n\n'));
      return 0;
    } catch (e) {
      if (e instanceof InputError) { io.err(`stripwright sweep: ${e.message}`); return 1; }
      if (e instanceof OutputError) { io.err(`stripwright sweep: ${e.message}`); return 1; }
      throw e;
    }
  },
};

interface SweepFlags { from?: number; to?: number; points?: number; log?: boolean; junctions?: JunctionChoice | undefined; freqs?: Float64Array }

function settingsFor(doc: Pick<DesignDoc, 'frequency' | 'sweep'>, s: SweepFlags): SweepSettings {
  // Without flags: the design's own sweep settings (or its band), the same frequencies the app sweeps.
  if (s.from === undefined && s.to === undefined && s.points === undefined && s.log === undefined) return designSweepSettings(doc);
  const band = doc.sweep ?? doc.frequency.band, f0 = doc.sweep ? undefined : doc.frequency.f0;
  let start = s.from ?? band.start, stop = s.to ?? band.stop;
  if (s.from === undefined && s.to === undefined && f0 !== undefined) { start = Math.min(start, f0); stop = Math.max(stop, f0); }
  if (stop < start) throw new UsageError(`--to (${formatQuantity(stop, 'frequency')}) must not be below --from (${formatQuantity(start, 'frequency')})`);
  return { start, stop, points: s.points ?? (start === stop ? 1 : doc.sweep?.points ?? 201), log: s.log ?? doc.sweep?.spacing === 'log' };
}

async function loadDesign(text: string, shown: string, s: SweepFlags, io: CliIo): Promise<Loaded | null> {
  const parsed = parseDesign(text);
  if (!parsed.ok) {
    io.err(`stripwright sweep: ${shown} is not a valid design:`);
    for (const i of parsed.errors) io.err(`  ${i.message}`);
    return null;
  }
  const doc = parsed.doc;
  // The core's one sweep of a design (the app's response worker calls the same); --junctions is the design's own
  // setting for this run.
  const pipeline = new DesignPipeline({ capacity: 4 });
  const asSwept = s.junctions ? { ...doc, junctions: s.junctions } : doc;
  const sized = pipeline.sized(asSwept);
  const settings: SweepSettings | Float64Array = s.freqs ?? settingsFor(doc, s);
  let lastShown = -1;
  const tty = Boolean((process.stderr as { isTTY?: boolean }).isTTY);
  const { response, net } = await sweepDesign(pipeline, asSwept, settings, {
    chunk: 200,
    onProgress: (done, total) => {
      if (!tty || total < 2000) return;
      const pct = Math.floor((100 * done) / total);
      if (pct !== lastShown) { lastShown = pct; process.stderr.write(`\rsweeping ${pct}%${done === total ? '\n' : ''}`); }
    },
    yieldTo: () => new Promise<void>((r) => setImmediate(r)),
  });
  const range = sweepRangeWarnings(sized, response.freqs[response.freqs.length - 1], sized.lineOptions ? { line: sized.lineOptions } : {});
  return { doc, name: doc.name, f0: doc.frequency.f0, response, input: net.input, warnings: [...parsed.warnings, ...sized.warnings, ...net.warnings, ...range], from: 'design' };
}

function loadTouchstone(text: string, file: string, s: SweepFlags): Loaded {
  const d = readTouchstone(text, { fileName: basename(file) });
  if (s.from !== undefined || s.to !== undefined || s.points !== undefined || s.log) {
    // A measured file is shown at its own points; a range only selects from them.
    const lo = s.from ?? -Infinity, hi = s.to ?? Infinity;
    const keep: number[] = [];
    d.freqs.forEach((f, k) => { if (f >= lo && f <= hi) keep.push(k); });
    if (keep.length === 0) throw new InputError('out-of-range', '--from/--to', `a range that holds some of the file's frequencies (${formatQuantity(d.freqs[0], 'frequency')} – ${formatQuantity(d.freqs[d.freqs.length - 1], 'frequency')})`, 'none inside');
    if (s.points !== undefined || s.log) throw new UsageError('--points and --log apply to a design; a Touchstone file is shown at its own frequencies');
    const P = d.ports.length, m = 2 * P * P;
    const sub = new Float64Array(keep.length * m);
    keep.forEach((k, i) => sub.set(d.s.subarray(k * m, (k + 1) * m), i * m));
    d.freqs = Float64Array.from(keep.map((k) => d.freqs[k]));
    d.s = sub;
  }
  return { name: basename(file), response: d, input: 0, warnings: d.warnings, from: 'touchstone' };
}

const r6 = (x: number) => Number(x.toPrecision(12));

function toJson(l: Loaded, input: number) {
  const r = l.response, P = r.ports.length, F = r.freqs.length;
  const sRe: number[][][] = [], sIm: number[][][] = [];
  for (let k = 0; k < F; k++) {
    const re: number[][] = [], im: number[][] = [];
    for (let i = 0; i < P; i++) {
      const a: number[] = [], b: number[] = [];
      for (let j = 0; j < P; j++) { const t = 2 * ((k * P + i) * P + j); a.push(r.s[t]); b.push(r.s[t + 1]); }
      re.push(a); im.push(b);
    }
    sRe.push(re); sIm.push(im);
  }
  const arr = (x: Float64Array) => Array.from(x, r6);
  const outs = r.ports.map((_, i) => i).filter((i) => i !== input);
  return {
    app: `stripwright ${VERSION}`,
    source: l.from,
    name: l.name,
    ...(l.f0 !== undefined ? { f0: l.f0 } : {}),
    definition: 'power-wave S-parameters, real reference impedance per port',
    frequencies: Array.from(r.freqs),
    ports: r.ports,
    input: r.ports[input].name,
    s: { re: sRe, im: sIm },
    figures: {
      ports: r.ports.map((p, i) => ({ name: p.name, returnLossDb: arr(returnLoss(r, i)), vswr: arr(vswr(r, i)) })),
      paths: outs.map((j) => ({ from: r.ports[input].name, to: r.ports[j].name, magnitudeDb: arr(magnitudeDb(r, j, input)), phaseDeg: arr(phaseDeg(r, j, input)), groupDelayS: arr(groupDelay(r, j, input)) })),
      // Per-frequency pair series grow with the square of the outputs; past MAX_PAIR_SERIES only the worst values
      // (in `worst.pairs`) are given, and S itself still holds everything.
      pairs: pairsOf(outs).length > MAX_PAIR_SERIES ? [] : pairsOf(outs).map(([a, b]) => ({ a: r.ports[a].name, b: r.ports[b].name, isolationDb: arr(isolation(r, a, b)), amplitudeBalanceDb: arr(amplitudeBalance(r, input, a, b)), phaseBalanceDeg: arr(phaseBalance(r, input, a, b)) })),
      ...(pairsOf(outs).length > MAX_PAIR_SERIES ? { pairsOmitted: `${pairsOf(outs).length} output pairs: per-frequency series left out (see worst.pairs and s)` } : {}),
    },
    worst: summarize(r, input),
    warnings: [...l.warnings, ...r.warnings],
  };
}

const MAX_PAIR_SERIES = 120;

function pairsOf(outs: number[]): [number, number][] {
  const out: [number, number][] = [];
  for (let x = 0; x < outs.length; x++) for (let y = x + 1; y < outs.length; y++) out.push([outs[x], outs[y]]);
  return out;
}

const fq = (f: number) => formatQuantity(f, 'frequency', { digits: 5 });
const fix = (x: number, d: number) => (Math.abs(x) < 0.5 * 10 ** -d ? 0 : x).toFixed(d);
const db = (x: number) => (x <= -399 ? '  < -300' : x >= 399 ? '   > 300' : x.toFixed(2).padStart(8));

function table(l: Loaded, input: number): string {
  const r = l.response, F = r.freqs.length, P = r.ports.length;
  // Ports are shown as people know them (their labels); the summary is keyed by port name (id).
  const labels = new Map(r.ports.map((p) => [p.name, portLabel(p)]));
  const L = (name: string) => labels.get(name) ?? name;
  const lines: string[] = [];
  const spacing = F > 2 && Math.abs((r.freqs[2] - r.freqs[1]) - (r.freqs[1] - r.freqs[0])) > 1e-6 * r.freqs[1] ? 'logarithmic' : 'linear';
  lines.push(`${l.from === 'design' ? 'Design' : 'Touchstone file'} "${l.name}": ${F} point${F > 1 ? 's' : ''}, ${fq(r.freqs[0])} – ${fq(r.freqs[F - 1])}${F > 2 ? ` (${spacing})` : ''}`);
  const portText = r.ports.map((p, i) => `${portLabel(p)}${p.label ? ` [${p.name}]` : ''} (${p.zRef} Ω${i === input ? ', the input' : ''})`);
  lines.push(`Ports: ${portText.length > 9 ? `${portText.slice(0, 8).join(', ')}, … and ${portText.length - 8} more` : portText.join(', ')}`);
  lines.push('S-parameters: power waves, real reference per port. Return loss and isolation are positive dB (larger is better).');
  const s = summarize(r, input);
  lines.push('', 'Worst over the band');
  lines.push('  port        return loss dB   at             VSWR');
  // Many ports: the input and the worst matched others.
  const portRows = s.ports.length > 17 ? [s.ports[input], ...s.ports.filter((_, i) => i !== input).sort((a, b) => a.returnLoss.value - b.returnLoss.value).slice(0, 15)] : s.ports;
  for (const p of portRows) lines.push(`  ${L(p.name).padEnd(10)} ${db(p.returnLoss.value)}      ${fq(p.returnLoss.freq).padEnd(13)} ${p.vswr.value >= 1e11 ? '   (≥ |Γ| = 1)' : p.vswr.value.toFixed(3).padStart(8)}`);
  if (portRows.length < s.ports.length) lines.push(`  (the input and the ${portRows.length - 1} worst matched of ${s.ports.length - 1} other ports; use --json for all)`);
  if (s.paths.length) {
    lines.push(`  path from ${portLabel(r.ports[input])}   insertion loss dB (best … worst)${F > 2 ? '   group delay ns (min … max)' : ''}`);
    for (const p of s.paths.slice(0, 16)) {
      const il = `${db(p.insertionLoss.best.value)} … ${db(p.insertionLoss.worst.value).trim()}`;
      lines.push(`  → ${L(p.to).padEnd(10)} ${il.padEnd(18)}${F > 2 ? `      ${(p.groupDelay.min.value * 1e9).toFixed(4)} … ${(p.groupDelay.max.value * 1e9).toFixed(4)}` : ''}`);
    }
    if (s.paths.length > 16) lines.push(`  … and ${s.paths.length - 16} more paths (use --json for all)`);
  }
  if (s.pairs.length) {
    const shown = s.pairs.length > 12 ? [...s.pairs].sort((a, b) => Math.abs(b.phaseBalance.value) - Math.abs(a.phaseBalance.value)).slice(0, 12) : s.pairs;
    lines.push('  outputs        isolation dB   amplitude balance dB   phase balance °');
    for (const p of shown) lines.push(`  ${`${L(p.a)}/${L(p.b)}`.padEnd(14)} ${db(p.isolation.value)}       ${fix(p.amplitudeBalance.value, 3).padStart(8)}            ${fix(p.phaseBalance.value, 2).padStart(8)}`);
    if (s.pairs.length > shown.length) lines.push(`  (the ${shown.length} pairs of largest phase imbalance of ${s.pairs.length}; use --json for all)`);
  }
  if (l.f0 !== undefined) {
    const k = r.freqs.reduce((b, f, i) => (Math.abs(f - l.f0!) < Math.abs(r.freqs[b] - l.f0!) ? i : b), 0);
    lines.push('', `At ${fq(r.freqs[k])}${r.freqs[k] !== l.f0 ? ` (nearest point to f0 = ${fq(l.f0)})` : ' (f0)'}`);
    lines.push(`  port        |S| dB from ${portLabel(r.ports[input]).padEnd(8)} phase °    group delay ns`);
    for (let j = 0; j < Math.min(P, 17); j++) {
      const mag = magnitudeDb(r, j, input)[k], ph = phaseDeg(r, j, input)[k], gd = groupDelay(r, j, input)[k];
      lines.push(`  ${portLabel(r.ports[j]).padEnd(10)} ${db(mag)}   ${(((ph + 180) % 360 + 360) % 360 - 180).toFixed(2).padStart(9)}   ${F > 1 ? (gd * 1e9).toFixed(4).padStart(10) : '         -'}`);
    }
    if (P > 17) lines.push(`  … and ${P - 17} more ports (use --json for all)`);
  }
  return lines.join('\n');
}

/** Information notes (what the model leaves out, where), grouped so a feed with 63 tees says it once. */
function notes(ws: Warning[]): string {
  const info = ws.filter((w) => w.severity === 'info');
  if (info.length === 0) return '';
  const groups = new Map<string, string[]>();
  for (const w of info) {
    const m = /^(tee|cross|junction|step) (\S+): (.*)$/.exec(w.message);
    const key = m ? `${m[1]}|${m[3]}` : `|${w.message}`;
    const list = groups.get(key) ?? [];
    if (m) list.push(m[2]);
    groups.set(key, list);
  }
  const lines = ['Notes'];
  for (const [key, subjects] of groups) {
    const [kind, text] = [key.slice(0, key.indexOf('|')), key.slice(key.indexOf('|') + 1)];
    if (!kind) { lines.push(`  ${text}`); continue; }
    const shown = subjects.length > 6 ? `${subjects.slice(0, 6).join(', ')}, … (${subjects.length})` : subjects.join(', ');
    lines.push(`  ${kind}${subjects.length > 1 ? 's' : ''} ${shown}: ${text}`);
  }
  return lines.slice(0, 12).join('\n');
}

function comparisonJson(r: NetworkResponse, d: ResponseDifference) {
  const name = (i: number) => r.ports[i].name;
  return {
    frequencies: d.freqs.length,
    note: 'dB and phase differences count only where both |S| are above -30 dB',
    entries: d.entries.map((e) => ({ s: `S${e.i + 1}${e.j + 1}`, to: name(e.i), from: name(e.j), maxVector: e.vector, maxDb: e.db, maxDeg: e.deg })),
  };
}

function comparisonTable(r: NetworkResponse, d: ResponseDifference, file: string): string {
  const lines = [`Compared with ${file} at its ${d.freqs.length} frequencies (ports in order: ${r.ports.map((p, i) => `${i + 1}=${portLabel(p)}`).join(', ')})`];
  lines.push('  S      largest |ΔS|  at             Δ dB     Δ phase °   (dB and phase only where both |S| > −30 dB)');
  const shown = d.entries.length > 16 ? [...d.entries].sort((a, b) => b.vector.value - a.vector.value).slice(0, 16) : d.entries;
  for (const e of shown) {
    lines.push(`  S${e.i + 1}${e.j + 1}`.padEnd(9) + `${e.vector.value.toFixed(4).padStart(10)}    ${fq(e.vector.freq).padEnd(13)} ${e.db.value.toFixed(2).padStart(6)}   ${e.deg.value.toFixed(1).padStart(8)}`);
  }
  if (shown.length < d.entries.length) lines.push(`  (the ${shown.length} largest of ${d.entries.length}; use --json for all)`);
  return lines.join('\n');
}

/** The compared file as the design keeps it: its saved port map when the design holds a file of that name. */
function measuredRecord(doc: DesignDoc | undefined, name: string, touchstone: string, ports: number, r: NetworkResponse): MeasuredFile {
  const saved = doc?.measured?.find((m) => m.name === name);
  return { id: 'compare', name, touchstone, ports: saved?.ports ?? guessPortMap(ports, r.ports.map((p) => p.name)) };
}

/** Reads an input file (a design, or a Touchstone file by its .sNp extension) through the one text reader, or reports why not and returns null. */
async function readInput(path: string, shown: string, io: CliIo): Promise<string | null> {
  const touchstone = /\.s\d+p$/i.test(path);
  const r = await readInputText(path, shown, touchstone ? TOUCHSTONE_INPUT : DESIGN_TEXT, touchstone ? 'a Touchstone file (.sNp)' : 'a design file (.json)');
  if (r.ok) return r.text;
  io.err(`stripwright sweep: ${r.message}`);
  return null;
}

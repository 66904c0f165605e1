/**
 * `stripwright export FILE --format dxf|svg|gerber|drill|mask[,…] --out PATH`: writes fabrication files for a design.
 * The files come from the core's one pipeline (core/pipeline exportDesign), the same call the app's Outputs panel
 * makes: a design `build` refuses is refused here too (exit 1, nothing written). File I/O lives here: every target
 * is checked before anything is written (nothing is overwritten without --force), and each file is written
 * atomically by the CLI's one writer (cli/files.ts).
 */
import { parseArgs } from 'node:util';
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { basename, dirname, extname, join, resolve } from 'node:path';
import {
  InputError, initPolygons, MILLING_CAUTIONS, type MillingOptions, parseDesign, parseQuantity, EXPORT_LAYERS, type DesignDoc, type ExportGeometry, type Warning,
  DesignPipeline, exportDesign, exportBase, EXPORT_FORMATS, FORMAT_INFO, type ExportFile,
} from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { quantityOption } from '../numbers.ts';
import { DESIGN_TEXT, OutputError, readInputText, writeOutputFile } from '../files.ts';
import { explainErrno } from '../../electron/files/atomic-write.ts';
import { VERSION } from '../version.ts';

const FORMATS = EXPORT_FORMATS;
/** One pipeline per process: its stages are shared by --plan and the formats of one run. */
const pipeline = new DesignPipeline();

/** The formats part of the usage text, from the core's one table of formats. */
const formatHelp = EXPORT_FORMATS.map((f) => FORMAT_INFO[f].help.map((l, i) => `  ${i === 0 ? f.padEnd(9) : ' '.repeat(9)}${l}`).join('\n')).join('\n');

const usage = `Usage: stripwright export FILE --format FORMAT[,FORMAT…] --out PATH [options]

Writes fabrication files for the design FILE (a Stripwright design, .json).

Formats:
${formatHelp}

Options:
  --out PATH              where to write: a file for one output, a folder (created if missing) for several
  --force                 overwrite existing files (otherwise nothing is written when a target exists)
  --mirror                mirror left-right (all formats; usual for toner transfer and emulsion-down films)
  --bias LEN              etch bias per copper edge, e.g. 0.035mm (+ grows copper, − shrinks); all formats but gcode
  --origin board|design   (0,0) at the board's lower-left corner (default) or at the design origin
  --layers L[,L…]         layers for dxf/svg among: ${EXPORT_LAYERS.join(', ')}
  --tool LEN              isolation width override: adds isolation outlines offset by half of it (dxf/svg layer
                          'isolation'); without it, the layer 'isolation' takes the cut of the design's process
  --style filled|outline  svg: filled copper (default) or outlines only
  --dxf-version 2007|r12  dxf: AC1021 (the 2007 DXF) with LWPOLYLINE and $INSUNITS (default), or R12 POLYLINE for cutters
  --page a4|letter        mask page (default a4)
  --polarity positive|negative   mask polarity (default positive: copper black)

G-code options (defaults suit small desktop routers; X0 Y0 = the board's lower-left corner, Z0 = top of the copper):
  --units mm|inch         G21 (default) or G20
  --passes N              isolation passes around each copper island (1–10; default: as many as the process's
                          isolation clearance needs, at most 10, with a warning when it needs more)
  --overlap X             overlap of further passes, fraction of the cut (0.1–0.9, default 0.4)
  --direction climb|conventional   cutting direction with the spindle turning clockwise (default climb)
  --clear                 also remove all copper that is not part of the design (slow with a fine tool)
  --clear-overlap X       overlap of the clearing rings (0.5–0.9, default 0.5)
  --feed SPEED            isolation feed, e.g. 200mm/min (default); --plunge-feed SPEED (default 50mm/min)
  --spindle RPM           spindle speed (1000–60000, default 10000)
  --safe-height LEN       start, end and tool-change height (default 5mm); --travel-height LEN between cuts (default 1mm)
  --no-drill              no drill files; --drill-feed SPEED (default 60mm/min); --peck LEN (default 0.5mm, 0 = none)
  --breakthrough LEN      how far drills and the cutout go below the board (default 0.3mm)
  --max-drill LEN         largest drill on hand (default 3mm); larger holes are milled with the cutout tool
  --no-cutout             no cutout; --cutout-tool LEN end mill diameter (default 1mm); --cutout-feed SPEED (default 120mm/min)
  --step-down LEN         cutout depth per pass (default 0.4mm)
  --tabs N                holding tabs (0–16, default 4); --tab-width LEN (default 2mm); --tab-height LEN (default 0.6mm,
                          at most half the board unless given)
  --tool-change           write T… M6 at the start of each file
  --work-area W,H         the machine's travel, e.g. 300mm,180mm (default 200mm,150mm)
  --board-at X,Y          where the board's corner sits in the work area (default 5mm,5mm)
  --rapid SPEED           rapid speed for the time estimate (default 1000mm/min)
  --plan                  the mill-readiness check alone: print the tools, times, checks and widths as milled;
                          write nothing (no --format or --out needed); exit 1 when the export would be refused
  Cautions: glass-fibre dust (extraction, a suitable mask), eye and hearing protection, spindle guards; never leave the
  machine running unattended; follow the machine's manual and local rules.

Examples:
  stripwright export stub.json --format gcode --passes 3 --work-area 300mm,180mm --out mill/
  stripwright export wilkinson.json --format mask --mirror --bias 0.035mm --out wilkinson-mask.svg
  stripwright export array.json --format gerber,drill,dxf --tool 0.2mm --out fab/`;


export const exportCommand: CliCommand = {
  name: 'export',
  summary: 'Write DXF, SVG, Gerber X2, Excellon drill, a 1:1 photo mask or milling G-code for a design',
  usage,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({
      args: argv,
      allowPositionals: true,
      strict: true,
      options: {
        format: { type: 'string' }, out: { type: 'string' }, force: { type: 'boolean' }, mirror: { type: 'boolean' },
        bias: { type: 'string' }, origin: { type: 'string' }, layers: { type: 'string' }, tool: { type: 'string' },
        style: { type: 'string' }, page: { type: 'string' }, polarity: { type: 'string' }, 'dxf-version': { type: 'string' },
        ...MILL_FLAGS, plan: { type: 'boolean' },
      },
    });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the design FILE to export' : `give one design FILE, got ${positionals.length}`);
    if (values.plan) return planOnly(positionals[0], values as Record<string, string | boolean | undefined>, io);
    if (!values.format) throw new UsageError('give --format, e.g. --format gerber,drill');
    if (!values.out) throw new UsageError('give --out PATH (a file, or a folder when several files are written)');
    const formats = values.format.split(',').map((f) => f.trim().toLowerCase()).filter((f) => f !== '');
    for (const f of formats) if (!(FORMATS as readonly string[]).includes(f)) throw new UsageError(`unknown format '${f}': expected ${FORMATS.join(', ')}`);
    const choice = <T extends string>(flag: string, v: string | undefined, allowed: readonly T[]): T | undefined => {
      if (v === undefined) return undefined;
      if (!(allowed as readonly string[]).includes(v)) throw new UsageError(`--${flag} must be ${allowed.join(' or ')}, got '${v}'`);
      return v as T;
    };
    const origin = choice('origin', values.origin, ['board', 'design'] as const);
    const style = choice('style', values.style, ['filled', 'outline'] as const);
    const page = choice('page', values.page, ['a4', 'letter'] as const);
    const polarity = choice('polarity', values.polarity, ['positive', 'negative'] as const);
    const dxfVersion = choice('dxf-version', values['dxf-version'], ['2007', 'r12'] as const) ?? '2007';
    const layers = values.layers?.split(',').map((l) => l.trim()).filter((l) => l !== '');

    const file = resolve(io.cwd, positionals[0]);
    try {
      const bias = values.bias !== undefined ? parseQuantity(values.bias, 'length', '--bias') : 0;
      const tool = values.tool !== undefined ? parseQuantity(values.tool, 'length', '--tool') : undefined;
      const read = await readInputText(file, positionals[0], DESIGN_TEXT, 'a design file (.json)');
      if (!read.ok) { io.err(`stripwright export: ${read.message}`); return 1; }
      const parsed = parseDesign(read.text);
      if (!parsed.ok) {
        io.err(`stripwright export: ${positionals[0]} is not a valid design:`);
        for (const i of parsed.errors) io.err(`  ${i.message}`);
        return 1;
      }
      const milling = formats.includes('gcode') ? millingOptions(values as Record<string, string | boolean | undefined>) : null;
      if (!milling && Object.keys(MILL_FLAGS).some((k) => (values as Record<string, unknown>)[k] !== undefined)) {
        io.err('stripwright export: note: the G-code options only change --format gcode');
      }
      if ((layers !== undefined || tool !== undefined) && !formats.some((f) => f === 'dxf' || f === 'svg')) {
        io.err(`stripwright export: note: ${layers !== undefined ? '--layers' : '--tool'} only changes dxf and svg output`);
      }
      await initPolygons();
      const result = refusing(positionals[0], () => exportDesign(pipeline, parsed.doc, {
        formats, base: exportBase(basename(file, extname(file))), version: VERSION, mirror: values.mirror ?? false, bias,
        ...(tool !== undefined ? { tool } : {}), ...(layers ? { layers } : {}), ...(origin ? { origin } : {}),
        dxfVersion, ...(style ? { svgStyle: style } : {}), ...(page ? { maskPage: page } : {}), ...(polarity ? { maskPolarity: polarity } : {}),
        milling: milling ?? {},
      }));
      for (const w of parsed.warnings) io.err(`${w.severity === 'error' ? 'error' : 'warning'}: ${w.message}`);
      for (const m of result.messages) io.err(`${m.severity === 'info' ? 'note' : m.severity}: ${m.text}`);
      const outputs: ExportFile[] = result.files;
      if (outputs.length === 0) { io.err('stripwright export: nothing to write'); return 1; }
      const targets = placeOutputs(resolve(io.cwd, values.out), values.out, outputs);
      const existing = targets.filter((t) => existsSync(t.path));
      if (existing.length > 0 && !values.force) {
        io.err(`stripwright export: not overwriting ${existing.map((t) => t.path).join(', ')}; nothing was written (add --force to replace)`);
        return 1;
      }
      for (const t of targets) {
        await writeOutputFile(t.path, t.text);
        io.out(`wrote ${t.path}  (${t.what}, ${formatSize(Buffer.byteLength(t.text))})`);
      }
      return 0;
    } catch (e) {
      if (e instanceof Refused) { io.err(e.message); return 1; }
      if (e instanceof InputError) {
        const flag = FLAG_OF_FIELD[e.field];
        io.err(`stripwright export: ${flag ? `--${flag}: expected ${e.expected}, got ${e.got}${e.hint ? ` (${e.hint})` : ''}` : e.message}`);
        return 1;
      }
      if (e instanceof OutError || e instanceof OutputError) { io.err(`stripwright export: ${e.message}`); return 1; }
      throw e;
    }
  },
};

class OutError extends Error {}
/** A design the pipeline refuses (what `build` refuses): said in full, nothing written. */
class Refused extends Error {}

/** Runs the pipeline; its refusals of the design (not of an option) become one message that says why. */
function refusing<T>(given: string, run: () => T): T {
  try { return run(); } catch (e) {
    if (e instanceof InputError && e.code === 'impossible-layout' && e.field !== 'workArea') {
      throw new Refused(`stripwright export: ${given} cannot be exported as drawn; nothing was written.\n  ${e.field}: ${e.got}\n  fix: ${e.hint ?? e.expected}\n  (\`stripwright build ${given}\` lists every finding)`);
    }
    throw e;
  }
}

/** A shift with its sign, to 0.01 (a shift that rounds to zero shows as +0.00, never −0.00). */
function signed(x: number): string { const r = Math.round(x * 100) / 100; return `${r >= 0 ? '+' : '−'}${Math.abs(r).toFixed(2)}`; }

/** `--plan`: the milling plan and its checks, printed; nothing written. Exit 1 when the export would be refused. */
async function planOnly(given: string, values: Record<string, string | boolean | undefined>, io: CliIo): Promise<number> {
  const file = resolve(io.cwd, given);
  try {
    const options = millingOptions(values);
    // The one bounded text reader of every command (size limit, devices refused, UTF-8 checked, errors in words).
    const read = await readInputText(file, given, DESIGN_TEXT, 'a design file (.json)');
    if (!read.ok) { io.err(`stripwright export: ${read.message}`); return 1; }
    const parsed = parseDesign(read.text);
    if (!parsed.ok) { io.err(`stripwright export: ${given} is not a valid design:`); for (const i of parsed.errors) io.err(`  ${i.message}`); return 1; }
    await initPolygons();
    const plan = refusing(given, () => pipeline.plan(parsed.doc, options));
    const mm = (m: number) => (m * 1e3).toFixed(3);
    io.out(`Milling plan for ${basename(file)}: board ${mm(plan.size.width)} × ${mm(plan.size.height)} mm, about ${Math.ceil(plan.seconds / 60)} min in ${plan.programs.length} file(s)`);
    for (const p of plan.programs) io.out(`  T${p.tool.number}  ${p.tool.label}: ${p.operations.join(', ')}, ${mm(p.cutLength)} mm cutting, about ${Math.ceil(p.seconds / 60)} min`);
    io.out('Widths as milled (top / foot of the copper) and Z0 at f0:');
    for (const p of plan.milled.pieces) {
      io.out(`  ${p.id.padEnd(12)} drawn ${mm(p.drawnWidth)} mm → ${mm(p.topWidth)} / ${mm(p.footWidth)} mm, Z0 ${p.z0Drawn.toFixed(2)} → ${p.z0Milled.toFixed(2)} Ω (${p.joined ? 'joined to other copper' : `${signed(p.z0Shift)} Ω`})`);
    }
    const errors = plan.findings.filter((f) => f.severity === 'error');
    for (const f of plan.findings) io.out(`${f.severity === 'info' ? 'note' : f.severity}: ${f.message}${f.severity === 'error' ? ` (${f.fix})` : ''}`);
    io.out(errors.length ? `Not ready: the export would be refused (${errors.length} error${errors.length === 1 ? '' : 's'}).` : 'Ready to mill: every check passed.');
    io.err(MILLING_CAUTIONS.join(' '));
    return errors.length ? 1 : 0;
  } catch (e) {
    if (e instanceof Refused) { io.err(e.message); return 1; }
    if (e instanceof InputError) {
      const flag = FLAG_OF_FIELD[e.field];
      io.err(`stripwright export: ${flag ? `--${flag}: expected ${e.expected}, got ${e.got}${e.hint ? ` (${e.hint})` : ''}` : e.message}`);
      return 1;
    }
    throw e;
  }
}

/** G-code flags: option name in MillingOptions → flag, and how to read it. */
const MILL: Record<string, { field: keyof MillingOptions | 'workArea.width' | 'boardAt.x'; kind: 'length' | 'speed' | 'number' | 'flag' | 'pair' | 'text' }> = {
  units: { field: 'units', kind: 'text' }, passes: { field: 'passes', kind: 'number' }, overlap: { field: 'overlap', kind: 'number' },
  direction: { field: 'direction', kind: 'text' }, clear: { field: 'clear', kind: 'flag' }, 'clear-overlap': { field: 'clearOverlap', kind: 'number' },
  feed: { field: 'feed', kind: 'speed' }, 'plunge-feed': { field: 'plungeFeed', kind: 'speed' }, spindle: { field: 'spindleRpm', kind: 'number' },
  'safe-height': { field: 'safeHeight', kind: 'length' }, 'travel-height': { field: 'travelHeight', kind: 'length' },
  'no-drill': { field: 'drill', kind: 'flag' }, 'drill-feed': { field: 'drillFeed', kind: 'speed' }, peck: { field: 'peckDepth', kind: 'length' },
  breakthrough: { field: 'breakthrough', kind: 'length' }, 'max-drill': { field: 'maxDrill', kind: 'length' },
  'no-cutout': { field: 'cutout', kind: 'flag' }, 'cutout-tool': { field: 'cutoutTool', kind: 'length' }, 'cutout-feed': { field: 'cutoutFeed', kind: 'speed' },
  'step-down': { field: 'stepDown', kind: 'length' }, tabs: { field: 'tabs', kind: 'number' }, 'tab-width': { field: 'tabWidth', kind: 'length' },
  'tab-height': { field: 'tabHeight', kind: 'length' }, 'tool-change': { field: 'toolChange', kind: 'flag' },
  'work-area': { field: 'workArea.width', kind: 'pair' }, 'board-at': { field: 'boardAt.x', kind: 'pair' }, rapid: { field: 'rapidRate', kind: 'speed' },
};
const MILL_FLAGS = Object.fromEntries(Object.entries(MILL).map(([k, v]) => [k, { type: v.kind === 'flag' ? 'boolean' as const : 'string' as const }]));
const FLAG_OF_FIELD: Record<string, string> = Object.fromEntries([
  ...Object.entries(MILL).map(([k, v]) => [v.field, k]),
  ['workArea.height', 'work-area'], ['boardAt.y', 'board-at'], ['workArea', 'work-area'],
  // The pipeline's request fields (core/pipeline/request.ts) → the flags that set them.
  ['formats', 'format'], ['bias', 'bias'], ['tool', 'tool'], ['toolDiameter', 'tool'], ['layers', 'layers'], ['origin', 'origin'],
  ['dxfVersion', 'dxf-version'], ['svgStyle', 'style'], ['maskPage', 'page'], ['maskPolarity', 'polarity'],
]);

/** The G-code flags given, as MillingOptions (units parsed by core/units; ranges checked by the core). */
function millingOptions(values: Record<string, string | boolean | undefined>): Partial<MillingOptions> {
  const o: Record<string, unknown> = {};
  for (const [flag, { field, kind }] of Object.entries(MILL)) {
    const v = values[flag];
    if (v === undefined) continue;
    const text = String(v);
    const num = () => quantityOption(flag, text, 'ratio')!;
    switch (kind) {
      case 'flag': o[field] = flag.startsWith('no-') ? !v : v; break;
      case 'text': o[field] = text; break;
      case 'number': o[field] = num(); break;
      case 'length': o[field] = parseQuantity(text, 'length', `--${flag}`); break;
      case 'speed': o[field] = parseQuantity(text, 'speed', `--${flag}`); break;
      case 'pair': {
        const parts = text.split(',');
        if (parts.length !== 2) throw new UsageError(`--${flag} takes two lengths separated by a comma, e.g. 300mm,180mm; got '${text}'`);
        const [a, b] = parts.map((x) => parseQuantity(x.trim(), 'length', `--${flag}`)) as [number, number];
        if (flag === 'work-area') o.workArea = { width: a, height: b }; else o.boardAt = { x: a, y: b };
        break;
      }
    }
  }
  return o as Partial<MillingOptions>;
}

/** The board geometry of a design from the core pipeline (refuses what `build` cannot size or place). */
export function designToBoard(doc: DesignDoc): { geometry: ExportGeometry; warnings: Warning[] } {
  return { geometry: pipeline.board(doc), warnings: pipeline.sized(doc).warnings };
}

/** One output and --out not a folder: that file; otherwise files by name inside the --out folder. */
function placeOutputs(out: string, given: string, outputs: ExportFile[]): { path: string; text: string; what: string }[] {
  const isDir = existsSync(out) && statSync(out).isDirectory();
  const wantsDir = isDir || /[\\/]$/.test(given) || outputs.length > 1;
  if (!wantsDir) {
    if (!existsSync(dirname(out))) throw new OutError(`the folder of --out does not exist: ${dirname(out)}`);
    return [{ path: out, text: outputs[0].text, what: outputs[0].what }];
  }
  if (existsSync(out) && !isDir) throw new OutError(`--out ${given} is a file, but ${outputs.length} files are to be written: give a folder`);
  if (!isDir && !/[\\/]$/.test(given) && extname(out) !== '') {
    throw new OutError(`--out ${given} looks like a file name, but ${outputs.length} files are to be written (${outputs.map((o) => o.name).join(', ')}): give a folder, e.g. --out ${basename(out, extname(out))}/`);
  }
  try { mkdirSync(out, { recursive: true }); } catch (e) {
    throw new OutError(`cannot make the folder ${given}: ${explainErrno(e as NodeJS.ErrnoException)}`);
  }
  return outputs.map((o) => ({ path: join(out, o.name), text: o.text, what: o.what }));
}

function formatSize(n: number): string {
  return n < 1024 ? `${n} B` : `${(n / 1024).toFixed(1)} kB`;
}

/**
 * `stripwright block list`, `stripwright block KIND --help`, and
 * `stripwright block KIND [options] --f0 F (--er E --h H [--t T --tand D] | --preset NAME) --out FILE.json`
 * (a complete design that build, sweep and export take as is), or `--into DESIGN.json --at X,Y --out NEW.json` (the
 * block added to a copy of a design, made with that design's laminate, process and f0). A thin face over the core's
 * block registry (makeBlockDesign, placeBlock); the options of a block are its declared parameters.
 */
import { parseArgs } from 'node:util';
import { statSync } from 'node:fs';
import { resolve } from 'node:path';
import {
  BLOCKS, bandChangeWords, nameFromBlock, blockDef, defaultText, makeBlockDesign, optionName, parseDesign, parseQuantity, placeBlock, rangeText, serializeDesign,
  InputError, UNIT_WORDS, PROCESS_DEFAULT, type FabProcess, type ParamDef,
} from '../../core/index.ts';
import { DESIGN_TEXT, TOUCHSTONE_INPUT, readInputText, writeOutputFile } from '../files.ts';
import { UsageError, type CliIo } from '../registry.ts';
import { substrateOf } from './line.ts';
import { legacyUsage } from './block.ts';

const COMMON = {
  f0: { type: 'string' }, preset: { type: 'string' }, er: { type: 'string' }, h: { type: 'string' }, t: { type: 'string' },
  tand: { type: 'string' }, sigma: { type: 'string' }, rough: { type: 'string' }, 'min-gap': { type: 'string' },
  'end-mill': { type: 'string' }, clearance: { type: 'string' }, junctions: { type: 'string' }, sizing: { type: 'string' }, name: { type: 'string' }, into: { type: 'string' },
  at: { type: 'string' }, out: { type: 'string' }, force: { type: 'boolean' }, help: { type: 'boolean' },
} as const;

/** An option that is absent or one of a few words; anything else is refused naming the choices. */
function optionalChoice<T extends string>(value: unknown, field: string, choices: readonly [T, T], hint?: string): T | undefined {
  if (value === undefined) return undefined;
  if (choices.includes(value as T)) return value as T;
  throw new InputError('bad-choice', field, `${choices[0]} or ${choices[1]}`, String(value), hint);
}

export function blockList(): string {
  const w = Math.max(...BLOCKS.map((b) => b.kind.length));
  return ['Blocks (stripwright block KIND --help for the options of one):', ...BLOCKS.map((b) => `  ${b.kind.padEnd(w)}  ${b.summary}`),
    `  ${'coupler'.padEnd(w)}  coupled-line directional coupler (stripwright block --help)`, `  ${'bandpass'.padEnd(w)}  edge-coupled band-pass filter (stripwright block --help)`].join('\n');
}

function paramLine(p: ParamDef): string {
  const unit = 'unit' in p ? UNIT_WORDS[p.unit] : '';
  const range = rangeText(p), def = defaultText(p);
  const what = p.type === 'choice' ? `one of ${p.choices.join('|')}` : p.type === 'list' ? `comma-separated list${unit ? ` in ${unit}` : ''}` : p.type === 'complex' ? 'complex ohms, e.g. 30-20j' : p.type === 'text' ? 'a file' : range;
  return `  --${optionName(p.name)} ${p.type === 'text' ? 'FILE' : 'VALUE'}`.padEnd(28) + `${p.meaning} (${what}${def ? `; default ${def}` : ''})`;
}

export function kindUsage(kind: string): string {
  const b = blockDef(kind);
  return [`Usage: stripwright block ${kind} [options] --f0 FREQ (--er N --h LEN [--t LEN --tand N] | --preset NAME) --out FILE.json`,
    `       stripwright block ${kind} [options] --into DESIGN.json --at X,Y --out NEW.json`, '',
    `${b.title}: ${b.summary}.`, `Design equations: ${b.source}.`, '', 'Options:', ...b.params.map(paramLine), '',
    'Design (for --out without --into):',
    '  --f0 FREQ                 design frequency, e.g. 2.45GHz (a filter\'s cut-off may equal it)',
    '  --preset NAME | --er N --h LEN [--t LEN] [--tand N] [--sigma S] [--rough LEN]   laminate, as for \'line\'',
    '  --min-gap LEN | --end-mill LEN   the process (default: the new-design 30° V-bit)',
    '  --clearance LEN       milled: bare laminate the isolation passes open beside the copper (default 0.7 mm); lines sized as made see it',
    '  --junctions modelled|ideal      junction models in sizing and the sweep (default modelled)',
    '  --sizing microstrip|as-made     size the lines as plain microstrip (the default; copper cleared beside the',
    '                            lines) or as milled (side copper at the cut, from field solutions)',
    '  --name TEXT               design name',
    '  --into DESIGN.json --at X,Y     add the block to a copy of DESIGN (X,Y with units, e.g. 40mm,0mm)',
    '  --out FILE.json           where to write (required); --force replaces an existing file'].join('\n');
}

export function registryUsage(): string {
  return [`${blockList()}`, '', 'Usage: stripwright block list', '       stripwright block KIND --help', '       stripwright block KIND [options] --f0 FREQ --er N --h LEN --out FILE.json',
    '       stripwright block KIND [options] --into DESIGN.json --at X,Y --out NEW.json', '',
    'Example: stripwright block corporate --outputs 4 --f0 2.45GHz --er 4.4 --h 1.6mm --out feed.json', '', legacyUsage].join('\n');
}

export async function runRegistered(kind: string, argv: string[], io: CliIo): Promise<number> {
  const def = BLOCKS.find((b) => b.kind === kind);
  if (!def) throw new UsageError(`unknown block '${kind}'; see 'stripwright block list'`);
  const own = Object.fromEntries(def.params.map((p) => [optionName(p.name), { type: 'string' as const }]));
  const { values } = parseArgs({ args: argv, options: { ...COMMON, ...own }, strict: true, allowPositionals: false });
  const v = values as Record<string, string | boolean | undefined>;
  if (v.help) { io.out(kindUsage(kind)); return 0; }
  if (typeof v.out !== 'string') throw new UsageError('give --out FILE.json for the design');
  if ((v.into === undefined) !== (v.at === undefined)) throw new UsageError('give --into DESIGN.json and --at X,Y together');
  if (v.into === undefined && v.f0 === undefined) throw new UsageError('give the design frequency --f0');
  const target = resolve(io.cwd, v.out);
  if (!v.force) {
    try { statSync(target); io.err(`stripwright block: ${v.out} exists; choose another --out or add --force to replace it`); return 1; } catch { /* free */ }
  }
  try {
    const raw: Record<string, unknown> = {};
    for (const p of def.params) {
      const given = v[optionName(p.name)];
      if (typeof given !== 'string') continue;
      if (p.type === 'text') {
        const read = await readInputText(resolve(io.cwd, given), given, TOUCHSTONE_INPUT, 'a one-port Touchstone file (.s1p)');
        if (!read.ok) { io.err(`stripwright block: ${read.message}`); return 1; }
        raw[p.name] = read.text;
      } else raw[p.name] = given;
    }
    let doc, band: string | null = null;
    if (typeof v.into === 'string') {
      const read = await readInputText(resolve(io.cwd, v.into), v.into, DESIGN_TEXT, 'a design file (.json)');
      if (!read.ok) { io.err(`stripwright block: ${read.message}`); return 1; }
      const parsed = parseDesign(read.text);
      if (!parsed.ok) { io.err(`stripwright block: ${v.into}: ${parsed.errors.map((e) => e.message).join('; ')}`); return 1; }
      const [x, y] = String(v.at).split(',');
      if (x === undefined || y === undefined) throw new UsageError('give --at as X,Y, e.g. 40mm,0mm');
      doc = placeBlock(parsed.doc, kind, raw, { x: parseQuantity(x, 'length', 'at.x'), y: parseQuantity(y, 'length', 'at.y') });
      band = bandChangeWords(parsed.doc, doc);
      // An empty design nobody has named takes the block's name, as in the app.
      const named = nameFromBlock(parsed.doc, def.title);
      if (named) doc = { ...doc, name: named };
    } else {
      const substrate = substrateOf({ preset: v.preset as string | undefined ?? (v.er === undefined && v.h === undefined ? 'glass-epoxy' : undefined), er: v.er as string | undefined, h: v.h as string | undefined, t: v.t as string | undefined, tand: v.tand as string | undefined, sigma: v.sigma as string | undefined, rough: v.rough as string | undefined });
      const process: FabProcess | undefined = typeof v['min-gap'] === 'string' ? { kind: 'etch', edgeBias: 0, minFeature: parseQuantity(v['min-gap'], 'length', 'min-gap') }
        : typeof v['end-mill'] === 'string' ? { kind: 'end-mill', toolDiameter: parseQuantity(v['end-mill'], 'length', 'end-mill'), depth: 0.1e-3 } : undefined;
      if (typeof v.clearance === 'string' && process?.kind === 'etch') throw new UsageError('--clearance is the isolation of a milled process; an etched one (--min-gap) has none');
      const clearance = typeof v.clearance === 'string' ? parseQuantity(v.clearance, 'length', 'clearance') : undefined;
      if (clearance !== undefined && !(clearance > 0 && clearance <= 5e-3)) throw new InputError('out-of-range', 'clearance', 'an isolation clearance above 0 and at most 5 mm', String(v.clearance), 'e.g. --clearance 0.5mm');
      const cleared: FabProcess | undefined = clearance !== undefined
        ? { ...(process ?? PROCESS_DEFAULT) as Exclude<FabProcess, { kind: 'etch' }>, clearance } : process;
      const junctions = optionalChoice(v.junctions, 'junctions', ['modelled', 'ideal'] as const);
      const sizing = optionalChoice(v.sizing, 'sizing', ['as-made', 'microstrip'] as const, 'use --sizing microstrip when the copper beside the lines is cleared');
      doc = makeBlockDesign(kind, raw, { f0: parseQuantity(String(v.f0), 'frequency', 'f0'), substrate, ...(cleared ? { process: cleared } : {}), ...(junctions ? { junctions } : {}), ...(sizing ? { asMade: { sizing, sideCopper: 'stitched' as const } } : {}), ...(typeof v.name === 'string' ? { name: v.name } : {}) });
    }
    await writeOutputFile(target, serializeDesign(doc));
    const placed = doc.blocks![doc.blocks!.length - 1]!;
    io.out(`${typeof v.into === 'string' ? `${def.title} added as ${placed.id} to a copy of ${v.into}` : doc.name}\n${typeof v.into === 'string' ? (band ? `${band[0]!.toUpperCase()}${band.slice(1)}.\n` : '') : `${doc.notes ?? ''}\n`}written to ${v.out}; next: stripwright build ${v.out}`);
    return 0;
  } catch (e) {
    if (e instanceof UsageError) throw e;
    if (e instanceof InputError) { io.err(`stripwright block: ${e.message}`); return 1; }
    throw e;
  }
}

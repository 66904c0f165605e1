/**
 * `stripwright block KIND [options] --out FILE.json`: writes the complete design of a block (a coupled-line coupler or
 * an edge-coupled band-pass filter) that `build`, `sweep` and `export` take as is. A thin face over core buildBlock.
 */
import { parseArgs } from 'node:util';
import { statSync } from 'node:fs';
import { resolve } from 'node:path';
import { BLOCKS, buildBlock, serializeDesign, parseQuantity, InputError, type BlockSpec, type FabProcess } from '../../core/index.ts';
import { writeOutputFile } from '../files.ts';
import { blockList, kindUsage, registryUsage, runRegistered } from './block-registry.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { countOption } from '../numbers.ts';
import { substrateOf } from './line.ts';

export const legacyUsage = `Usage: stripwright block coupler --coupling-db DB --f0 FREQ [substrate] [options] --out FILE.json
       stripwright block bandpass --order N --f0 FREQ --bw FRACTION [--ripple-db DB] [substrate] [options] --out FILE.json

Writes a complete design (ports, lines, coupled sections, open ends) sized for the substrate and checked against the
process's narrowest gap. Take it on with build, sweep and export.

Blocks:
  coupler               coupled-line directional coupler, one quarter-wave section at f0 (ports in, through,
                        coupled, isolated)
  bandpass              edge-coupled half-wave-resonator filter; maximally flat, or equal ripple with --ripple-db

Options:
  --coupling-db DB      coupler: coupling at f0, e.g. 10 or 20
  --order N             bandpass: number of resonators (1–9)
  --bw FRACTION         bandpass: fractional bandwidth, e.g. 0.1 for 10 % (or 10%)
  --ripple-db DB        bandpass: pass-band ripple for an equal-ripple response (omit for maximally flat)
  --f0 FREQ             centre frequency, e.g. 2.45GHz
  --z0 OHMS             port impedance (default 50)
  --feed LEN            length of the port lines (default 3·h, at least 2 mm)
  --preset NAME | --er N --h LEN [--t LEN] [--tand N] [--sigma S] [--rough LEN]   substrate, as for 'line'
  --min-gap LEN         the process is etching with this smallest feature (default: the new-design 30° V-bit)
  --end-mill LEN        the process is milling with an end mill of this diameter
  --name TEXT           design name
  --out FILE.json       where to write the design (required); --force replaces an existing file

Examples:
  stripwright block coupler --coupling-db 10 --f0 2.45GHz --er 3.66 --h 0.508mm --min-gap 0.1mm --out coupler.json
  stripwright block bandpass --order 5 --f0 2.45GHz --bw 0.1 --ripple-db 0.5 --er 3.66 --h 0.508mm --out bpf.json`;

const OPTIONS = {
  'coupling-db': { type: 'string' }, order: { type: 'string' }, bw: { type: 'string' }, 'ripple-db': { type: 'string' },
  f0: { type: 'string' }, z0: { type: 'string' }, feed: { type: 'string' }, name: { type: 'string' },
  preset: { type: 'string' }, er: { type: 'string' }, h: { type: 'string' }, t: { type: 'string' }, tand: { type: 'string' },
  sigma: { type: 'string' }, rough: { type: 'string' }, 'min-gap': { type: 'string' }, 'end-mill': { type: 'string' },
  out: { type: 'string' }, force: { type: 'boolean' },
} as const;

function fraction(text: string): number {
  const t = text.trim();
  if (t.endsWith('%')) return parseQuantity(t.slice(0, -1), 'ratio', 'bw') / 100;
  return parseQuantity(t, 'ratio', 'bw');
}

export const blockCommand: CliCommand = {
  name: 'block',
  summary: 'Write the design of a block made from a spec (feed, divider, hybrid, transformer, stub match, filter, launch, coupler)',
  usage: registryUsage(),
  usageFor(argv) {
    const kind = argv.find((a) => !a.startsWith('-'));
    return kind && BLOCKS.some((b) => b.kind === kind) ? kindUsage(kind) : registryUsage();
  },
  async run(argv: string[], io: CliIo): Promise<number> {
    const kind = argv.find((a) => !a.startsWith('-'));
    if (kind === 'list') { io.out(blockList()); return 0; }
    if (kind !== undefined && kind !== 'coupler' && kind !== 'bandpass') return runRegistered(kind, argv.filter((a) => a !== kind), io);
    return legacyRun(argv, io);
  },
};

async function legacyRun(argv: string[], io: CliIo): Promise<number> {
  {
    const { values, positionals } = parseArgs({ args: argv, options: OPTIONS, strict: true, allowPositionals: true });
    const kind = positionals[0];
    if (positionals.length !== 1 || (kind !== 'coupler' && kind !== 'bandpass')) throw new UsageError('name one block: coupler or bandpass');
    if (values.out === undefined) throw new UsageError('give --out FILE.json for the design');
    if (values.f0 === undefined) throw new UsageError('give the centre frequency --f0');
    if (values['min-gap'] !== undefined && values['end-mill'] !== undefined) throw new UsageError('give --min-gap or --end-mill, not both');
    const target = resolve(io.cwd, values.out);
    if (!values.force) {
      try { statSync(target); io.err(`stripwright block: ${values.out} exists; choose another --out or add --force to replace it`); return 1; } catch { /* free */ }
    }
    try {
      const substrate = substrateOf({ preset: values.preset ?? (values.er === undefined && values.h === undefined ? 'glass-epoxy' : undefined), er: values.er, h: values.h, t: values.t, tand: values.tand, sigma: values.sigma, rough: values.rough });
      const process: FabProcess | undefined = values['min-gap'] !== undefined
        ? { kind: 'etch', edgeBias: 0, minFeature: parseQuantity(values['min-gap'], 'length', 'min-gap') }
        : values['end-mill'] !== undefined ? { kind: 'end-mill', toolDiameter: parseQuantity(values['end-mill'], 'length', 'end-mill'), depth: 0.1e-3 } : undefined;
      const base = {
        f0: parseQuantity(values.f0, 'frequency', 'f0'), substrate,
        ...(process ? { process } : {}),
        ...(values.z0 !== undefined ? { z0: parseQuantity(values.z0, 'impedance', 'z0') } : {}),
        ...(values.feed !== undefined ? { feedLength: parseQuantity(values.feed, 'length', 'feed') } : {}),
        ...(values.name !== undefined ? { name: values.name } : {}),
      };
      let spec: BlockSpec;
      if (kind === 'coupler') {
        if (values['coupling-db'] === undefined) throw new UsageError('the coupler needs --coupling-db');
        spec = { kind, ...base, couplingDb: Math.abs(parseQuantity(values['coupling-db'], 'db', 'coupling-db')) };
      } else {
        if (values.order === undefined || values.bw === undefined) throw new UsageError('the band-pass filter needs --order and --bw');
        const order = countOption('order', values.order, 1, 99)!;
        spec = { kind, ...base, order, bw: fraction(values.bw), ...(values['ripple-db'] !== undefined ? { rippleDb: Math.abs(parseQuantity(values['ripple-db'], 'db', 'ripple-db')) } : {}) };
      }
      const doc = buildBlock(spec);
      await writeOutputFile(target, serializeDesign(doc));
      io.out(`${doc.name}\n${doc.notes ?? ''}\nwritten to ${values.out}; next: stripwright sweep ${values.out}`);
      return 0;
    } catch (e) {
      if (e instanceof UsageError) throw e;
      if (e instanceof InputError) { io.err(`stripwright block: ${e.message}`); return 1; }
      io.err(`stripwright block: ${(e as Error).message}`);
      return 1;
    }
  }
}

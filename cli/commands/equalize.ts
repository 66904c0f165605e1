/**
 * `stripwright equalize DESIGN --group ID|NAME [--pieces A,B] [--style auto|serpentine|trombone] [--gap MM] --out FILE`:
 * lengthens the shorter paths of a phase group with meanders (core/network/equalize `equalizeGroup`, the function
 * behind the path ledger's button) and writes the equalized design.
 */
import { parseArgs } from 'node:util';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { InputError, parseDesign, serializeDesign, equalizeGroup, type MeanderStyle } from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { writeOutputFile } from '../files.ts';

const USAGE = `Usage: stripwright equalize DESIGN --group ID|NAME [--pieces A,B,...] [--style auto|serpentine|trombone] [--gap MM | --coupling-limit DB] [--no-coupling] --out FILE

Lengthens the shorter paths of a phase group of DESIGN with meanders until all have the same electrical length at
f0 (or the offsets the group asks for), and writes the result to FILE. Meanders go on straight runs drawn to length
(the pieces given, or as few as will do, nearest the group's start), inside the board outline, clear of keep-outs
and other copper; their legs keep at least the gap apart (default 3 substrate heights), their corners are mitered
and compensated, and their legs' coupling is counted in their electrical length. Nothing else moves. An equal-phase
group is also checked in the sweep at the band's start, f0 and stop: when the meanders the tool chose leave more
than 1° there (lines mismatched at both ends reflect off f0), they move to the port leads matched to their ports.

Options:
  --group ID|NAME   the phase group (its id or name)
  --pieces A,B      segment ids that may carry meanders (default: the tool chooses)
  --style S         auto (default: fewest bumps that fit), serpentine (2 or more bumps) or trombone (one U)
  --gap MM          least edge gap between legs and to other copper, mm (default 3h)
  --coupling-limit DB  instead of --gap: the most coupling neighbouring legs may have, dB (e.g. -30); the gap is
                    the least (at least 3h) that keeps it there
  --no-coupling     do not count the legs' coupling (for comparison)
  --out FILE        where to write the equalized design

Exit status: 0 written; 1 the design is invalid or there is no room (the message says how much is missing);
2 a bad command line.

Example:
  stripwright equalize feed.json --group outputs --out feed-equal.json`;

const STYLES: MeanderStyle[] = ['auto', 'serpentine', 'trombone'];

export const equalizeCommand: CliCommand = {
  name: 'equalize',
  summary: 'Lengthen the shorter paths of a phase group with meanders so their phases match',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({
      args: argv, allowPositionals: true, strict: true,
      options: { group: { type: 'string' }, pieces: { type: 'string' }, style: { type: 'string' }, gap: { type: 'string' }, 'coupling-limit': { type: 'string' }, 'no-coupling': { type: 'boolean' }, out: { type: 'string' } },
    });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the DESIGN file' : `give one DESIGN file, got ${positionals.length}`);
    if (!values.group) throw new UsageError('give the phase group with --group ID|NAME');
    if (!values.out) throw new UsageError('give the output file with --out FILE');
    const style = (values.style ?? 'auto') as MeanderStyle;
    if (!STYLES.includes(style)) throw new UsageError(`--style expects one of ${STYLES.join(', ')}, got '${values.style}'`);
    let gap: number | undefined;
    if (values.gap !== undefined) {
      const mm = Number(values.gap);
      if (!Number.isFinite(mm) || mm <= 0 || mm > 100) throw new UsageError(`--gap expects a gap in mm above 0 and at most 100, got '${values.gap}'`);
      gap = mm * 1e-3;
    }
    let couplingLimitDb: number | undefined;
    if (values['coupling-limit'] !== undefined) {
      if (gap !== undefined) throw new UsageError('give --gap or --coupling-limit, not both');
      couplingLimitDb = Number(values['coupling-limit']);
      if (!Number.isFinite(couplingLimitDb) || couplingLimitDb >= 0) throw new UsageError(`--coupling-limit expects a coupling below 0 dB, e.g. -30, got '${values['coupling-limit']}'`);
    }
    const name = positionals[0]!;
    let src: string;
    try { src = readFileSync(resolve(io.cwd, name), 'utf8'); } catch (e) {
      io.err(`stripwright equalize: cannot read ${name}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`);
      return 1;
    }
    const parsed = parseDesign(src, { complete: true });
    if (!parsed.ok) {
      io.err(`stripwright equalize: ${name} is not a valid design:`);
      for (const i of parsed.errors) io.err(`  ${i.message}`);
      return 1;
    }
    try {
      const r = equalizeGroup(parsed.doc, {
        group: values.group, style, ...(gap !== undefined ? { gap } : {}), ...(couplingLimitDb !== undefined ? { couplingLimitDb } : {}), ...(values['no-coupling'] ? { coupling: false } : {}),
        ...(values.pieces ? { pieces: values.pieces.split(',').map((x) => x.trim()).filter(Boolean) } : {}),
      });
      await writeOutputFile(resolve(io.cwd, values.out), serializeDesign(r.doc));
      io.out(`${r.group.name}: ${r.meanders.length} meander(s); spread at f0 ${r.spreadDeg.toFixed(2)}° on the ledger (the legs' coupling counted), at the band edges ${r.bandSpreadDeg[0].toFixed(2)}° / ${r.bandSpreadDeg[1].toFixed(2)}°${r.group.offsetsDeg ? ' (the band-edge error the length offsets imply)' : ''}`);
      if (r.sweepSpreadDeg) io.out(`  the sweep's S21 phase spread: ${r.sweepSpreadDeg.map((x) => x.toFixed(2)).join(' / ')}° at band start / f0 / stop`);
      for (const m of r.meanders) {
        const shape = m.shape.kind === 'serpentine' ? `${m.shape.bumps === 1 ? 'trombone' : `serpentine of ${m.shape.bumps} bumps`}, legs ${(m.shape.height * 1e3).toFixed(2)} mm` : `dogleg ${(m.shape.height * 1e3).toFixed(2)} mm high`;
        io.out(`  ${m.piece}: +${m.addedDeg.toFixed(2)}° (${(m.extraLength * 1e3).toFixed(2)} mm), ${shape}; legs' coupling ${m.couplingDeg[1].toFixed(2)}°`);
      }
      for (const w of r.warnings) io.out(`note: ${w.message}`);
      io.out(`wrote ${values.out}`);
      return 0;
    } catch (e) {
      if (e instanceof InputError) { io.err(`stripwright equalize: ${name}: ${e.message}`); return 1; }
      throw e;
    }
  },
};

/**
 * `stripwright report`: the design report as a printable PDF, through the core's one `designReport` (the app's
 * *Write report* command calls the same function, so both write the same bytes for the same design and version).
 */
import { parseArgs } from 'node:util';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { InputError, initPolygons, parseDesign, designReport } from '../../core/index.ts';
import { DESIGN_TEXT, OutputError, readInputText, writeOutputFile } from '../files.ts';
import { reportFont } from '../font.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { VERSION } from '../version.ts';

const USAGE = `Usage: stripwright report DESIGN.json --out FILE.pdf [--force]

Writes a printable A4 PDF of the design: the board (full size when it fits the page, otherwise fitted, always with a
scale bar), the laminate and process, every piece (Z0, width, length, electrical length, end and junction
corrections), the path ledger, the shop-check findings, the simulated response (|S|, phase, Smith chart), the
models used with their published sources and validity, what is not modelled, and the usual cautions.
The file carries no date: the same design and version give the same bytes (the design hash is in its metadata).

  --out FILE.pdf   where to write (required)
  --force          replace an existing file

Example:
  stripwright report assets/examples/demo.json --out demo-report.pdf`;

export const reportCommand: CliCommand = {
  name: 'report',
  summary: 'a printable PDF report of a design (board, tables, response, sources, cautions)',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({ args: argv, options: { out: { type: 'string' }, force: { type: 'boolean' } }, allowPositionals: true, strict: true });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the design file to report on' : `one design at a time, got ${positionals.length}`);
    if (!values.out) throw new UsageError('give the PDF to write with --out FILE.pdf');
    if (!/\.pdf$/i.test(values.out)) throw new UsageError(`--out should end in .pdf, not '${values.out}'`);
    const out = resolve(io.cwd, values.out);
    if (existsSync(out) && !values.force) { io.err(`stripwright report: not replacing ${out}; nothing was written (add --force to replace it)`); return 1; }
    const read = await readInputText(resolve(io.cwd, positionals[0]!), positionals[0]!, DESIGN_TEXT, 'a design file (.json)');
    if (!read.ok) { io.err(`stripwright report: ${read.message}`); return 1; }
    const parsed = parseDesign(read.text);
    if (!parsed.ok) {
      io.err(`stripwright report: ${positionals[0]} is not a valid design:`);
      for (const i of parsed.errors) io.err(`  ${i.message}`);
      return 1;
    }
    try {
      await initPolygons();
      const r = await designReport(parsed.doc, { font: await reportFont(), app: `stripwright ${VERSION}` });
      await writeOutputFile(out, r.pdf);
      io.out(`wrote ${out}  (${r.pages} pages, A4${r.boardScale === null ? ', no board: the design cannot be sized as drawn' : r.boardScale === 1 ? ', board at full size' : `, board scaled 1:${(1 / r.boardScale).toFixed(2)}`})`);
      return 0;
    } catch (e) {
      if (e instanceof InputError || e instanceof OutputError) { io.err(`stripwright report: ${e.message}`); return 1; }
      throw e;
    }
  },
};
